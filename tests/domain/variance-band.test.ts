import { describe, expect, it } from 'vitest';
import { bandForItem, isEarlyWarning, VARIANCE_BANDS } from '../../src/shared/domain/variance';

const custom = { overPercent: 20, underPercent: 10 };

describe('bandForItem', () => {
  it('holds every item to 15/15 under FAR 52.211-18', () => {
    expect(bandForItem('far-15', custom, false)).toEqual({ overPercent: 15, underPercent: 15 });
  });

  it('applies 23 CFR 635.109(a)(3) 125/75 to major items only', () => {
    expect(bandForItem('major-125-75', custom, true)).toEqual({ overPercent: 25, underPercent: 25 });
    expect(bandForItem('major-125-75', custom, false)).toBeNull();
  });

  it('uses the project band for a custom clause', () => {
    expect(bandForItem('custom', custom, false)).toBe(custom);
  });
});

describe('isEarlyWarning (80 % of the band, our product setting)', () => {
  const far = VARIANCE_BANDS['far-15'];
  it('warns past 80 % of a 15 % band (above 112 %, below 88 %) and not at exactly 80 %', () => {
    expect(isEarlyWarning(10_000, 11_200, far)).toBe(false);
    expect(isEarlyWarning(10_000, 11_201, far)).toBe(true);
    expect(isEarlyWarning(10_000, 8_800, far)).toBe(false);
    expect(isEarlyWarning(10_000, 8_799, far)).toBe(true);
  });

  it('stays quiet beyond the band, where the status itself says over or under (FAR 52.211-18: 12,000 of 10,000)', () => {
    expect(isEarlyWarning(10_000, 12_000, far)).toBe(false);
    expect(isEarlyWarning(10_000, 11_500, far)).toBe(true);
  });

  it('never warns without a contract quantity', () => {
    expect(isEarlyWarning(0, 50, far)).toBe(false);
  });
});
