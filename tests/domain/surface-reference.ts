import Delaunator from 'delaunator';
import polygonClipping, { type Pair } from 'polygon-clipping';

/**
 * Issue 13, item 1: the exact volume between two triangulated surfaces. The reference below is written here, not
 * taken from the engine: both surveys are triangulated with delaunator, EVERY pair of triangles is intersected
 * (pairs whose plan boxes are apart are skipped) with polygon-clipping (a general-purpose npm library), each intersection is fanned into triangles, and each
 * triangle's prism is split along the zero-depth line in closed form (triangular-prism method, surveying texts;
 * reference.md section 9: prism volume = plan area x mean of its three depths).
 */
export type P3 = [number, number, number];

export interface RefTin {
  pts: P3[];
  tris: number[][];
}

export function refTin(pts: P3[], faces?: number[][]): RefTin {
  if (faces) return { pts, tris: faces };
  const d = new Delaunator(pts.flatMap(([x, y]) => [x, y]));
  const tris: number[][] = [];
  for (let i = 0; i < d.triangles.length; i += 3)
    tris.push([d.triangles[i]!, d.triangles[i + 1]!, d.triangles[i + 2]!]);
  return { pts, tris };
}

/** Height of the plane through triangle `t` of `tin` at (x, y), by Cramer's rule. */
export function planeZ(tin: RefTin, t: number[], x: number, y: number): number {
  const [a, b, c] = t.map((i) => tin.pts[i]!);
  const det = (b![0] - a![0]) * (c![1] - a![1]) - (c![0] - a![0]) * (b![1] - a![1]);
  const u = ((x - a![0]) * (c![1] - a![1]) - (c![0] - a![0]) * (y - a![1])) / det;
  const v = ((b![0] - a![0]) * (y - a![1]) - (x - a![0]) * (b![1] - a![1])) / det;
  return a![2] + u * (b![2] - a![2]) + v * (c![2] - a![2]);
}

/** [cut, fill] of a linear depth over a triangle of plan area A with corner depths p, q, r. */
export function prism(A: number, p: number, q: number, r: number): [number, number] {
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

/** Cut, fill and area between two reference TINs (every pair of triangles intersected). */
export function referenceOf(e: RefTin, d: RefTin): { cut: number; fill: number; area: number } {
  let cut = 0,
    fill = 0,
    area = 0;
  // Pairs whose plan boxes are apart cannot meet (skipped only to keep larger cases quick).
  const box = (ring: Pair[]) => [
    Math.min(...ring.map((p) => p[0])),
    Math.min(...ring.map((p) => p[1])),
    Math.max(...ring.map((p) => p[0])),
    Math.max(...ring.map((p) => p[1])),
  ];
  const ringsD = d.tris.map((td) => td.map((i) => [d.pts[i]![0], d.pts[i]![1]] as Pair));
  const boxesD = ringsD.map(box);
  for (const te of e.tris) {
    const ringE = te.map((i) => [e.pts[i]![0], e.pts[i]![1]] as Pair);
    const [ex0, ey0, ex1, ey1] = box(ringE);
    for (const [k, td] of d.tris.entries()) {
      const [dx0, dy0, dx1, dy1] = boxesD[k]!;
      if (dx0! > ex1! || dx1! < ex0! || dy0! > ey1! || dy1! < ey0!) continue;
      const ringD = ringsD[k]!;
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

export function reference(existing: P3[], design: P3[]): { cut: number; fill: number; area: number } {
  return referenceOf(refTin(existing), refTin(design));
}

export function grid(
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

export const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(1, Math.abs(b));
