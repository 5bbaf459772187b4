import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { DomainError } from '../../src/shared/domain/domain-error';
import { surfaceVolume, type SurfaceInput } from '../../src/shared/domain/earthwork/surface';
import { M3_PER_CY } from '../../src/shared/domain/earthwork/units';

type P3 = [number, number, number];

/** Scattered points over a rectangle (deterministic jitter) with heights from f. */
function survey(nx: number, ny: number, w: number, h: number, f: (x: number, y: number) => number, seed = 1): P3[] {
  const pts: P3[] = [];
  for (let i = 0; i < ny; i++) {
    for (let j = 0; j < nx; j++) {
      const k = i * nx + j + seed * 1000;
      const jx = i === 0 || i === ny - 1 || j === 0 || j === nx - 1 ? 0 : 0.3 * Math.sin(k * 12.9898);
      const jy = i === 0 || i === ny - 1 || j === 0 || j === nx - 1 ? 0 : 0.3 * Math.cos(k * 78.233);
      const x = ((j + jx) * w) / (nx - 1);
      const y = ((i + jy) * h) / (ny - 1);
      pts.push([x, y, f(x, y)]);
    }
  }
  return pts;
}

describe('surfaceVolume', () => {
  it('is exact for two planes over the same footprint (identity)', () => {
    const r = surfaceVolume({
      unit: 'm',
      existing: survey(9, 7, 40, 30, (x, y) => 100 + 0.05 * x + 0.02 * y),
      design: survey(6, 5, 40, 30, () => 99, 2),
    });
    // Mean depth over the rectangle: 1 + 0.05 x 20 + 0.02 x 15 = 2.3 m.
    expect(r.footprintArea).toBeCloseTo(1200, 9);
    expect(r.cut).toBeCloseTo(1200 * 2.3, 8);
    expect(r.fill).toBeCloseTo(0, 12);
    expect(r.overlay.pieces).toBeGreaterThan(r.overlay.existingTriangles);
  });

  it('splits cut and fill exactly where two planes cross', () => {
    // Depth x - 10 over 0..40 x 0..30: fill 10 x 30 x 5 = 1,500, cut 30 x 30 x 15 = 13,500.
    const r = surfaceVolume({
      unit: 'm',
      existing: survey(8, 6, 40, 30, (x) => x),
      design: survey(5, 4, 40, 30, () => 10, 3),
    });
    expect(r.cut).toBeCloseTo(13_500, 7);
    expect(r.fill).toBeCloseTo(1_500, 7);
    expect(r.net).toBeCloseTo(12_000, 7);
  });

  it("works over the shared footprint only, clipping triangles to the other survey's boundary", () => {
    // Design covers x 10..30 of the existing 0..40: shared 20 x 30 = 600 sq ft, depth 3 ft.
    const design = survey(5, 7, 20, 30, () => 0, 4).map(([x, y, z]): P3 => [x + 10, y, z]);
    const r = surfaceVolume({ unit: 'ft', existing: survey(9, 7, 40, 30, () => 3), design });
    expect(r.footprintArea).toBeCloseTo(600, 8);
    expect(r.cut).toBeCloseTo((600 * 3) / 27, 8);
    expect(r.volumeUnit).toBe('CY');
  });

  it('throws DEGENERATE_SURFACE for collinear points and NO_OVERLAP for surveys apart', () => {
    const line: P3[] = [
      [0, 0, 1],
      [1, 1, 1],
      [2, 2, 1],
    ];
    expect(() => surfaceVolume({ unit: 'm', existing: line, design: survey(3, 3, 1, 1, () => 0) })).toThrow(
      DomainError,
    );
    const far = survey(3, 3, 1, 1, () => 0).map(([x, y, z]): P3 => [x + 100, y, z]);
    expect(() => surfaceVolume({ unit: 'm', existing: survey(3, 3, 1, 1, () => 0), design: far })).toThrow(
      /do not overlap/,
    );
  });
});

const bumps = fc.record({
  a: fc.double({ min: -3, max: 3, noNaN: true }),
  b: fc.double({ min: -3, max: 3, noNaN: true }),
  c: fc.double({ min: 0.05, max: 0.5, noNaN: true }),
});

function input(
  unit: 'ft' | 'm',
  s: number,
  e: { a: number; b: number; c: number },
  d: { a: number; b: number; c: number },
): SurfaceInput {
  return {
    unit,
    existing: survey(7, 6, 30 * s, 25 * s, (x, y) => s * (e.a + Math.sin((e.c * x) / s) * e.b + (0.1 * y) / s), 5),
    design: survey(6, 5, 30 * s, 25 * s, (x, y) => s * (d.a + Math.cos((d.c * y) / s) * d.b + (0.05 * x) / s), 6),
  };
}

describe('surface properties', () => {
  it('swaps cut and fill exactly when the two surveys swap, and never goes negative', () => {
    fc.assert(
      fc.property(bumps, bumps, (e, d) => {
        const a = surfaceVolume(input('m', 1, e, d));
        const b = surfaceVolume({
          unit: 'm',
          existing: input('m', 1, e, d).design,
          design: input('m', 1, e, d).existing,
        });
        expect(a.cut).toBeGreaterThanOrEqual(0);
        expect(a.fill).toBeGreaterThanOrEqual(0);
        expect(b.cut).toBeCloseTo(a.fill, 6);
        expect(b.fill).toBeCloseTo(a.cut, 6);
      }),
      { numRuns: 40 },
    );
  });

  it('is symmetric under mirroring x', () => {
    fc.assert(
      fc.property(bumps, bumps, (e, d) => {
        const i = input('m', 1, e, d);
        const mirror = (p: readonly (readonly [number, number, number])[]) => p.map(([x, y, z]): P3 => [-x, y, z]);
        const a = surfaceVolume(i);
        const b = surfaceVolume({ unit: 'm', existing: mirror(i.existing), design: mirror(i.design) });
        expect(b.cut).toBeCloseTo(a.cut, 6);
        expect(b.fill).toBeCloseTo(a.fill, 6);
      }),
      { numRuns: 40 },
    );
  });

  it('gives CY x 0.764554857984 in m3 for the same ground surveyed in metres', () => {
    fc.assert(
      fc.property(bumps, bumps, (e, d) => {
        const ft = surfaceVolume(input('ft', 1, e, d));
        const m = surfaceVolume(input('m', 0.3048, e, d));
        expect(m.cut).toBeCloseTo(ft.cut * M3_PER_CY, 5);
        expect(m.fill).toBeCloseTo(ft.fill * M3_PER_CY, 5);
      }),
      { numRuns: 40 },
    );
  });
});

describe('point location', () => {
  it('finds by walking the mesh the triangle that holds each point (checked by barycentric coordinates)', async () => {
    const { default: Delaunator } = await import('delaunator');
    const { TinLocator } = await import('../../src/shared/domain/earthwork/surface-locate');
    const pts = survey(15, 12, 40, 30, (x, y) => Math.sin(x / 5) + y / 10, 8);
    const coords = new Float64Array(pts.flatMap(([x, y]) => [x, y]));
    const mesh = new Delaunator(coords);
    const locator = new TinLocator(mesh, coords);
    let inside = 0;
    for (const [x, y] of survey(23, 19, 50, 36, () => 0, 9).map(([x, y]) => [x - 5, y - 3])) {
      const t = locator.locate(x!, y!);
      if (t < 0) continue;
      inside++;
      const [a, b, c] = [0, 1, 2].map((k) => mesh.triangles[3 * t + k]!);
      const cross = (i: number, j: number) =>
        (coords[2 * j]! - coords[2 * i]!) * (y! - coords[2 * i + 1]!) -
        (coords[2 * j + 1]! - coords[2 * i + 1]!) * (x! - coords[2 * i]!);
      const s = [cross(a!, b!), cross(b!, c!), cross(c!, a!)];
      expect(s.every((v) => v >= -1e-9) || s.every((v) => v <= 1e-9)).toBe(true);
    }
    expect(inside).toBeGreaterThan(200);
  });
});
