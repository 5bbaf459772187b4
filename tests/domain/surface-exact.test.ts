import { describe, expect, it } from 'vitest';
import { DomainError } from '../../src/shared/domain/domain-error';
import { surfaceVolume, surfaceVolumeFromPoints } from '../../src/shared/domain/earthwork/surface';
import { grid, reference, rel, type P3 } from './surface-reference';

describe('the three inputs of issue 13 give the exact answers', () => {
  const existing: P3[] = [
    [0, 0, 10],
    [100, 0, 10],
    [100, 100, 10],
    [0, 100, 10],
    [50, 50, 10],
  ];
  const at9 = (ring: [number, number][]): P3[] => ring.map(([x, y]) => [x, y, 9]);

  it('a 2 x 2 ft design inside one existing triangle: 4 cu ft over 4 sq ft (geometry: 4 sq ft x 1 ft)', () => {
    const r = surfaceVolume({
      unit: 'ft',
      existing,
      design: at9([
        [20, 40],
        [22, 40],
        [22, 42],
        [20, 42],
      ]),
    });
    expect(r.cut * 27).toBeCloseTo(4, 9);
    expect(r.footprintArea).toBeCloseTo(4, 9);
    expect(r.fill).toBe(0);
  });

  it('a 50 x 50 ft design across several triangles: 2,500 cu ft over 2,500 sq ft', () => {
    const r = surfaceVolume({
      unit: 'ft',
      existing,
      design: at9([
        [40, 10],
        [90, 10],
        [90, 60],
        [40, 60],
      ]),
    });
    expect(r.cut * 27).toBeCloseTo(2500, 8);
    expect(r.footprintArea).toBeCloseTo(2500, 8);
  });

  it('a strip crossing the whole survey with no corner inside it: 1,000 cu ft over 1,000 sq ft', () => {
    const r = surfaceVolume({
      unit: 'ft',
      existing,
      design: at9([
        [10, -50],
        [20, -50],
        [20, 150],
        [10, 150],
      ]),
    });
    expect(r.cut * 27).toBeCloseTo(1000, 8);
    expect(r.footprintArea).toBeCloseTo(1000, 8);
    // Each survey's area outside the other: 10,000 - 1,000 and 2,000 - 1,000 (geometry).
    expect(r.existingOutsideArea).toBeCloseTo(9000, 8);
    expect(r.designOutsideArea).toBeCloseTo(1000, 8);
  });
});

describe('exact against the independent reference', () => {
  it('two planes crossing, different densities and footprints: analytic and reference agree to 1e-9', () => {
    // Depth = x - 30 over the overlap [20, 80] x [10, 60] (existing z = x, design z = 30): cut = 50 x (50^2 / 2),
    // fill = 50 x (10^2 / 2) (geometry).
    const existing = grid(13, 11, 0, 0, 80, 60, (x) => x, 0.3, 1);
    const design = grid(7, 9, 20, 10, 70, 50, () => 30, 0.3, 2);
    const r = surfaceVolume({ unit: 'm', existing, design });
    expect(rel(r.cut, 62_500)).toBeLessThan(1e-9);
    expect(rel(r.fill, 2_500)).toBeLessThan(1e-9);
    expect(rel(r.footprintArea, 3000)).toBeLessThan(1e-9);
    const ref = reference(existing, design);
    expect(rel(r.cut, ref.cut)).toBeLessThan(1e-9);
    expect(rel(r.fill, ref.fill)).toBeLessThan(1e-9);
  });

  it('a plane against a paraboloid: the reference to 1e-9, the analytic integral within the mesh bound', () => {
    // Paraboloid z = 10 + (x^2 + y^2) / 100 over [-10, 10]^2 against the plane z = 10. Analytic integral of the
    // depth: (1/100) x 2 x 20 x (2 x 10^3 / 3) = 266.67 m3 (calculus). The TIN of a convex surface lies above it;
    // over a right triangle of legs h the linear interpolant of (x^2 + y^2) / 100 exceeds it by h^2 / 300 on
    // average (derivation: mean h^2/3 against h^2/6 per axis), so by less than 400 x 0.7^2 / 300 with jitter.
    const para = grid(41, 41, -10, -10, 20, 20, (x, y) => 10 + (x * x + y * y) / 100, 0.2, 3);
    const plane = grid(5, 5, -10, -10, 20, 20, () => 10, 0, 4);
    const r = surfaceVolume({ unit: 'm', existing: para, design: plane });
    const ref = reference(para, plane);
    expect(rel(r.cut, ref.cut)).toBeLessThan(1e-9);
    expect(r.fill).toBeCloseTo(0, 12);
    expect(r.cut - 800 / 3).toBeGreaterThan(0);
    expect(r.cut - 800 / 3).toBeLessThan((400 * 0.7 * 0.7) / 300);
    // Against a tilted plane that crosses it: reference only.
    const tilted = grid(6, 4, -12, -9, 24, 17, (x, y) => 10.5 + 0.05 * x - 0.03 * y, 0.3, 5);
    const r2 = surfaceVolume({ unit: 'm', existing: para, design: tilted });
    const ref2 = reference(para, tilted);
    expect(rel(r2.cut, ref2.cut)).toBeLessThan(1e-9);
    expect(rel(r2.fill, ref2.fill)).toBeLessThan(1e-9);
    expect(rel(r2.footprintArea, ref2.area)).toBeLessThan(1e-9);
  });

  it('random pairs of surveys (different densities, footprints and shapes) agree with the reference to 1e-9', () => {
    // mulberry32, a small seeded generator (public domain), so every run draws the same clouds.
    const rng = (seed: number) => () => {
      seed = (seed + 0x6d2b79f5) | 0;
      let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
      t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
      return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
    };
    const cloud = (n: number, seed: number, x0: number, y0: number, w: number, h: number) => {
      const r = rng(seed);
      return Array.from({ length: n }, (): P3 => [x0 + r() * w, y0 + r() * h, 6 * r() - 3]);
    };
    for (let k = 0; k < 12; k++) {
      const existing = cloud(30 + 5 * k, 100 + k, 0, 0, 50, 40);
      const design = cloud(8 + 3 * k, 200 + k, 10 + k, -5 + k, 35, 30 + k);
      const r = surfaceVolume({ unit: 'm', existing, design });
      const ref = reference(existing, design);
      expect(rel(r.cut, ref.cut)).toBeLessThan(1e-9);
      expect(rel(r.fill, ref.fill)).toBeLessThan(1e-9);
      expect(rel(r.footprintArea, ref.area)).toBeLessThan(1e-9);
      // Swapping the surveys swaps cut and fill (geometry).
      const s = surfaceVolume({ unit: 'm', existing: design, design: existing });
      expect(rel(s.cut, r.fill)).toBeLessThan(1e-9);
    }
  });
});

describe('pay limits', () => {
  it('measures only inside the outer boundary and outside the voids', () => {
    // Existing z = 12, design z = 10 over [0, 100]^2; outer boundary an L-shape of 100 x 100 less 50 x 50
    // (7,500 sq ft) reaching beyond the surveys at x = -20 (clipped), void 10 x 20: 7,500 - 200 = 7,300 sq ft at
    // 2 ft = 14,600 cu ft (geometry).
    const existing = grid(11, 11, 0, 0, 100, 100, () => 12, 0.3, 6);
    const design = grid(6, 6, 0, 0, 100, 100, () => 10, 0.3, 7);
    const outer: [number, number][] = [
      [-20, 0],
      [100, 0],
      [100, 50],
      [50, 50],
      [50, 100],
      [-20, 100],
    ];
    const voids: [number, number][][] = [
      [
        [10, 10],
        [20, 10],
        [20, 30],
        [10, 30],
      ],
    ];
    const r = surfaceVolume({ unit: 'ft', existing, design, payLimits: { outer, voids } });
    expect(r.footprintArea).toBeCloseTo(7300, 8);
    expect(r.cut * 27).toBeCloseTo(14_600, 7);
    expect(r.payAreaUncovered).toBeCloseTo(2000, 7); // the 20 x 100 strip beyond x = 0
    expect(r.trail.join('\n')).toMatch(/Pay limits/);
  });

  it('splits cut and fill inside a non-convex boundary exactly (depth x - 50 over an L-shape)', () => {
    const existing = grid(9, 9, 0, 0, 100, 100, (x) => x, 0.3, 8);
    const design = grid(5, 5, 0, 0, 100, 100, () => 50, 0.3, 9);
    const outer: [number, number][] = [
      [0, 0],
      [100, 0],
      [100, 50],
      [50, 50],
      [50, 100],
      [0, 100],
    ];
    const r = surfaceVolume({ unit: 'm', existing, design, payLimits: { outer } });
    // Fill: x in [0, 50] over y in [0, 100]: 100 x 50^2 / 2 = 125,000; cut: x in [50, 100], y in [0, 50]: 62,500.
    expect(r.fill).toBeCloseTo(125_000, 6);
    expect(r.cut).toBeCloseTo(62_500, 6);
  });
});

describe('bad points', () => {
  const good = grid(4, 4, 0, 0, 10, 10, () => 1);
  it('refuses NaN and Infinity naming the row and the column', () => {
    const x = Float64Array.from(good.map((p) => p[0]));
    const y = Float64Array.from(good.map((p) => p[1]));
    const z = Float64Array.from(good.map((p) => p[2]));
    z[5] = NaN;
    const err = (() => {
      try {
        surfaceVolumeFromPoints('m', { x, y, z }, { x, y, z: new Float64Array(z.length) });
      } catch (e) {
        return e as DomainError;
      }
    })();
    expect(err).toBeInstanceOf(DomainError);
    expect([err!.code, err!.path]).toEqual(['INVALID_NUMBER', 'existing.5.2']);
    const x2 = x.slice();
    x2[3] = Infinity;
    expect(() =>
      surfaceVolumeFromPoints(
        'm',
        { x, y, z: new Float64Array(z.length) },
        { x: x2, y, z: new Float64Array(z.length) },
      ),
    ).toThrow(/Row 4 of the design survey: x is Infinity/);
  });

  it('reports the same plan point with two heights, and keeps a repeat with the same height once', () => {
    const twice: P3[] = [...good, [good[5]![0], good[5]![1], 7]];
    try {
      surfaceVolume({ unit: 'm', existing: twice, design: good });
      throw new Error('expected DUPLICATE_POINT');
    } catch (e) {
      expect((e as DomainError).code).toBe('DUPLICATE_POINT');
      expect((e as DomainError).path).toBe(`existing.${good.length}`);
      expect((e as DomainError).message).toMatch(/row 6/);
    }
    const same = surfaceVolume({ unit: 'm', existing: [...good, good[5]!], design: good });
    expect(same.repeatedPoints).toBe(1);
  });
});
