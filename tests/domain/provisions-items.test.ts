import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { DomainError } from '../../src/shared/domain/domain-error';
import { lumpSumEarnedCents, lumpSumStagesEarnedCents } from '../../src/shared/domain/provisions/lump-sum';
import { mobilizationEarned } from '../../src/shared/domain/provisions/mobilization';
import { planQuantityEarned, substantialError } from '../../src/shared/domain/provisions/plan-quantity';
import { DEFAULT_MOBILIZATION_STEPS } from '../../src/shared/constants';

describe('plan quantity: revised only for a substantial error (FDOT standard specifications 9-3.2.1)', () => {
  it('limits a $125,000 item (10,000 CY at $12.50) to $5,000, the smaller of 5 % ($6,250) and $5,000', () => {
    expect(substantialError(10_000, 10_380, 1250)).toEqual({
      substantial: false,
      limitCents: 500_000,
      differenceCents: 475_000,
    });
    expect(substantialError(10_000, 9_580, 1250).substantial).toBe(true);
  });

  it('limits a $12,500 item to 5 % ($625): 60 CY short ($750) is substantial, 50 CY ($625) is not', () => {
    expect(substantialError(1_000, 940, 1250)).toMatchObject({ substantial: true, limitCents: 62_500 });
    expect(substantialError(1_000, 1_050, 1250).substantial).toBe(false);
  });

  it('treats an overrun and an underrun of the same size alike (property)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 100_000 }),
        fc.integer({ min: 0, max: 100_000 }),
        fc.integer({ min: 1, max: 100_000 }),
        (plan, d, price) => {
          fc.pre(d <= plan);
          expect(substantialError(plan, plan + d, price)).toEqual(substantialError(plan, plan - d, price));
        },
      ),
    );
  });

  it('earns the plan quantity by percent complete: 37.5 % of 1,240.0 CY = 465.00 (hand-worked)', () => {
    expect(planQuantityEarned(1240, 37.5, 2)).toBe(465);
    expect(() => planQuantityEarned(1240, 101, 2)).toThrow(DomainError);
  });
});

describe('lump sum by percent complete and by stages (common practice)', () => {
  it('earns 37.5 % of $48,000.00 as $18,000.00', () => {
    expect(lumpSumEarnedCents(4_800_000, 37.5)).toBe(1_800_000);
  });

  const stages = [
    { name: 'Clear and grub', percentOfItem: 33.33 },
    { name: 'Strip topsoil', percentOfItem: 33.33 },
    { name: 'Respread and seed', percentOfItem: 33.34 },
  ];

  it("earns each completed stage's share and the whole item when all are done ($10,000.01, hand-worked)", () => {
    expect(lumpSumStagesEarnedCents(1_000_001, stages, new Set([0]))).toEqual({ earnedCents: 333_300, percent: 33.33 });
    expect(lumpSumStagesEarnedCents(1_000_001, stages, new Set([0, 1, 2])).earnedCents).toBe(1_000_001);
  });

  it('refuses a schedule that does not add up to 100 %', () => {
    expect(() => lumpSumStagesEarnedCents(100, stages.slice(0, 2), new Set())).toThrowError(/66.66 %, not 100 %/);
  });

  it('never earns more than the item and grows with each stage (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 1e9 }), fc.subarray([0, 1, 2]), (value, done) => {
        const earned = lumpSumStagesEarnedCents(value, stages, new Set(done)).earnedCents;
        expect(earned).toBeLessThanOrEqual(value);
        if (done.length < 3) {
          const more = [...done, [0, 1, 2].find((i) => !done.includes(i)) ?? 0];
          expect(lumpSumStagesEarnedCents(value, stages, new Set(more)).earnedCents).toBeGreaterThanOrEqual(earned);
        }
      }),
    );
  });
});

describe('mobilization in steps of the original contract earned (Iowa DOT 2533: 25 % at 5 %, 50 % at 10 %)', () => {
  const steps = [...DEFAULT_MOBILIZATION_STEPS];

  it('pays nothing below 5 %, 25 % at exactly 5 % and 50 % at 10 % ($60,000 of a $1,200,000 contract)', () => {
    expect(mobilizationEarned(6_000_000, 120_000_000, 5_999_999, steps).earnedCents).toBe(0);
    expect(mobilizationEarned(6_000_000, 120_000_000, 6_000_000, steps)).toMatchObject({
      mobilizationPercent: 25,
      earnedCents: 1_500_000,
    });
    expect(mobilizationEarned(6_000_000, 120_000_000, 12_000_000, steps).earnedCents).toBe(3_000_000);
  });

  it('refuses steps that do not rise', () => {
    expect(() =>
      mobilizationEarned(1, 1, 0, [
        { contractEarnedPercent: 10, mobilizationPercent: 50 },
        { contractEarnedPercent: 5, mobilizationPercent: 60 },
      ]),
    ).toThrowError(/rise/);
  });

  it('never falls as more is earned (property)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 1e10 }),
        fc.integer({ min: 0, max: 1e10 }),
        fc.integer({ min: 0, max: 1e9 }),
        (orig, a, d) => {
          const lo = mobilizationEarned(1_000_000, orig, a, steps).earnedCents;
          expect(mobilizationEarned(1_000_000, orig, a + d, steps).earnedCents).toBeGreaterThanOrEqual(lo);
        },
      ),
    );
  });
});
