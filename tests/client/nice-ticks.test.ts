import { describe, expect, it } from 'vitest';
import { niceTicks } from '../../src/components/ui/nice-ticks';

// Round ticks (issue 14): steps of 1, 2, 2.5 or 5 times a power of ten (Heckbert, "Nice numbers for graph labels",
// Graphics Gems, 1990; from memory). The odd axes seen on the quantity watch were 0/9/18/27/36 and 0/35/70/105/140.
describe('niceTicks', () => {
  it('turns the odd axes into round ones', () => {
    expect(niceTicks(0, 36).ticks).toEqual([0, 10, 20, 30, 40]);
    expect(niceTicks(0, 140).ticks).toEqual([0, 50, 100, 150]);
  });

  it('keeps zero inside for negative values and spans both signs', () => {
    expect(niceTicks(-12, 18).ticks).toEqual([-20, -10, 0, 10, 20]);
  });

  it('works for money in dollars and for small fractions without float noise', () => {
    expect(niceTicks(0, 125_603).ticks).toEqual([0, 50_000, 100_000, 150_000]);
    expect(niceTicks(0, 0.7).ticks).toEqual([0, 0.2, 0.4, 0.6, 0.8]);
  });

  it('every step is 1, 2, 2.5 or 5 times a power of ten, and the domain covers the data', () => {
    for (const max of [1, 3, 7, 9.5, 36, 99, 101, 140, 999, 2_345, 87_000]) {
      const { ticks, domain } = niceTicks(0, max);
      const step = ticks[1]! - ticks[0]!;
      const mantissa = step / 10 ** Math.floor(Math.log10(step));
      expect([1, 2, 2.5, 5], `max ${max}`).toContain(Number(mantissa.toFixed(6)));
      expect(domain[1]).toBeGreaterThanOrEqual(max);
    }
  });

  it('an empty range still gives an axis', () => {
    expect(niceTicks(0, 0)).toEqual({ domain: [0, 1], ticks: [0, 1] });
  });
});
