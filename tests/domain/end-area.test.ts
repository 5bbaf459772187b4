import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { DomainError } from '../../src/shared/domain/domain-error';
import { endAreaVolumes, type StationInput } from '../../src/shared/domain/earthwork/end-area';
import { navyShortcutCubicYards } from '../../src/shared/domain/earthwork/end-area-core';
import { M3_PER_CY } from '../../src/shared/domain/earthwork/units';

const st = (station: number, cutArea: number, fillArea = 0): StationInput => ({ station, cutArea, fillArea });

function domainError(fn: () => unknown): DomainError {
  try {
    fn();
  } catch (e) {
    if (e instanceof DomainError) return e;
    throw e;
  }
  throw new Error('expected a DomainError');
}

describe('average end area', () => {
  it('gives 222.22 CY for 50 and 70 sq ft 100 ft apart; the Navy 1.85 shortcut gives 222.0 (NAVEDTRA 14081)', () => {
    const r = endAreaVolumes({ unit: 'ft', stations: [st(0, 50), st(100, 70)] });
    expect(r.cut).toBeCloseTo(6000 / 27, 10);
    expect(r.cut.toFixed(2)).toBe('222.22');
    expect(r.volumeUnit).toBe('CY');
    expect(navyShortcutCubicYards(50, 70, 1)).toBeCloseTo(222.0, 10);
  });

  it('keeps cut and fill apart and reports one row per segment (FHWA FP Section 109 method)', () => {
    const r = endAreaVolumes({ unit: 'm', stations: [st(0, 10, 0), st(20, 0, 6), st(40, 4, 2)] });
    expect(r.segments).toHaveLength(2);
    expect(r.segments[0]).toMatchObject({ from: 0, to: 20, length: 20, cut: 100, fill: 60 });
    expect(r.cut).toBe(100 + 40);
    expect(r.fill).toBe(60 + 80);
    expect(r.net).toBe(r.cut - r.fill);
    expect(r.volumeUnit).toBe('m3');
  });

  it('uses V = A L / 3 where one end area is zero with the pyramid rule (Wikibooks, Fundamentals of Transportation)', () => {
    const r = endAreaVolumes({ unit: 'm', stations: [st(0, 0), st(30, 90)], zeroAreaEnds: 'pyramid' });
    expect(r.cut).toBeCloseTo(900, 10);
    expect(r.segments[0]!.pyramid).toBe('cut');
    expect(endAreaVolumes({ unit: 'm', stations: [st(0, 0), st(30, 90)] }).cut).toBeCloseTo(1350, 10);
  });
});

describe('prismoidal formula', () => {
  it('integrates a frustum exactly: L/3 (A1 + A2 + sqrt(A1 A2)) where the end-area method overstates it', () => {
    // Square sections whose side runs linearly from 10 to 20 m over 60 m; mid side 15.
    const stations = [st(0, 100), st(30, 225), st(60, 400)];
    const exact = (60 / 3) * (100 + 400 + Math.sqrt(100 * 400));
    const p = endAreaVolumes({ unit: 'm', stations, formula: 'prismoidal' });
    expect(p.cut).toBeCloseTo(exact, 9);
    expect(p.segments[0]).toMatchObject({ from: 0, to: 60, mid: 30 });
    const aea = endAreaVolumes({ unit: 'm', stations });
    expect(aea.cut).toBeGreaterThan(exact);
  });

  it('throws PRISMOIDAL_UNEQUAL_INTERVALS at the mid station when it is not halfway', () => {
    const e = domainError(() => endAreaVolumes({ unit: 'ft', stations: [st(0, 1), st(40, 1), st(100, 1)], formula: 'prismoidal' }));
    expect(e.code).toBe('PRISMOIDAL_UNEQUAL_INTERVALS');
    expect(e.path).toBe('stations.1.station');
  });

  it('throws PRISMOIDAL_NEEDS_ODD_STATIONS when the stations do not come in threes', () => {
    const e = domainError(() => endAreaVolumes({ unit: 'ft', stations: [st(0, 1), st(50, 1), st(100, 1), st(150, 1)], formula: 'prismoidal' }));
    expect(e.code).toBe('PRISMOIDAL_NEEDS_ODD_STATIONS');
    expect(e.path).toBe('stations');
  });
});

describe('stations', () => {
  it('throws STATIONS_NOT_INCREASING with the path of the station that goes back', () => {
    const e = domainError(() => endAreaVolumes({ unit: 'ft', stations: [st(0, 1), st(50, 1), st(50, 1)] }));
    expect(e.code).toBe('STATIONS_NOT_INCREASING');
    expect(e.path).toBe('stations.2.station');
  });
});

describe('spacing check (common practice thresholds, from memory)', () => {
  it('flags a long segment whose area changes fast and estimates the overstatement', () => {
    const r = endAreaVolumes({ unit: 'ft', stations: [st(0, 0), st(40, 10), st(200, 400), st(240, 410)] });
    expect(r.spacing.flaggedCount).toBe(1);
    const f = r.spacing.flagged[0]!;
    expect(f).toMatchObject({ from: 40, to: 200, length: 160 });
    expect(f.estimatedOverstatement).toBeCloseTo(((160 / 6) * (Math.sqrt(10) - Math.sqrt(400)) ** 2) / 27, 9);
  });

  it('reports how the totals move when every other section is dropped (first and last kept)', () => {
    const r = endAreaVolumes({ unit: 'm', stations: [st(0, 0), st(10, 100), st(20, 0)] });
    const d = r.spacing.dropEveryOther!;
    expect(d.keptStations).toBe(2);
    expect(d.cut).toBe(0);
    expect(d.cutChange).toBe(-1000);
    expect(d.cutChangePercent).toBe(-100);
    expect(r.trail.some((line) => line.startsWith('Dropping every other section'))).toBe(true);
  });
});

const stationsArb = fc
  .array(fc.record({ gap: fc.double({ min: 1, max: 100, noNaN: true }), cut: fc.double({ min: 0, max: 500, noNaN: true }), fill: fc.double({ min: 0, max: 500, noNaN: true }) }), { minLength: 3, maxLength: 30 })
  .map((rows) => {
    let s = 1000;
    return rows.map((r) => ((s += r.gap), st(s, r.cut, r.fill)));
  });

describe('end-area properties', () => {
  it('is non-negative and additive over split runs, for both zero-area rules', () => {
    fc.assert(
      fc.property(stationsArb, fc.nat(), fc.constantFrom('average' as const, 'pyramid' as const), (stations, k, rule) => {
        const split = 1 + (k % (stations.length - 2));
        const all = endAreaVolumes({ unit: 'ft', stations, zeroAreaEnds: rule });
        const a = endAreaVolumes({ unit: 'ft', stations: stations.slice(0, split + 1), zeroAreaEnds: rule });
        const b = endAreaVolumes({ unit: 'ft', stations: stations.slice(split), zeroAreaEnds: rule });
        expect(all.cut).toBeGreaterThanOrEqual(0);
        expect(all.fill).toBeGreaterThanOrEqual(0);
        expect(a.cut + b.cut).toBeCloseTo(all.cut, 6);
        expect(a.fill + b.fill).toBeCloseTo(all.fill, 6);
      }),
    );
  });

  it('is symmetric under running the stations the other way (mirrored chainage)', () => {
    fc.assert(
      fc.property(stationsArb, (stations) => {
        const mirrored = stations.map((s) => st(-s.station, s.cutArea, s.fillArea)).reverse();
        const a = endAreaVolumes({ unit: 'm', stations });
        const b = endAreaVolumes({ unit: 'm', stations: mirrored });
        expect(b.cut).toBeCloseTo(a.cut, 6);
        expect(b.fill).toBeCloseTo(a.fill, 6);
      }),
    );
  });

  it('gives the same volume in CY x 0.764554857984 as in m3 for the same ground (1 yd = 0.9144 m exactly)', () => {
    fc.assert(
      fc.property(stationsArb, (stations) => {
        const ft = endAreaVolumes({ unit: 'ft', stations });
        const m = endAreaVolumes({ unit: 'm', stations: stations.map((s) => st(s.station * 0.3048, s.cutArea * 0.3048 ** 2, s.fillArea * 0.3048 ** 2)) });
        expect(m.cut).toBeCloseTo(ft.cut * M3_PER_CY, 6);
        expect(m.fill).toBeCloseTo(ft.fill * M3_PER_CY, 6);
      }),
    );
  });
});
