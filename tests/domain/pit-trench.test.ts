import { describe, expect, it } from 'vitest';
import { DomainError } from '../../src/shared/domain/domain-error';
import { pitVolume } from '../../src/shared/domain/earthwork/pit';
import { backfillVolume, trenchVolume } from '../../src/shared/domain/earthwork/trench';
import { TABLE_B1 } from '../../src/shared/domain/earthwork/trench-slopes';

function codeAndPath(fn: () => unknown): [string, string] {
  try {
    fn();
  } catch (e) {
    if (e instanceof DomainError) return [e.code, e.path];
    throw e;
  }
  throw new Error('expected a DomainError');
}

describe('pitVolume', () => {
  it('multiplies plan area by the mean corner depth (common practice, reference section 1)', () => {
    const r = pitVolume({ unit: 'ft', length: 30, width: 18, cornerDepths: [4, 5, 6, 5] });
    expect(r.averageDepth).toBe(5);
    expect(r.volume).toBeCloseTo((30 * 18 * 5) / 27, 12);
    expect(r.method).toBe('average-depth');
  });

  it('is exact for a prismoid with side slopes (identity: LWd + (L+W) s d^2 + 4/3 s^2 d^3)', () => {
    const [L, W, d, s] = [20, 10, 3, 1.5];
    const r = pitVolume({ unit: 'm', length: L, width: W, cornerDepths: [d, d, d, d], sideSlope: s });
    expect(r.volume).toBeCloseTo(L * W * d + (L + W) * s * d * d + (4 / 3) * s * s * d ** 3, 10);
    expect(r.top).toEqual({ length: 29, width: 19, area: 29 * 19 });
  });
});

describe('trenchVolume: OSHA 29 CFR 1926 Subpart P App. B, Table B-1', () => {
  it('holds the published maximum slopes (H:V): rock vertical, A 3/4:1, short-term A 1/2:1, B 1:1, C 1-1/2:1', () => {
    expect(
      Object.fromEntries(Object.entries(TABLE_B1).map(([k, v]) => [k, [v.horizontalPerVertical, v.degrees]])),
    ).toEqual({
      'stable-rock': [0, 90],
      A: [0.75, 53],
      'A-short-term': [0.5, 63],
      B: [1, 45],
      C: [1.5, 34],
    });
  });

  it('gives 24 ft (Type B) and 34 ft (Type C) top widths for a 10 ft deep trench with a 4 ft bottom', () => {
    const run = [{ length: 100, depth: 10, bottomWidth: 4 }];
    expect(trenchVolume({ unit: 'ft', protection: 'slope', soilClass: 'B', runs: run }).runs[0]!.topWidth).toBe(24);
    expect(trenchVolume({ unit: 'ft', protection: 'slope', soilClass: 'C', runs: run }).runs[0]!.topWidth).toBe(34);
  });

  it('gives 6,600 cu ft = 244 CY and 207.4 CY of backfill for the textbook trench (Measuring Excavation and Sitework, ch. 3)', () => {
    const r = trenchVolume({ unit: 'ft', protection: 'box', runs: [{ length: 100, depth: 6, bottomWidth: 11 }] });
    expect(r.volume * 27).toBeCloseTo(6600, 9);
    expect(Math.round(r.volume)).toBe(244);
    expect(backfillVolume(r.volume, [600, 400], 'ft').toFixed(1)).toBe('207.4');
  });

  it('cautions at 5 ft and at 20 ft and deeper (1926.652(a)(1), (b)(4)), and always about the spoil setback', () => {
    const r = trenchVolume({
      unit: 'ft',
      protection: 'slope',
      soilClass: 'B',
      runs: [
        { length: 10, depth: 4.9, bottomWidth: 3 },
        { length: 10, depth: 5, bottomWidth: 3 },
        { length: 10, depth: 20, bottomWidth: 3 },
      ],
    });
    const text = r.cautions.join('\n');
    expect(text).toMatch(/Runs 2, 3 are 5 ft \(1\.524 m\) deep or more: a protective system is required/);
    expect(text).toMatch(/Run 3 is 20 ft \(6\.096 m\) deep or more.*registered professional engineer/);
    expect(text).toMatch(/2 ft \(0\.6096 m\) from the edge/);
    expect(text).toMatch(/competent person/);
  });

  it('uses the metric thresholds 1.524 m and 6.096 m (5 ft and 20 ft x 0.3048 exactly) in metric projects', () => {
    const r = trenchVolume({
      unit: 'm',
      protection: 'box',
      runs: [
        { length: 10, depth: 1.51, bottomWidth: 1 },
        { length: 10, depth: 6.1, bottomWidth: 1 },
      ],
    });
    expect(r.cautions.join('\n')).toMatch(/Run 2 is 1\.524 m \(5 ft\) deep or more/);
    expect(r.cautions.join('\n')).toMatch(/Run 2 is 6\.096 m \(20 ft\) deep or more/);
    expect(r.volumeUnit).toBe('m3');
  });

  it("refuses the short-term 1/2:1 slope deeper than 12 ft, at that run's depth", () => {
    const runs = [
      { length: 10, depth: 12, bottomWidth: 3 },
      { length: 10, depth: 12.5, bottomWidth: 3 },
    ];
    expect(
      codeAndPath(() => trenchVolume({ unit: 'ft', protection: 'slope', soilClass: 'A-short-term', runs })),
    ).toEqual(['SHORT_TERM_DEPTH_EXCEEDED', 'runs.1.depth']);
  });

  it('needs a soil class to slope, and refuses to bench Type C', () => {
    const runs = [{ length: 10, depth: 6, bottomWidth: 3 }];
    expect(codeAndPath(() => trenchVolume({ unit: 'ft', protection: 'slope', runs }))).toEqual([
      'SOIL_CLASS_REQUIRED',
      'soilClass',
    ]);
    expect(codeAndPath(() => trenchVolume({ unit: 'ft', protection: 'bench', soilClass: 'C', runs }))).toEqual([
      'BENCHING_NOT_ALLOWED',
      'soilClass',
    ]);
  });

  it('benches within the slope envelope in steps of at most 4 ft (App. B Figure B-1, from memory): less than the sloped section', () => {
    const runs = [{ length: 100, depth: 10, bottomWidth: 4 }];
    const bench = trenchVolume({ unit: 'ft', protection: 'bench', soilClass: 'B', runs });
    const slope = trenchVolume({ unit: 'ft', protection: 'slope', soilClass: 'B', runs });
    expect(bench.runs[0]!.benches).toBe(3);
    // Area = b d + s d^2 (1 - 1/k): 40 + 100 x 2/3.
    expect(bench.runs[0]!.area).toBeCloseTo(40 + 100 * (2 / 3), 10);
    expect(bench.volume).toBeLessThan(slope.volume);
    expect(bench.runs[0]!.topWidth).toBe(24);
  });
});
