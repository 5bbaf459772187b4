import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { surfaceVolume, pointsFromRows } from '../../src/shared/domain/earthwork/surface';
import { HeightBounds, strictlyInsideHull } from '../../src/shared/domain/earthwork/surface-bounds';
import { measure } from '../../src/shared/domain/earthwork/surface-measure';
import { PayRegion } from '../../src/shared/domain/earthwork/surface-pay';
import { buildTin } from '../../src/shared/domain/earthwork/surface-tin';
import { grid, reference, rel, type P3 } from './surface-reference';

/**
 * Triangles whose depth keeps one sign are taken whole (surface-measure.ts): each prism is plan area x mean
 * height, and the design's volume under all of them together comes from the design's own triangles. The answer
 * must stay the exact one: checked against the independent reference (every pair of triangles intersected with
 * polygon-clipping, surface-reference.ts) to 1e-9, and against the full overlay where the reference has no pay
 * limits.
 */
describe('triangles taken whole', () => {
  it('gives the exact answer where broad bands of cut and of fill alternate (reference, 1e-9)', () => {
    // Existing ground in waves about the design plane: wide cut and fill bands, both taken whole away from the
    // lines where the surfaces cross.
    const existing = grid(26, 22, 0, 0, 250, 210, (x, y) => 10 + 3 * Math.sin(x / 25) + 0.004 * y, 0.3, 11);
    const design = grid(17, 15, 12, -8, 220, 200, (x) => 10.2 + 0.003 * x, 0.3, 12);
    const r = surfaceVolume({ unit: 'm', existing, design });
    const ref = reference(existing, design);
    expect(r.overlay.wholeTriangles).toBeGreaterThan(r.overlay.existingTriangles / 3);
    expect(r.cut).toBeGreaterThan(1000);
    expect(r.fill).toBeGreaterThan(1000);
    expect(rel(r.cut, ref.cut)).toBeLessThan(1e-9);
    expect(rel(r.fill, ref.fill)).toBeLessThan(1e-9);
    expect(rel(r.footprintArea, ref.area)).toBeLessThan(1e-9);
    expect(r.trail.join('\n')).toMatch(/taken whole/);
  });

  it('keeps its digits at high elevations (5,000 ft ground, depths of a foot): reference, 1e-9', () => {
    const existing = grid(21, 21, 0, 0, 200, 200, (x, y) => 5000 + Math.sin(x / 30) + 0.002 * y, 0.3, 13);
    const design = grid(12, 13, -5, 3, 210, 190, () => 5000.1, 0.3, 14);
    const r = surfaceVolume({ unit: 'ft', existing, design });
    const ref = reference(existing, design);
    expect(r.overlay.wholeTriangles).toBeGreaterThan(0);
    expect(rel(r.cut * 27, ref.cut)).toBeLessThan(1e-9);
    expect(rel(r.fill * 27, ref.fill)).toBeLessThan(1e-9);
  });

  it('random smooth pairs of different densities and footprints agree with the reference to 1e-9', () => {
    fc.assert(
      fc.property(
        fc.record({
          nx: fc.integer({ min: 6, max: 14 }),
          ny: fc.integer({ min: 6, max: 14 }),
          mx: fc.integer({ min: 4, max: 12 }),
          my: fc.integer({ min: 4, max: 12 }),
          shiftX: fc.double({ min: -30, max: 30, noNaN: true }),
          shiftY: fc.double({ min: -30, max: 30, noNaN: true }),
          amp: fc.double({ min: 0, max: 4, noNaN: true }),
          wave: fc.double({ min: 8, max: 60, noNaN: true }),
          tilt: fc.double({ min: -0.05, max: 0.05, noNaN: true }),
          level: fc.double({ min: -3, max: 3, noNaN: true }),
          seed: fc.integer({ min: 1, max: 1000 }),
        }),
        (k) => {
          const existing = grid(
            k.nx,
            k.ny,
            0,
            0,
            100,
            80,
            (x, y) => k.amp * Math.sin(x / k.wave) + k.tilt * y,
            0.3,
            k.seed,
          );
          const design = grid(k.mx, k.my, k.shiftX, k.shiftY, 90, 85, (x) => k.level + 0.01 * x, 0.3, k.seed + 1);
          const r = surfaceVolume({ unit: 'm', existing, design });
          const ref = reference(existing, design);
          expect(rel(r.cut, ref.cut)).toBeLessThan(1e-9);
          expect(rel(r.fill, ref.fill)).toBeLessThan(1e-9);
          expect(rel(r.footprintArea, ref.area)).toBeLessThan(1e-9);
        },
      ),
      { numRuns: 30, seed: 1305 },
    );
  });

  it('with pay limits (outer boundary and a void) answers what the full overlay answers, to 1e-9', () => {
    const existing = grid(30, 30, 0, 0, 300, 300, (x, y) => 10 + 3 * Math.sin(x / 40) * Math.cos(y / 60), 0.3, 15);
    const design = grid(20, 18, 10, 5, 280, 290, (x, y) => 10.5 - 0.002 * x + 0.001 * y, 0.3, 16);
    const payLimits = {
      outer: [
        [-20, 20],
        [260, 20],
        [260, 150],
        [150, 150],
        [150, 280],
        [-20, 280],
      ] as [number, number][],
      voids: [
        [
          [40, 60],
          [90, 60],
          [90, 120],
          [40, 120],
        ] as [number, number][],
      ],
    };
    const r = surfaceVolume({ unit: 'm', existing, design, payLimits });
    expect(r.overlay.wholeTriangles).toBeGreaterThan(0);
    const e = buildTin(pointsFromRows(existing), 0, 0, 'existing');
    const d = buildTin(pointsFromRows(design), 0, 0, 'design');
    const full = measure(e, d, new PayRegion(payLimits, 0, 0, [-20, -10, 300, 300]), true);
    expect(full.whole).toBe(0);
    expect(rel(r.cut, full.cut)).toBeLessThan(1e-9);
    expect(rel(r.fill, full.fill)).toBeLessThan(1e-9);
    expect(rel(r.footprintArea, full.area)).toBeLessThan(1e-9);
  });
});

describe('the bounds that decide it', () => {
  const rng = (seed: number) => () => {
    // mulberry32 (public domain), seeded so every run draws the same points.
    seed = (seed + 0x6d2b79f5) | 0;
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };

  it('HeightBounds holds every height of the mesh over a box (sampled through the mesh)', () => {
    const r = rng(7);
    const pts: P3[] = Array.from({ length: 300 }, () => [r() * 100, r() * 60, 20 * r() - 10]);
    const tin = buildTin(pointsFromRows(pts), 0, 0, 'design');
    const bounds = new HeightBounds(tin);
    const out = new Float64Array(2);
    for (let k = 0; k < 200; k++) {
      const x0 = r() * 100,
        y0 = r() * 60;
      const x1 = x0 + r() * 10,
        y1 = y0 + r() * 10;
      bounds.range(x0, y0, x1, y1, out);
      for (let s = 0; s < 20; s++) {
        const x = x0 + r() * (x1 - x0),
          y = y0 + r() * (y1 - y0);
        const t = tin.locator.locate(x, y, true);
        if (t < 0) continue;
        const z = tin.locator.interpolate(t, x, y, tin.z);
        expect(z).toBeGreaterThanOrEqual(out[0]! - 1e-12);
        expect(z).toBeLessThanOrEqual(out[1]! + 1e-12);
      }
    }
  });

  it('strictlyInsideHull answers inside only for points inside, never for points on the edge', () => {
    // A square survey with points along its edges: the hull is the square (geometry).
    const square = grid(6, 6, 0, 0, 50, 50, () => 0, 0.3, 1);
    const tin = buildTin(pointsFromRows(square), 0, 0, 'design');
    const probe = Float64Array.from([25, 25, 0, 0, 50, 25, 10, 0, 0.001, 0.001, 49.999, 49.999, 50.001, 25, -1, -1]);
    expect([...strictlyInsideHull(tin, probe)]).toEqual([1, 0, 0, 0, 1, 1, 0, 0]);
  });
});
