import Delaunator from 'delaunator';
import polygonClipping, { type Pair } from 'polygon-clipping';
import { describe, expect, it } from 'vitest';
import { DomainError } from '../../src/shared/domain/domain-error';
import { surfaceVolume, surfaceVolumeFromPoints } from '../../src/shared/domain/earthwork/surface';

/**
 * Issue 13, item 1: the exact volume between two triangulated surfaces. The reference below is written here, not
 * taken from the engine: both surveys are triangulated with delaunator, EVERY pair of triangles is intersected
 * with polygon-clipping (a general-purpose npm library), each intersection is fanned into triangles, and each
 * triangle's prism is split along the zero-depth line in closed form (triangular-prism method, surveying texts;
 * reference.md section 9: prism volume = plan area x mean of its three depths).
 */
type P3 = [number, number, number];

interface RefTin {
  pts: P3[];
  tris: number[][];
}

function refTin(pts: P3[]): RefTin {
  const d = new Delaunator(pts.flatMap(([x, y]) => [x, y]));
  const tris: number[][] = [];
  for (let i = 0; i < d.triangles.length; i += 3)
    tris.push([d.triangles[i]!, d.triangles[i + 1]!, d.triangles[i + 2]!]);
  return { pts, tris };
}

/** Height of the plane through triangle `t` of `tin` at (x, y), by Cramer's rule. */
function planeZ(tin: RefTin, t: number[], x: number, y: number): number {
  const [a, b, c] = t.map((i) => tin.pts[i]!);
  const det = (b![0] - a![0]) * (c![1] - a![1]) - (c![0] - a![0]) * (b![1] - a![1]);
  const u = ((x - a![0]) * (c![1] - a![1]) - (c![0] - a![0]) * (y - a![1])) / det;
  const v = ((b![0] - a![0]) * (y - a![1]) - (x - a![0]) * (b![1] - a![1])) / det;
  return a![2] + u * (b![2] - a![2]) + v * (c![2] - a![2]);
}

/** [cut, fill] of a linear depth over a triangle of plan area A with corner depths p, q, r. */
function prism(A: number, p: number, q: number, r: number): [number, number] {
  const net = (A * (p + q + r)) / 3;
  if (p >= 0 && q >= 0 && r >= 0) return [net, 0];
  if (p <= 0 && q <= 0 && r <= 0) return [0, -net];
  const ds = [p, q, r];
  const pos = ds.filter((d) => d > 0);
  if (pos.length === 1) {
    const [s] = pos;
    const rest = ds.slice();
    rest.splice(ds.indexOf(s!), 1);
    const cut = (A * s! ** 3) / (3 * (s! - rest[0]!) * (s! - rest[1]!));
    return [cut, cut - net];
  }
  const neg = ds.find((d) => d < 0)!;
  const rest = ds.slice();
  rest.splice(ds.indexOf(neg), 1);
  const fill = (A * -(neg ** 3)) / (3 * (rest[0]! - neg) * (rest[1]! - neg));
  return [net + fill, fill];
}

function reference(existing: P3[], design: P3[]): { cut: number; fill: number; area: number } {
  const e = refTin(existing);
  const d = refTin(design);
  let cut = 0,
    fill = 0,
    area = 0;
  for (const te of e.tris) {
    const ringE = te.map((i) => [e.pts[i]![0], e.pts[i]![1]] as Pair);
    for (const td of d.tris) {
      const ringD = td.map((i) => [d.pts[i]![0], d.pts[i]![1]] as Pair);
      for (const poly of polygonClipping.intersection([ringE], [ringD])) {
        const ring = poly[0]!.slice(0, -1);
        const depth = ring.map(([x, y]) => planeZ(e, te, x, y) - planeZ(d, td, x, y));
        for (let i = 1; i + 1 < ring.length; i++) {
          const [x0, y0] = ring[0]!,
            [x1, y1] = ring[i]!,
            [x2, y2] = ring[i + 1]!;
          const A = Math.abs((x1 - x0) * (y2 - y0) - (x2 - x0) * (y1 - y0)) / 2;
          const [c, f] = prism(A, depth[0]!, depth[i]!, depth[i + 1]!);
          cut += c;
          fill += f;
          area += A;
        }
      }
    }
  }
  return { cut, fill, area };
}

function grid(
  nx: number,
  ny: number,
  x0: number,
  y0: number,
  w: number,
  h: number,
  f: (x: number, y: number) => number,
  jitter = 0,
  seed = 1,
): P3[] {
  const pts: P3[] = [];
  for (let i = 0; i < ny; i++) {
    for (let j = 0; j < nx; j++) {
      const edge = i === 0 || j === 0 || i === ny - 1 || j === nx - 1;
      const k = i * nx + j + seed * 7919;
      const x = x0 + ((j + (edge ? 0 : jitter * Math.sin(k * 12.9898))) * w) / (nx - 1);
      const y = y0 + ((i + (edge ? 0 : jitter * Math.cos(k * 78.233))) * h) / (ny - 1);
      pts.push([x, y, f(x, y)]);
    }
  }
  return pts;
}

const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(1, Math.abs(b));

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
