import { describe, expect, it } from 'vitest';
import { VARIANCE_BANDS, isMajorItem, quantityVariance } from '../../src/shared/domain/variance';

const far = VARIANCE_BANDS['far-15'];
const cfr = VARIANCE_BANDS['major-125-75'];
const run = (forecastQuantity: number, band = far, preset?: 'far-15' | 'major-125-75') =>
  quantityVariance({ contractQuantity: 10_000, forecastQuantity, unitPriceCents: 1250, band, preset });

describe('quantityVariance, FAR 52.211-18 (15/15), 10,000 estimated', () => {
  it('finds nothing to adjust at 11,500 (exactly 115 % is within)', () => {
    expect(run(11_500)).toMatchObject({ status: 'within', quantityBeyondBand: 0, amountBeyondBandCents: 0, variancePercent: 15 });
  });

  it('prices the 500 above the band at 12,000', () => {
    expect(run(12_000)).toMatchObject({ status: 'over', quantityBeyondBand: 500, amountBeyondBandCents: 500 * 1250, variancePercent: 20 });
  });

  it('finds 500 below the band at 8,000', () => {
    expect(run(8_000)).toMatchObject({ status: 'under', quantityBeyondBand: 500, variancePercent: -20 });
  });

  it('keeps exactly 85 % within', () => {
    expect(run(8_500).status).toBe('within');
  });
});

describe('quantityVariance, 23 CFR 635.109(a)(3) major items (125/75)', () => {
  it('is within at exactly 125 % and 75 %, over just above, under just below', () => {
    expect(run(12_500, cfr).status).toBe('within');
    expect(run(7_500, cfr).status).toBe('within');
    expect(run(12_500.01, cfr, 'major-125-75').status).toBe('over');
    expect(run(7_499.99, cfr, 'major-125-75').status).toBe('under');
  });

  it('adjusts an increase on the portion above 125 % and a decrease on the actual quantity performed', () => {
    expect(run(13_000, cfr, 'major-125-75')).toMatchObject({ quantityBeyondBand: 500, adjustmentBasisQuantity: 500 });
    const under = run(7_000, cfr, 'major-125-75');
    expect(under.quantityBeyondBand).toBe(500);
    expect(under.adjustmentBasisQuantity).toBe(7_000);
    expect(under.trail.join('\n')).toMatch(/actual quantity performed/);
  });

  it('calls an item major at the contract\'s share of the original amount (a project setting)', () => {
    expect(isMajorItem(10_000_00, 100_000_00, 10)).toBe(true);
    expect(isMajorItem(9_999_99, 100_000_00, 10)).toBe(false);
  });
});

describe('quantityVariance, custom band', () => {
  it('uses the given over and under percents', () => {
    const r = quantityVariance({ contractQuantity: 200, forecastQuantity: 250, unitPriceCents: 333, band: { overPercent: 20, underPercent: 10 } });
    expect(r).toMatchObject({ status: 'over', band: { lower: 180, upper: 240 } });
    expect(r.quantityBeyondBand).toBeCloseTo(10, 12);
    expect(r.amountBeyondBandCents).toBe(3330);
  });
});
