import fc from 'fast-check';
import { unit as mathUnit } from 'mathjs';
import { describe, expect, it } from 'vitest';
import {
  DEFAULT_PAY_DECIMALS,
  MEASUREMENT_METHODS,
  METHOD_BILLING,
  type MeasurementBasis,
  type MeasurementMethod,
} from '../../src/shared/constants';
import { billedQuantity, type BillItem } from '../../src/shared/domain/billed-quantity';
import { runCalc } from '../../src/shared/domain/calc';
import { payQuantityOf, precisionFor } from '../../src/shared/domain/provisions/precision';
import { isDomainError } from '../../src/shared/domain/domain-error';

const us = { swellPercent: 25, shrinkagePercent: 10, units: 'us' as const };
const item = (payUnit: BillItem['payUnit'], basis: MeasurementBasis = 'bank'): BillItem => ({
  itemNumber: 'X-1',
  payUnit,
  basis,
});

/** Runs the engine, then bills: the same two steps the worksheet preview and the server take. */
function bill(
  method: MeasurementMethod,
  inputs: Record<string, unknown>,
  target: BillItem,
  options = {},
  factors = us,
) {
  return billedQuantity(method, inputs, runCalc(method, inputs) as Record<string, unknown>, target, factors, options);
}

// US Navy EO training manual (NAVEDTRA 14081), reference.md section 1: A1 = 50, A2 = 70 sq ft, 100 ft apart: 222.22 CY.
const navy = {
  unit: 'ft',
  stations: [
    { station: 1000, cutArea: 50, fillArea: 0 },
    { station: 1100, cutArea: 70, fillArea: 0 },
  ],
};
const navyFill = {
  unit: 'ft',
  stations: [
    { station: 0, cutArea: 0, fillArea: 27 },
    { station: 100, cutArea: 0, fillArea: 27 },
  ],
};
const tickets = (capacity: number, count = 1, swellPercent = 25) => ({
  swellPercent,
  unit: 'ft',
  loads: [{ capacity, count }],
});

describe('the method table (src/shared/constants.ts)', () => {
  it('has one entry per measurement method; spoil and mass haul do not bill, surface to surface does', () => {
    expect(Object.keys(METHOD_BILLING).sort()).toEqual([...MEASUREMENT_METHODS].sort());
    expect(METHOD_BILLING.spoil.bills).toBe(false);
    expect(METHOD_BILLING['mass-haul'].bills).toBe(false);
    expect(METHOD_BILLING.surface).toMatchObject({ bills: true, components: ['cut', 'fill'] });
  });
});

describe('billed quantity: hand-worked conversions (reference.md section 3)', () => {
  it('bills the Navy example cut as 222.2222 bank CY to a bank item (NAVEDTRA 14081)', () => {
    const b = bill('end-area', navy, item('CY'));
    expect(b.quantity).toBe(222.2222);
    expect(b.measured).toEqual({ quantity: expect.closeTo(222.2222, 4), unit: 'CY', basis: 'bank', component: 'cut' });
  });

  it('converts bank to loose with 25 % swell (common earth, textbook table): 222.2222 x 1.25 = 277.7778 loose CY (Nichols and Day p. 2.51)', () => {
    const b = bill('end-area', navy, item('CY', 'loose'));
    expect(b.quantity).toBe(277.7778);
    expect(b.basis).toBe('loose');
    expect(b.trail.filter((s) => s.startsWith('bank to loose'))).toHaveLength(1);
  });

  it('converts a bank cut to compacted with 10 % shrinkage: 222.2222 x 0.90 = 200.0000 (shrinkage factor = 1 - shrinkage, Nichols and Day p. 2.51)', () => {
    expect(bill('end-area', navy, item('CY', 'compacted'), { component: 'cut' }).quantity).toBe(200);
  });

  it('bills a fill in compacted measure as measured (US Navy EO manual, Table 4-1): 27 sq ft over 100 ft = 100 compacted CY', () => {
    const b = bill('end-area', navyFill, item('CY', 'compacted'), { component: 'fill' });
    expect(b.quantity).toBe(100);
    expect(b.trail.some((s) => /^(bank|loose|compacted) to /.test(s))).toBe(false);
  });

  it('changes CY to m3 with the exact yard, checked with mathjs: 222.2222 CY = 169.9011 m3', () => {
    expect(bill('end-area', navy, item('m3')).quantity).toBeCloseTo(mathUnit(2000 / 9, 'cuyd').toNumber('m^3'), 4);
  });

  it('bills truck tickets from the loose measure once: 1,020 loose CY, 25 % swell, to a bank item is 816.0 CY (no loose-bank-loose round trip)', () => {
    const inputs = {
      swellPercent: 25,
      unit: 'ft',
      loads: [
        { capacity: 15, count: 40 },
        { capacity: 14, count: 30 },
      ],
    };
    const bank = bill('load-count', inputs, item('CY'));
    expect(bank.quantity).toBe(816);
    expect(bank.quantity).toBe((runCalc('load-count', inputs) as { payQuantity: number }).payQuantity);
    const loose = bill('load-count', inputs, item('CY', 'loose'));
    expect(loose.quantity).toBe(1020);
    expect(loose.trail.some((s) => /bank/.test(s) && / to /.test(s))).toBe(false);
  });

  it('takes the truck-ticket swell from the worksheet, the shrinkage from the project: 1,020 loose / 1.25 x 0.90 = 734.4 compacted', () => {
    expect(
      bill('load-count', tickets(1020, 1, 25), item('CY', 'compacted'), {}, { ...us, swellPercent: 40 }).quantity,
    ).toBe(734.4);
  });

  it('pays truck measure to 0.1 from the 0.01 figure: 11.38 -> 11.4, 11.34 -> 11.3 (state DOT construction manual section 109.11)', () => {
    expect(bill('load-count', tickets(11.38), item('CY', 'loose')).quantity).toBe(11.4);
    expect(bill('load-count', tickets(11.34), item('CY', 'loose')).quantity).toBe(11.3);
  });

  it('takes the pay decimals from the one table of pay precision (DEFAULT_PAY_DECIMALS), never from the method table', () => {
    for (const method of MEASUREMENT_METHODS) expect(METHOD_BILLING[method]).not.toHaveProperty('payDecimals');
    expect(DEFAULT_PAY_DECIMALS.CY).toBe(1); // truck measure paid to 0.1 CY (state DOT construction manual 109.11)
    // Loose CY to a loose item: no conversion, so the bill is the ticket total paid to the CY precision.
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 5_000_000 }), (hundredths) => {
        const capacity = hundredths / 100;
        const billed = bill('load-count', tickets(capacity), item('CY', 'loose')).quantity;
        expect(billed).toBe(payQuantityOf(capacity, precisionFor('CY')));
      }),
      { numRuns: 200 },
    );
  });

  it('bills tons by density: bank 3,400 lb/CY and loose 2,700 lb/CY (published check, 25.9 % swell); 100 loose CY weigh 270,000 lb = 135.0 tons', () => {
    const swell = (3400 / 2700 - 1) * 100;
    const b = bill('load-count', tickets(100, 1, swell), item('TON'), { density: 3400 / 2000 });
    expect(b.quantity).toBe(135);
    expect(b.trail.some((s) => s.startsWith('Weight = bank volume x density'))).toBe(true);
  });

  it('bills 740.74 bank CY of the grid example as tons at 1.5 t/bank CY (from memory, an illustrative density): 1,111.1111 TON', () => {
    const grid = {
      unit: 'ft',
      spacingX: 50,
      spacingY: 50,
      depths: [
        [1, 1.5, 2],
        [1.5, 2, 2.5],
        [2, 2.5, 3],
      ],
    };
    expect(bill('grid', grid, item('TON'), { density: 1.5 }).quantity).toBe(1111.1111);
  });

  it('refuses a weight item without a density with UNIT_MISMATCH on the density field', () => {
    expect(() => bill('end-area', navy, item('TON'))).toThrow(
      expect.objectContaining({ code: 'UNIT_MISMATCH', path: 'density' }),
    );
  });

  it('bills trench run lengths to an LF item, and metres with the exact foot: 100 + 40.5 = 140.5 LF = 42.8244 m', () => {
    const trench = {
      unit: 'ft',
      protection: 'box',
      runs: [
        { length: 100, depth: 4, bottomWidth: 3 },
        { length: 40.5, depth: 4, bottomWidth: 3 },
      ],
    };
    expect(bill('trench', trench, item('LF')).quantity).toBe(140.5);
    expect(bill('trench', trench, item('m')).quantity).toBe(42.8244);
  });

  it('refuses a volume worksheet for an item paid by count, naming the bid item field', () => {
    try {
      bill('pit', { unit: 'ft', length: 10, width: 10, cornerDepths: [1, 1, 1, 1] }, item('EA'));
      expect.unreachable();
    } catch (err) {
      expect(isDomainError(err) && err.code === 'UNIT_MISMATCH' && err.path === 'bidItemId').toBe(true);
    }
  });

  it('refuses the planners (spoil, mass haul) with METHOD_NOT_BILLABLE', () => {
    expect(() => billedQuantity('spoil', {}, {}, item('CY'), us)).toThrow(
      expect.objectContaining({ code: 'METHOD_NOT_BILLABLE' }),
    );
    expect(() => billedQuantity('mass-haul', {}, {}, item('CY'), us)).toThrow(
      expect.objectContaining({ code: 'METHOD_NOT_BILLABLE' }),
    );
  });

  it('keeps a direct quantity as given, in the item unit', () => {
    expect(billedQuantity('manual', null, null, item('EA'), us, { directQuantity: 12 }).quantity).toBe(12);
  });

  it('property: any basis to any other equals the bank volume times the target factor (Nichols and Day p. 2.51)', () => {
    const bases = fc.constantFrom<MeasurementBasis>('bank', 'loose', 'compacted');
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 1e5, noNaN: true }),
        fc.double({ min: 0, max: 80, noNaN: true }),
        fc.double({ min: -20, max: 40, noNaN: true }),
        bases,
        bases,
        (v, swell, shrink, from, to) => {
          const result = { cut: v, fill: 0, volumeUnit: 'CY', trail: [] };
          const b = billedQuantity(
            'grid',
            {},
            result,
            item('CY', to),
            { swellPercent: swell, shrinkagePercent: shrink, units: 'us' },
            { measuredBasis: from, component: 'cut' },
          );
          const per = { bank: 1, loose: 1 + swell / 100, compacted: 1 - shrink / 100 };
          expect(b.quantity).toBeCloseTo((v / per[from]) * per[to], 3);
        },
      ),
      { numRuns: 200 },
    );
  });
});
