import fc from 'fast-check';
import { bignumber, divide, multiply, round, type BigNumber } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { precisionFor } from '../../src/shared/domain/provisions/precision';
import {
  CUBIC_METRES_PER_CY,
  scaleTicketPay,
  truckTicketPay,
  type ScaleTicketInput,
  type TruckTicketInput,
} from '../../src/shared/domain/provisions/ticket-pay';
import type { RegisteredTruck } from '../../src/shared/domain/provisions/truck-measure';

const register = new Map<string, RegisteredTruck>([
  ['T-12', { id: 'T-12', bedVolumeCy: 14.27 }],
  ['T-7', { id: 'T-7', bedVolumeCy: 12.5 }],
]);
const load = (id: string, truckLabel: string, loadVolumeCy: number | null = null): TruckTicketInput => ({
  id,
  truckLabel,
  loadVolumeCy,
  date: '2026-10-05',
  bidItemId: 'item',
});

describe('truck measure pay quantity (a state DOT construction manual, section 109.11: 0.01 CY computed, 0.1 CY paid)', () => {
  const tickets = [
    load('a', 'T-12'),
    load('b', 't-12'),
    load('c', 'T-7', 12.38),
    load('d', 'T-99'),
    load('e', 'T-7', 13.1),
  ];

  it('pays 14.27 + 14.27 + 12.38 = 40.92 CY as 40.9 CY and holds the unregistered and overfull loads (hand-worked)', () => {
    const pay = truckTicketPay(tickets, register, 'CY', precisionFor('CY'));
    expect(pay).toEqual({
      quantity: 40.9,
      measuredQuantity: 40.92,
      paidIds: ['a', 'b', 'c'],
      held: [
        {
          kind: 'truck',
          ticketId: 'd',
          label: 'T-99',
          date: '2026-10-05',
          bidItemId: 'item',
          reasons: ['unregistered_truck'],
        },
        {
          kind: 'truck',
          ticketId: 'e',
          label: 'T-7',
          date: '2026-10-05',
          bidItemId: 'item',
          reasons: ['over_capacity'],
        },
      ],
    });
  });

  it('rounds the 0.01 sum half away from zero: 12.30 + 12.25 = 24.55 pays 24.6 CY (hand-worked)', () => {
    const tie = truckTicketPay([load('a', 'T-7', 12.3), load('b', 'T-7', 12.25)], register, 'CY', precisionFor('CY'));
    expect(tie).toMatchObject({ measuredQuantity: 24.55, quantity: 24.6 });
  });

  it("follows the profile's pay decimals: paid to whole CY, 40.92 measured to 40.9 pays 41 (hand-worked)", () => {
    expect(truckTicketPay(tickets, register, 'CY', precisionFor('CY', 0))).toMatchObject({
      measuredQuantity: 40.9,
      quantity: 41,
    });
  });

  it('converts to cubic metres with 1 yd = 0.9144 m exactly: 40.92 CY = 31.2856... m3, measured 31.29, paid 31.3', () => {
    const exact = multiply(bignumber('40.92'), bignumber('0.764554857984')) as BigNumber;
    expect(Number(round(exact, 2).toString())).toBe(31.29);
    const yd = bignumber('0.9144');
    expect(Number((multiply(multiply(yd, yd), yd) as BigNumber).toString())).toBe(CUBIC_METRES_PER_CY);
    expect(truckTicketPay(tickets, register, 'm3', precisionFor('m3'))).toMatchObject({
      measuredQuantity: 31.29,
      quantity: 31.3,
    });
  });

  it('holds every ticket of an item paid in a unit loads cannot be converted to (LF), with that reason', () => {
    const pay = truckTicketPay([load('a', 'T-12')], register, 'LF', precisionFor('LF'));
    expect(pay.quantity).toBe(0);
    expect(pay.held[0]!.reasons).toEqual(['unit_not_convertible']);
  });

  it('pays the same whatever the order of the tickets, and every ticket is either paid or held (property)', () => {
    const labels = ['T-12', 'T-7', 'T-99'];
    const arb = fc.array(
      fc.record({
        truck: fc.constantFrom(...labels),
        hundredths: fc.option(fc.integer({ min: 1, max: 1500 }), { nil: null }),
      }),
      { maxLength: 40 },
    );
    fc.assert(
      fc.property(arb, (rows) => {
        const list = rows.map((r, i) => load(String(i), r.truck, r.hundredths === null ? null : r.hundredths / 100));
        const pay = truckTicketPay(list, register, 'CY', precisionFor('CY'));
        const reversed = truckTicketPay([...list].reverse(), register, 'CY', precisionFor('CY'));
        expect(reversed.quantity).toBe(pay.quantity);
        expect(pay.paidIds.length + pay.held.length).toBe(list.length);
        // The quantity is the exact decimal sum of the paid loads, rounded once (mathjs BigNumber as the check).
        const exact = list
          .filter((t) => pay.paidIds.includes(t.id))
          .reduce(
            (s, t) => s.plus(bignumber(String(t.loadVolumeCy ?? register.get(t.truckLabel)!.bedVolumeCy))),
            bignumber(0),
          );
        expect(pay.measuredQuantity).toBe(Number(round(exact, 2).toString()));
      }),
    );
  });
});

describe("weight pay quantity (Resident Engineer's Manual section 109.12: moisture correction, factor used to 3, 0.5 CY bands)", () => {
  const sources = new Map([
    ['pit', { factorUsed: 1.473, statedMoisturePercent: 8 }],
    ['quarry', { factorUsed: 1.539, statedMoisturePercent: null }],
  ]);
  const ticket = (id: string, sourceId: string, netTons: number, moisturePercent: number | null): ScaleTicketInput => ({
    id,
    ticketNumber: `S-${id}`,
    date: '2026-10-06',
    bidItemId: 'item',
    sourceId,
    netTons,
    moisturePercent,
  });
  const tickets = [
    ticket('101', 'pit', 22.4, 12), // above 8 %: 22.40 x 100 / 112 = 20.00 t
    ticket('102', 'pit', 21.85, 6), // at or below 8 %: paid as weighed
    ticket('103', 'pit', 20, null), // no moisture measured: paid as weighed
    ticket('201', 'quarry', 15.39, 15), // no stated moisture at the source: no correction
  ];

  it('pays a TON item 20.00 + 21.85 + 20.00 + 15.39 = 77.24 t after the moisture correction (hand-worked)', () => {
    const pay = scaleTicketPay(tickets, sources, 'TON', precisionFor('TON'));
    expect(pay).toMatchObject({ quantity: 77.24, paidIds: ['101', '102', '103', '201'], held: [] });
  });

  it('converts per source for a CY item: 61.85 t / 1.473 = 41.99 -> 42.0 CY, 15.39 t / 1.539 = 10.00 CY; 52.0 CY', () => {
    const pit = divide(bignumber('61.85'), bignumber('1.473')) as BigNumber;
    expect(Number(round(pit, 2).toString())).toBe(41.99);
    expect(scaleTicketPay(tickets, sources, 'CY', precisionFor('CY'))).toMatchObject({
      quantity: 52,
      measuredQuantity: 52,
    });
  });

  it('holds tickets of an item paid in a unit weights cannot become (SY), and tickets of an unknown source', () => {
    expect(scaleTicketPay(tickets.slice(0, 1), sources, 'SY', precisionFor('SY')).held[0]!.reasons).toEqual([
      'unit_not_convertible',
    ]);
    const lost = scaleTicketPay([ticket('9', 'gone', 10, null)], sources, 'TON', precisionFor('TON'));
    expect(lost).toMatchObject({ quantity: 0, paidIds: [] });
  });
});
