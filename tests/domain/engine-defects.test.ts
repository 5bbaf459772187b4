import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { runCalc } from '../../src/shared/domain/calc';
import { DomainError } from '../../src/shared/domain/domain-error';
import { gridVolume } from '../../src/shared/domain/earthwork/grid';
import { bilinearCutFill } from '../../src/shared/domain/earthwork/grid-bilinear';
import { loadCount } from '../../src/shared/domain/earthwork/load-count';
import { massHaul } from '../../src/shared/domain/earthwork/mass-haul';
import { pitVolume } from '../../src/shared/domain/earthwork/pit';
import { trenchVolume } from '../../src/shared/domain/earthwork/trench';
import { lineAmountCents } from '../../src/shared/domain/money';
import { payApplication } from '../../src/shared/domain/pay-app';

/** Issue 13, item 6: each of these failed before its fix. */

function codeAndPath(fn: () => unknown): [string, string] {
  try {
    fn();
  } catch (e) {
    if (e instanceof DomainError) return [e.code, e.path];
    throw e;
  }
  throw new Error('expected a DomainError');
}

describe('mass haul: layers open at both ends', () => {
  it('counts 100 CY that comes in at the start and leaves at the end as both borrow and waste', () => {
    // Ordinates 0, +500, 0 CY (54 sq ft over 500 ft by average end area = 500 CY, geometry); with the balance
    // line at -100 the curve sits 100 above it at both ends: the bottom 100 CY layer never balances inside the
    // profile (US Navy Engineering Aid Table 10-2: unbalanced volume at the ends is borrow or waste).
    const r = massHaul({
      unit: 'ft',
      stations: [
        { station: 0, cutArea: 54, fillArea: 0 },
        { station: 500, cutArea: 0, fillArea: 0 },
        { station: 1000, cutArea: 0, fillArea: 54 },
      ],
      freeHaul: 500,
      balanceLine: -100,
    });
    expect(r.borrow).toBeCloseTo(100, 9);
    expect(r.waste).toBeCloseTo(100, 9);
    expect(r.through).toBeCloseTo(100, 9);
    expect(r.trail.join('\n')).toMatch(/comes in at the start and leaves at the end/);
  });
});

describe('grid: lone nodes', () => {
  it('counts a defined node in no complete cell and says so in the trail', () => {
    // Cells (0,0) and (1,0) are complete; node (2,2) belongs to none (its only cell misses node (1,2)): by hand.
    const r = gridVolume({
      unit: 'ft',
      spacingX: 10,
      spacingY: 10,
      depths: [
        [1, 1, null],
        [1, 1, null],
        [1, 1, 1],
      ],
    });
    expect(r.loneNodes).toBe(1);
    expect(r.trail.join('\n')).toMatch(/1 node belongs to no complete cell/);
    const none = gridVolume({
      unit: 'ft',
      spacingX: 10,
      spacingY: 10,
      depths: [
        [1, 1],
        [1, 1],
      ],
    });
    expect(none.loneNodes).toBe(0);
  });

  it('counts lone nodes like a direct count on random outlines (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.array(fc.option(fc.integer({ min: -5, max: 5 }), { nil: null, freq: 3 }), { minLength: 5, maxLength: 5 }),
          { minLength: 2, maxLength: 6 },
        ),
        (depths) => {
          const rows = depths.length;
          const cols = 5;
          const inCell = depths.map((r) => r.map(() => false));
          for (let r = 0; r + 1 < rows; r++) {
            for (let c = 0; c + 1 < cols; c++) {
              const corners = [
                [r, c],
                [r, c + 1],
                [r + 1, c],
                [r + 1, c + 1],
              ] as const;
              if (corners.every(([a, b]) => depths[a]![b] !== null)) for (const [a, b] of corners) inCell[a]![b] = true;
            }
          }
          let lone = 0;
          depths.forEach((row, r) => row.forEach((v, c) => (lone += v !== null && !inCell[r]![c] ? 1 : 0)));
          expect(gridVolume({ unit: 'm', spacingX: 1, spacingY: 1, depths }).loneNodes).toBe(lone);
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe('grid: exact bilinear split of mixed cells (option mixedCellSplit: exact-bilinear)', () => {
  /** Independent reference: midpoint rule on an n x n sub-grid of the bilinear surface (converges as 1/n^2). */
  function midpoint(h00: number, h10: number, h01: number, h11: number, n = 1500): [number, number] {
    let cut = 0;
    let fill = 0;
    for (let i = 0; i < n; i++) {
      const v = (i + 0.5) / n;
      for (let j = 0; j < n; j++) {
        const u = (j + 0.5) / n;
        const f = h00 * (1 - u) * (1 - v) + h10 * u * (1 - v) + h01 * (1 - u) * v + h11 * u * v;
        if (f > 0) cut += f;
        else fill -= f;
      }
    }
    return [cut / (n * n), fill / (n * n)];
  }

  it('gives A/8 cut and A/8 fill on the saddle cell (1, -1, -1, 1): analytic, each quadrant integrates to 1/16', () => {
    const r = gridVolume({
      unit: 'm',
      spacingX: 10,
      spacingY: 10,
      depths: [
        [1, -1],
        [-1, 1],
      ],
      mixedCellSplit: 'exact-bilinear',
    });
    expect(r.cut).toBeCloseTo(100 / 8, 12);
    expect(r.fill).toBeCloseTo(100 / 8, 12);
    // The published transition-square formula stays the default: (A/4) 2^2 / 4 = A/4 each.
    const d = gridVolume({
      unit: 'm',
      spacingX: 10,
      spacingY: 10,
      depths: [
        [1, -1],
        [-1, 1],
      ],
    });
    expect(d.mixedCellSplit).toBe('transition-square');
    expect(d.cut).toBeCloseTo(25, 12);
    expect(r.trail.join('\n')).toMatch(/bilinear/);
  });

  it('agrees with fine midpoint integration on random cells, and keeps the net', () => {
    fc.assert(
      fc.property(
        fc.tuple(
          fc.double({ min: -5, max: 5, noNaN: true }),
          fc.double({ min: -5, max: 5, noNaN: true }),
          fc.double({ min: -5, max: 5, noNaN: true }),
          fc.double({ min: -5, max: 5, noNaN: true }),
        ),
        ([a, b, c, d]) => {
          const [cut, fill] = bilinearCutFill(a, b, c, d);
          const [rc, rf] = midpoint(a, b, c, d, 400);
          const scale = Math.abs(a) + Math.abs(b) + Math.abs(c) + Math.abs(d) + 1e-9;
          expect(Math.abs(cut - rc)).toBeLessThan(1e-4 * scale);
          expect(Math.abs(fill - rf)).toBeLessThan(1e-4 * scale);
          expect(cut - fill).toBeCloseTo((a + b + c + d) / 4, 10);
        },
      ),
      { numRuns: 60 },
    );
    // Subnormal corners once gave NaN: the cut and fill stay finite and keep the net.
    for (const h of [
      [5e-324, 0, 2.5, -3],
      [-0, 5e-324, -5, 1e-300],
      [5e-324, 5e-324, 1e-300, -1],
    ] as [number, number, number, number][]) {
      const [c, f] = bilinearCutFill(h[0], h[1], h[2], h[3]);
      const [rc, rf] = midpoint(h[0], h[1], h[2], h[3], 400);
      expect(Math.abs(c - rc) + Math.abs(f - rf)).toBeLessThan(1e-4);
    }
    const [cut, fill] = bilinearCutFill(3, -1, -0.5, 2);
    const [rc, rf] = midpoint(3, -1, -0.5, 2);
    expect(cut).toBeCloseTo(rc, 6);
    expect(fill).toBeCloseTo(rf, 6);
  });

  it('is taken through the calc API by name', () => {
    const r = runCalc('grid', {
      unit: 'ft',
      spacingX: 3,
      spacingY: 3,
      depths: [
        [1, -1],
        [-1, 1],
      ],
      mixedCellSplit: 'exact-bilinear',
    });
    expect(r.cut).toBeCloseTo(9 / 8 / 27, 12);
  });
});

describe('pay application: retainage reduction decided exactly', () => {
  it('reduces at exactly 57 % complete ($570,000 of $1,000,000, reduction after 57 %)', () => {
    // 570,000 / 1,000,000 x 100 is 56.99999999999999 in binary floating point.
    expect((57_000_000 / 100_000_000) * 100).toBeLessThan(57);
    const r = payApplication({
      retainagePercent: 10,
      previousCertifiedCents: 0,
      lines: [{ unitPriceCents: 100_000, contractQuantity: 1000, previousQuantity: 0, thisPeriodQuantity: 570 }],
      retainageReduction: { afterPercentComplete: 57, reducedPercent: 5 },
    });
    expect(r.retainagePercentApplied).toBe(5);
    expect(r.retainageCents).toBe(2_850_000); // 5 % of $570,000
  });

  it('does not reduce one cent short of the threshold', () => {
    const r = payApplication({
      retainagePercent: 10,
      previousCertifiedCents: 0,
      lines: [
        { unitPriceCents: 1, contractQuantity: 100_000_000, previousQuantity: 0, thisPeriodQuantity: 56_999_999 },
      ],
      retainageReduction: { afterPercentComplete: 57, reducedPercent: 5 },
    });
    expect(r.retainagePercentApplied).toBe(10);
  });
});

describe('quantities priced exactly, rounded once', () => {
  it('prices 1.00005 x $1,000.00 at $1,000.05 (toFixed(4) gave $1,000.10)', () => {
    expect(lineAmountCents(1.00005, 100_000)).toBe(100_005);
    const r = payApplication({
      retainagePercent: 0,
      previousCertifiedCents: 0,
      lines: [{ unitPriceCents: 100_000, contractQuantity: 1.00005, previousQuantity: 1, thisPeriodQuantity: 0.00005 }],
    });
    expect(r.contractAmountCents).toBe(100_005);
    expect(r.earnedToDateCents).toBe(100_005);
  });

  it('rounds half away from zero once on the exact product', () => {
    expect(lineAmountCents(0.125, 100)).toBe(13); // 12.5 cents
    expect(lineAmountCents(-0.125, 100)).toBe(-13);
    expect(lineAmountCents(1e-7, 1)).toBe(0);
  });
});

describe('very large inputs: a 400 naming the field, never a RangeError', () => {
  it('refuses a pay line whose amount is beyond a safe integer of cents, naming the line', () => {
    const input = {
      retainagePercent: 10,
      previousCertifiedCents: 0,
      lines: [
        {
          unitPriceCents: Number.MAX_SAFE_INTEGER,
          contractQuantity: 1e9,
          previousQuantity: 0,
          thisPeriodQuantity: 0,
        },
      ],
    };
    expect(codeAndPath(() => runCalc('pay-app', input))).toEqual(['INVALID_NUMBER', 'lines.0.contractQuantity']);
  });

  it('refuses a current amount due beyond the ledger, naming previousCertifiedCents', () => {
    const input = {
      retainagePercent: 0,
      previousCertifiedCents: -Number.MAX_SAFE_INTEGER,
      lines: [{ unitPriceCents: 100, contractQuantity: 10, previousQuantity: 0, thisPeriodQuantity: 10 }],
    };
    expect(codeAndPath(() => runCalc('pay-app', input))).toEqual(['INVALID_NUMBER', 'previousCertifiedCents']);
  });

  it('refuses a variance amount beyond a safe integer, naming the unit price', () => {
    const input = {
      contractQuantity: 1,
      forecastQuantity: 1e9,
      unitPriceCents: Number.MAX_SAFE_INTEGER,
      band: { overPercent: 0, underPercent: 0 },
    };
    expect(codeAndPath(() => runCalc('variance', input))).toEqual(['INVALID_NUMBER', 'unitPriceCents']);
  });
});

describe("trench limits in metres: the rule's feet x 0.3048 exactly (29 CFR 1926 Subpart P)", () => {
  const run = (depth: number) => [{ length: 10, depth, bottomWidth: 1 }];

  it('refuses the short-term 1/2:1 slope at 3.659 m (12 ft = 3.6576 m) and allows 3.6576 m', () => {
    expect(
      codeAndPath(() => trenchVolume({ unit: 'm', protection: 'slope', soilClass: 'A-short-term', runs: run(3.659) })),
    ).toEqual(['SHORT_TERM_DEPTH_EXCEEDED', 'runs.0.depth']);
    expect(
      trenchVolume({ unit: 'm', protection: 'slope', soilClass: 'A-short-term', runs: run(3.6576) }).runs,
    ).toHaveLength(1);
  });

  it('gives the registered-engineer caution from 6.096 m (20 ft) on, and not at 6.095 m', () => {
    for (const depth of [6.096, 6.097, 6.099]) {
      expect(trenchVolume({ unit: 'm', protection: 'box', runs: run(depth) }).cautions.join('\n')).toMatch(
        /registered professional engineer/,
      );
    }
    expect(trenchVolume({ unit: 'm', protection: 'box', runs: run(6.095) }).cautions.join('\n')).not.toMatch(
      /registered professional engineer/,
    );
  });

  it('needs a protective system from 1.524 m (5 ft) on', () => {
    expect(trenchVolume({ unit: 'm', protection: 'box', runs: run(1.524) }).cautions.join('\n')).toMatch(
      /1\.524 m \(5 ft\) deep or more: a protective system is required/,
    );
    expect(trenchVolume({ unit: 'm', protection: 'box', runs: run(1.523) }).cautions.join('\n')).not.toMatch(
      /deep or more: a protective system/,
    );
  });
});

describe('load count: 0.01 rounded half up on the exact decimal', () => {
  it('14 loads x 8.01 CY at 12 % swell: 112.14 / 1.12 = 100.125 exactly -> 100.13, paid 100.1', () => {
    // Loose = 14 x 8.01 = 112.14 CY; bank = loose / (1 + swell) (Nichols and Day, Moving the Earth, p. 2.51).
    const r = loadCount({ swellPercent: 12, loads: [{ capacity: 8.01, count: 14 }] });
    expect(r.looseVolume).toBe(112.14);
    expect(r.bankVolume).toBe(100.13);
    expect(r.payQuantity).toBe(100.1);
  });

  it('rounds exact halves up and the rest to nearest (decimal arithmetic, not binary)', () => {
    expect(loadCount({ swellPercent: 25, loads: [{ capacity: 0.125, count: 1 }] }).bankVolume).toBe(0.1); // 0.1 exactly
    expect(loadCount({ swellPercent: 0, loads: [{ capacity: 1.005, count: 1 }] }).bankVolume).toBe(1.01);
    expect(loadCount({ swellPercent: 0, loads: [{ capacity: 1.05, count: 1 }] }).payQuantity).toBe(1.1);
  });
});

describe('pit with side slopes on sloping ground', () => {
  it('is refused with a message pointing to the grid worksheet', () => {
    expect(
      codeAndPath(() =>
        pitVolume({ unit: 'ft', length: 60, width: 40, cornerDepths: [4.2, 5, 6.1, 5.5], sideSlope: 1.5 }),
      ),
    ).toEqual(['SLOPED_PIT_ON_SLOPING_GROUND', 'sideSlope']);
    expect(() =>
      pitVolume({ unit: 'ft', length: 60, width: 40, cornerDepths: [4.2, 5, 6.1, 5.5], sideSlope: 1.5 }),
    ).toThrow(/grid worksheet/);
  });

  it('still measures vertical sides on sloping ground and slopes on level ground', () => {
    expect(pitVolume({ unit: 'ft', length: 30, width: 18, cornerDepths: [4, 5, 6, 5] }).volume).toBeCloseTo(100, 12); // 540 x 5 / 27
    // Level ground, slope 1:1, 10 x 10 bottom, 2 deep: frustum of a pyramid 10^2 and 14^2, V = 2/3 (100 + 196 + 140).
    expect(
      pitVolume({ unit: 'm', length: 10, width: 10, cornerDepths: [2, 2, 2, 2], sideSlope: 1 }).volume,
    ).toBeCloseTo((2 / 3) * (100 + 196 + 140), 9);
  });
});
