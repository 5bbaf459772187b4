import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { lateInterestCents, lineAmountCents, percentOfCents } from '../../src/shared/domain/money';
import { payApplication } from '../../src/shared/domain/pay-app';

describe('money helpers', () => {
  it('rounds quantity x unit price to the cent once, half away from zero', () => {
    expect(lineAmountCents(1234.5, 1999)).toBe(2_467_766); // 24,677.655 -> 24,677.66
    expect(lineAmountCents(0.1 + 0.2, 100)).toBe(30);
  });

  it('takes a percent of an amount rounded once (retainage)', () => {
    expect(percentOfCents(12345, 10)).toBe(1235); // 1,234.5 -> 1,235
    expect(percentOfCents(100_00, 4.875)).toBe(488);
  });

  it('gives $135.42 for $100,000 paid 10 days late at 4.875 % (FAR 52.232-27 example: x rate x days / 360)', () => {
    expect(lateInterestCents(100_000_00, 4.875, 10)).toBe(135_42);
  });
});

describe('payApplication', () => {
  const lines = [
    { unitPriceCents: 1250, contractQuantity: 10_000, previousQuantity: 2_000, thisPeriodQuantity: 1_500.5 },
    { unitPriceCents: 4_599, contractQuantity: 300, previousQuantity: 0, thisPeriodQuantity: 33.3 },
  ];

  it('computes to-date quantity, amounts, retainage per line, and current due after previous certified', () => {
    const r = payApplication({ retainagePercent: 10, previousCertifiedCents: 22_500_00, lines });
    expect(r.lines[0]).toMatchObject({ toDateQuantity: 3_500.5, amountToDateCents: 43_756_25, thisPeriodAmountCents: 18_756_25, retainageCents: 4_375_63 });
    expect(r.lines[1]).toMatchObject({ toDateQuantity: 33.3, amountToDateCents: 1_531_47, retainageCents: 153_15 });
    expect(r.earnedToDateCents).toBe(43_756_25 + 1_531_47);
    expect(r.retainageCents).toBe(4_375_63 + 153_15);
    expect(r.currentDueCents).toBe(r.earnedToDateCents - r.retainageCents - 22_500_00);
  });

  it('reduces retainage once the work passes the threshold percent complete', () => {
    const before = payApplication({ retainagePercent: 10, previousCertifiedCents: 0, lines, retainageReduction: { afterPercentComplete: 50, reducedPercent: 5 } });
    expect(before.retainagePercentApplied).toBe(10);
    const late = lines.map((l) => ({ ...l, previousQuantity: l.contractQuantity * 0.6, thisPeriodQuantity: 0 }));
    const after = payApplication({ retainagePercent: 10, previousCertifiedCents: 0, lines: late, retainageReduction: { afterPercentComplete: 50, reducedPercent: 5 } });
    expect(after.retainagePercentApplied).toBe(5);
    expect(after.percentComplete).toBeCloseTo(60, 9);
  });

  it('keeps totals equal to the sum of their lines and columns adding across (property)', () => {
    const line = fc.record({
      unitPriceCents: fc.integer({ min: 0, max: 10_000_00 }),
      contractQuantity: fc.integer({ min: 0, max: 1_000_000 }).map((q) => q / 100),
      previousQuantity: fc.integer({ min: 0, max: 1_000_000 }).map((q) => q / 100),
      thisPeriodQuantity: fc.integer({ min: 0, max: 1_000_000 }).map((q) => q / 100),
    });
    fc.assert(
      fc.property(fc.array(line, { maxLength: 30 }), fc.integer({ min: 0, max: 10 }), (ls, pct) => {
        const r = payApplication({ retainagePercent: pct, previousCertifiedCents: 0, lines: ls });
        expect(r.earnedToDateCents).toBe(r.lines.reduce((s, l) => s + l.amountToDateCents, 0));
        expect(r.retainageCents).toBe(r.lines.reduce((s, l) => s + l.retainageCents, 0));
        r.lines.forEach((l) => {
          expect(Number.isInteger(l.amountToDateCents)).toBe(true);
          expect(l.previousAmountCents + l.thisPeriodAmountCents).toBe(l.amountToDateCents);
        });
        expect(r.currentDueCents).toBe(r.earnedToDateCents - r.retainageCents);
      }),
    );
  });

  it('refuses a correction that takes the quantity to date below zero, at that line', () => {
    expect(() => payApplication({ retainagePercent: 10, previousCertifiedCents: 0, lines: [{ unitPriceCents: 1, contractQuantity: 1, previousQuantity: 1, thisPeriodQuantity: -2 }] })).toThrow(
      expect.objectContaining({ code: 'INVALID_QUANTITY', path: 'lines.0.thisPeriodQuantity' }),
    );
  });
});
