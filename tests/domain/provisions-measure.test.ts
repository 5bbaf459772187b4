import fc from 'fast-check';
import { bignumber, round } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { DomainError } from '../../src/shared/domain/domain-error';
import { measured, payQuantityOf, precisionFor } from '../../src/shared/domain/provisions/precision';
import {
  bedVolumeCy,
  checkTicket,
  ticketTotals,
  truckComputed,
  truckPay,
  type RegisteredTruck,
} from '../../src/shared/domain/provisions/truck-measure';

/** Half away from zero on the decimal text, by mathjs BigNumber (decimal.js, ROUND_HALF_UP): an outside check. */
function referenceRound(value: number, decimals: number): number {
  return Number(round(bignumber(String(value)), decimals).toString());
}

describe('precision: measured one decimal finer than pay (FHWA WFL supplement to FP-14 section 109.01)', () => {
  it('keeps measurements one decimal finer than the pay quantity for every unit', () => {
    expect(precisionFor('CY')).toEqual({ payDecimals: 1, measuredDecimals: 2 });
    expect(precisionFor('TON')).toEqual({ payDecimals: 2, measuredDecimals: 3 });
    expect(precisionFor('EA', 0).measuredDecimals).toBe(1);
  });

  it('refuses pay decimals outside 0..3 naming the field', () => {
    expect(() => precisionFor('CY', 4)).toThrow(DomainError);
    expect(() => precisionFor('CY', 1.5)).toThrowError(/whole number/);
  });

  it('pays from the measured figure: 2.345 CY measured 2.35, paid 2.4 (hand-worked)', () => {
    const p = precisionFor('CY');
    expect(measured(2.345, p)).toBe(2.35);
    expect(payQuantityOf(2.345, p)).toBe(2.4);
  });
});

describe('truck measure: compute to 0.01 CY, pay to 0.1 CY (a state DOT construction manual, section 109.11)', () => {
  it("pays 11.38 as 11.4 and 11.34 as 11.3 (the manual's examples)", () => {
    expect(truckPay(11.38)).toBe(11.4);
    expect(truckPay(11.34)).toBe(11.3);
  });

  it('rounds on the decimal value, not the binary one: 11.35 pays 11.4 where toFixed gives 11.3 (common practice)', () => {
    expect((11.35).toFixed(1)).toBe('11.3');
    expect(truckPay(11.35)).toBe(11.4);
    expect(truckComputed(1.005)).toBe(1.01);
  });

  it('agrees with mathjs BigNumber rounding for any volume of up to 2 decimals (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10_000_000 }), (hundredths) => {
        const v = hundredths / 100;
        expect(truckPay(v)).toBe(referenceRound(v, 1));
        expect(truckComputed(v)).toBe(v);
      }),
    );
  });

  it('measures a bed 14 ft x 7.5 ft x 4 ft struck as 15.56 CY (420 / 27 = 15.555..., hand-worked)', () => {
    expect(bedVolumeCy(14, 7.5, 4)).toBe(15.56);
    expect(() => bedVolumeCy(14, 0, 4)).toThrow(DomainError);
  });

  const trucks = new Map<string, RegisteredTruck>([
    ['T-12', { id: 'T-12', bedVolumeCy: 11.38 }],
    ['T-14', { id: 'T-14', bedVolumeCy: 15.56 }],
  ]);

  it('flags a ticket on an unregistered truck and one past the bed volume', () => {
    expect(checkTicket({ truckId: 'T-99', date: '2026-05-04', bidItemId: 'a' }, trucks).flags).toEqual([
      'unregistered_truck',
    ]);
    expect(checkTicket({ truckId: null, date: '2026-05-04', bidItemId: 'a' }, trucks).flags).toEqual([
      'unregistered_truck',
    ]);
    expect(
      checkTicket({ truckId: 'T-12', date: '2026-05-04', bidItemId: 'a', loadVolumeCy: 11.39 }, trucks).flags,
    ).toEqual(['over_capacity']);
    expect(checkTicket({ truckId: 'T-12', date: '2026-05-04', bidItemId: 'a' }, trucks)).toEqual({
      volumeCy: 11.38,
      flags: [],
    });
  });

  it('totals per day: 3 loads of 11.38 and 1 of 15.56 = 49.70 computed, 49.7 paid; flagged loads kept apart', () => {
    const tickets = [
      { truckId: 'T-12', date: '2026-05-04', bidItemId: 'a' },
      { truckId: 'T-12', date: '2026-05-04', bidItemId: 'a' },
      { truckId: 'T-12', date: '2026-05-04', bidItemId: 'b' },
      { truckId: 'T-14', date: '2026-05-04', bidItemId: 'a' },
      { truckId: 'T-99', date: '2026-05-04', bidItemId: 'a' },
      { truckId: 'T-14', date: '2026-05-05', bidItemId: 'a', loadVolumeCy: 14.2 },
    ];
    const byDay = ticketTotals(tickets, trucks, 'date');
    expect(byDay[0]).toEqual({ key: '2026-05-04', loads: 4, computedCy: 49.7, payCy: 49.7, flagged: 1 });
    expect(byDay[1]).toEqual({ key: '2026-05-05', loads: 1, computedCy: 14.2, payCy: 14.2, flagged: 0 });
    const byItem = ticketTotals(tickets, trucks, 'bidItemId');
    expect(byItem.map((t) => [t.key, t.computedCy])).toEqual([
      ['a', 52.52],
      ['b', 11.38],
    ]);
  });

  it('gives the same grand total by day and by item, equal to an exact cent-integer sum (property)', () => {
    const ticket = fc.record({
      truckId: fc.constantFrom('T-12', 'T-14'),
      date: fc.constantFrom('2026-05-04', '2026-05-05', '2026-05-06'),
      bidItemId: fc.constantFrom('a', 'b'),
      loadVolumeCy: fc.integer({ min: 0, max: 1138 }).map((h) => h / 100),
    });
    fc.assert(
      fc.property(fc.array(ticket, { maxLength: 60 }), (tickets) => {
        const sum = (totals: { computedCy: number }[]) =>
          Math.round(totals.reduce((t, x) => t + x.computedCy * 100, 0));
        const exact = tickets.reduce((t, x) => t + Math.round(x.loadVolumeCy * 100), 0);
        expect(sum(ticketTotals(tickets, trucks, 'date'))).toBe(exact);
        expect(sum(ticketTotals(tickets, trucks, 'bidItemId'))).toBe(exact);
      }),
    );
  });
});
