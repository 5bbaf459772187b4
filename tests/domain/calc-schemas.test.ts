import { describe, expect, it } from 'vitest';
import { CALC_METHODS } from '../../src/shared/constants';
import { calcMethods, runCalc } from '../../src/shared/domain/calc';
import { DomainError } from '../../src/shared/domain/domain-error';
import { CALC_LIMITS } from '../../src/shared/schemas/calc';

/** The first issue path and all paths of a rejected call. */
function rejected(method: string, input: unknown): { code: string; paths: string[] } {
  try {
    runCalc(method, input);
  } catch (e) {
    if (e instanceof DomainError) return { code: e.code, paths: e.issues.map((i) => i.path) };
    throw e;
  }
  throw new Error('expected a DomainError');
}

const valid: Record<(typeof CALC_METHODS)[number], unknown> = {
  section: { unit: 'ft', ground: [[0, 10], [20, 12]], design: [[0, 9], [20, 9]] },
  'end-area': { unit: 'ft', stations: [{ station: 0, cutArea: 50, fillArea: 0 }, { station: 100, cutArea: 70, fillArea: 0 }] },
  grid: { unit: 'ft', spacingX: 50, spacingY: 50, depths: [[1, 1.5, 2], [1.5, 2, 2.5], [2, 2.5, 3]] },
  pit: { unit: 'm', length: 10, width: 5, cornerDepths: [1, 2, 2, 1] },
  trench: { unit: 'ft', protection: 'slope', soilClass: 'B', runs: [{ length: 100, depth: 10, bottomWidth: 4 }] },
  convert: { volume: 100, from: 'bank', to: 'loose', swellPercent: 25, shrinkagePercent: 10 },
  'load-count': { swellPercent: 25, loads: [{ capacity: 14, count: 3 }] },
  spoil: { unit: 'ft', shape: 'pile', bankVolume: 68.3, swellPercent: 0, angleOfReposeDeg: 37 },
  'mass-haul': { unit: 'm', stations: [{ station: 0, cutArea: 0, fillArea: 0 }, { station: 10, cutArea: 150, fillArea: 0 }, { station: 20, cutArea: 0, fillArea: 150 }], freeHaul: 5 },
  surface: { unit: 'm', existing: [[0, 0, 1], [10, 0, 1], [0, 10, 1], [10, 10, 1]], design: [[0, 0, 0], [10, 0, 0], [0, 10, 0], [10, 10, 0]] },
  variance: { contractQuantity: 10_000, forecastQuantity: 12_000, unitPriceCents: 1250, band: { overPercent: 15, underPercent: 15 } },
  'pay-app': { retainagePercent: 10, previousCertifiedCents: 0, lines: [{ unitPriceCents: 1250, contractQuantity: 100, previousQuantity: 0, thisPeriodQuantity: 10 }] },
};

describe('runCalc', () => {
  it('answers every method with its result, unit and trail', () => {
    expect(Object.keys(calcMethods).sort()).toEqual([...CALC_METHODS].sort());
    for (const method of CALC_METHODS) {
      const result = runCalc(method, valid[method]) as { trail: string[] };
      expect(Array.isArray(result.trail), method).toBe(true);
      expect(result.trail.length, method).toBeGreaterThan(0);
    }
    expect(runCalc('end-area', valid['end-area'])).toMatchObject({ volumeUnit: 'CY', segments: [{ from: 0, to: 100, length: 100 }] });
    expect(runCalc('section', valid.section)).toMatchObject({ areaUnit: 'sq ft' });
    expect(runCalc('variance', valid.variance)).toMatchObject({ status: 'over', quantityBeyondBand: 500 });
  });

  it('throws UNKNOWN_CALC_METHOD for a method that does not exist', () => {
    expect(rejected('volume', {}).code).toBe('UNKNOWN_CALC_METHOD');
  });

  it('passes engine errors through with their path (prismoidal intervals)', () => {
    const stations = [0, 40, 100].map((station) => ({ station, cutArea: 1, fillArea: 0 }));
    expect(rejected('end-area', { unit: 'ft', stations, formula: 'prismoidal' })).toEqual({ code: 'PRISMOIDAL_UNEQUAL_INTERVALS', paths: ['stations.1.station'] });
  });
});

describe('calc schemas reject bad input with field paths', () => {
  const cases: [string, string, unknown, string][] = [
    ['non-increasing stations', 'end-area', { unit: 'ft', stations: [{ station: 0, cutArea: 1, fillArea: 0 }, { station: 50, cutArea: 1, fillArea: 0 }, { station: 50, cutArea: 1, fillArea: 0 }, { station: 40, cutArea: 1, fillArea: 0 }] }, 'stations.2.station'],
    ['a negative end area', 'end-area', { unit: 'ft', stations: [{ station: 0, cutArea: -1, fillArea: 0 }, { station: 50, cutArea: 1, fillArea: 0 }] }, 'stations.0.cutArea'],
    ['an unknown station field', 'end-area', { unit: 'ft', stations: [{ station: 0, cutArea: 1, fillArea: 0 }, { station: 50, cutArea: 1, fillArea: 0, note: 'x' }] }, 'stations.1.note'],
    ['a station that is not an object', 'end-area', { unit: 'ft', stations: [{ station: 0, cutArea: 1, fillArea: 0 }, 50] }, 'stations.1'],
    ['a missing fill area', 'mass-haul', { unit: 'm', freeHaul: 10, stations: [{ station: 0, cutArea: 1 }, { station: 50, cutArea: 1, fillArea: 0 }] }, 'stations.0.fillArea'],
    ['a wrong unit', 'end-area', { unit: 'yd', stations: [] }, 'unit'],
    ['a misspelt optional field', 'end-area', { unit: 'ft', stations: [{ station: 0, cutArea: 1, fillArea: 0 }, { station: 1, cutArea: 1, fillArea: 0 }], formulae: 'prismoidal' }, ''],
    ['offsets going back', 'section', { unit: 'm', ground: [[0, 1], [5, 1], [4, 1]], design: [[0, 0], [5, 0]] }, 'ground.2.0'],
    ['a ragged grid', 'grid', { unit: 'ft', spacingX: 10, spacingY: 10, depths: [[1, 2, 3], [1, 2, 3], [1, 2]] }, 'depths.2'],
    ['a grid node that is a string', 'grid', { unit: 'ft', spacingX: 10, spacingY: 10, depths: [[1, 2], [1, '2']] }, 'depths.1.1'],
    ['a zero grid spacing', 'grid', { unit: 'ft', spacingX: 0, spacingY: 10, depths: [[1, 2], [1, 2]] }, 'spacingX'],
    ['a negative pit width', 'pit', { unit: 'ft', length: 10, width: -5, cornerDepths: [1, 1, 1, 1] }, 'width'],
    ['three corner depths', 'pit', { unit: 'ft', length: 10, width: 5, cornerDepths: [1, 1, 1] }, 'cornerDepths'],
    ['a missing soil class when sloping', 'trench', { unit: 'ft', protection: 'slope', runs: [{ length: 10, depth: 6, bottomWidth: 3 }] }, 'soilClass'],
    ['a negative trench depth', 'trench', { unit: 'ft', protection: 'box', runs: [{ length: 10, depth: -6, bottomWidth: 3 }] }, 'runs.0.depth'],
    ['a fractional load count', 'load-count', { swellPercent: 25, loads: [{ capacity: 14, count: 2.5 }] }, 'loads.0.count'],
    ['a spoil bank without its length', 'spoil', { unit: 'ft', shape: 'bank', bankVolume: 10, swellPercent: 25, angleOfReposeDeg: 34 }, 'length'],
    ['a surface point with two numbers', 'surface', { unit: 'm', existing: [[0, 0, 1], [1, 0, 1], [0, 1]], design: [[0, 0, 0], [1, 0, 0], [0, 1, 0]] }, 'existing.2'],
    ['a surface point that is not a number', 'surface', { unit: 'm', existing: [[0, 0, 1], [1, 0, 1], [0, 1, 1]], design: [[0, 0, 0], [1, 0, 0], [0, 1, 'x']] }, 'design.2.2'],
    ['fractional cents', 'variance', { contractQuantity: 10, forecastQuantity: 12, unitPriceCents: 12.5, band: { overPercent: 15, underPercent: 15 } }, 'unitPriceCents'],
    ['a quantity to date below zero', 'pay-app', { retainagePercent: 10, previousCertifiedCents: 0, lines: [{ unitPriceCents: 1, contractQuantity: 1, previousQuantity: 1, thisPeriodQuantity: -3 }] }, 'lines.0.thisPeriodQuantity'],
    ['retainage over 100 %', 'pay-app', { retainagePercent: 120, previousCertifiedCents: 0, lines: [] }, 'retainagePercent'],
  ];
  it.each(cases)('rejects %s (%s) at its path', (_name, method, input, path) => {
    const r = rejected(method, input);
    expect(r.code).toBe('VALIDATION_FAILED');
    if (path) expect(r.paths).toContain(path);
  });

  it('rejects NaN and Infinity (zod 4 numbers are finite), not only what JSON can carry', () => {
    expect(rejected('convert', { volume: NaN, from: 'bank', to: 'loose', swellPercent: 25, shrinkagePercent: 10 }).paths).toEqual(['volume']);
    expect(rejected('convert', { volume: Infinity, from: 'bank', to: 'loose', swellPercent: 25, shrinkagePercent: 10 }).paths).toEqual(['volume']);
  });

  it('rejects arrays beyond the stated limits before computing', () => {
    const stations = Array.from({ length: CALC_LIMITS.stations + 1 }, (_, i) => ({ station: i, cutArea: 0, fillArea: 0 }));
    expect(rejected('end-area', { unit: 'ft', stations }).paths).toEqual(['stations']);
    const depths = Array.from({ length: 1001 }, () => new Array(1000).fill(0));
    expect(rejected('grid', { unit: 'ft', spacingX: 1, spacingY: 1, depths }).paths).toEqual(['depths']);
    expect(CALC_LIMITS).toMatchObject({ gridNodes: 1_000_000, surfacePoints: 1_000_000, stations: 100_000 });
  });
});
