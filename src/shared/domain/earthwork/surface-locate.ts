import type { TriangleBuckets } from './surface-buckets';

/** A triangulation as delaunator lays it out: corner ids by three, the opposite half-edge of each (-1 on the edge). */
export interface MeshLike {
  triangles: Uint32Array;
  halfedges: Int32Array;
  /** Convex hull point ids (delaunator); empty for a mesh from given faces. */
  hull: Uint32Array;
}

/**
 * Point location in a Delaunay triangulation by a visibility walk (it always ends on a Delaunay mesh), started
 * from a seed triangle of a coarse grid over the mesh's bounding box (built on the first seeded query) or from
 * the previous answer. The overlay (surface-overlay.ts) locates each triangle's centroid with it.
 * Coordinates are the shifted plan coordinates the mesh was built from.
 */
export class TinLocator {
  readonly triangles: Uint32Array;
  private readonly halfedges: Int32Array;
  private readonly coords: Float64Array;
  /** +1 or -1: the sign of cross(b - a, p - a) that puts p outside edge a -> b of a triangle. */
  private readonly outside: number;
  private seeds: Int32Array;
  private size = 1;
  private minX = 0;
  private minY = 0;
  private cell = 1;
  private last = 0;

  /** Faces as given: located through the bucket grid, since a walk may leave a non-convex mesh too early. */
  private readonly buckets: TriangleBuckets | null;

  constructor(mesh: MeshLike, coords: Float64Array, buckets: TriangleBuckets | null = null) {
    this.buckets = buckets;
    this.triangles = mesh.triangles;
    this.halfedges = mesh.halfedges;
    this.coords = coords;
    const t = this.triangles;
    this.outside = -Math.sign(this.cross(t[0]!, t[1]!, coords[2 * t[2]!]!, coords[2 * t[2]! + 1]!)) || 1;
    this.seeds = new Int32Array(0);
  }

  /** Seeds the grid (once, on the first seeded query): every other triangle fills cells of about 8 each. */
  private seed(): void {
    const t = this.triangles;
    const c = this.coords;
    let minX = Infinity,
      minY = Infinity,
      maxX = -Infinity,
      maxY = -Infinity;
    for (let i = 0; i < c.length; i += 2) {
      const x = c[i]!,
        y = c[i + 1]!;
      if (x < minX) minX = x;
      if (x > maxX) maxX = x;
      if (y < minY) minY = y;
      if (y > maxY) maxY = y;
    }
    this.size = Math.max(1, Math.ceil(Math.sqrt(t.length / 3 / 8)));
    this.minX = minX;
    this.minY = minY;
    this.cell = Math.max(maxX - minX, maxY - minY, 1e-12) / this.size;
    this.seeds = new Int32Array(this.size * this.size).fill(-1);
    for (let k = 0; 3 * k < t.length; k += 2) {
      const a = 2 * t[3 * k]!,
        b = 2 * t[3 * k + 1]!,
        d = 2 * t[3 * k + 2]!;
      this.seeds[this.cellOf((c[a]! + c[b]! + c[d]!) / 3, (c[a + 1]! + c[b + 1]! + c[d + 1]!) / 3)] = k;
    }
  }

  private cellOf(x: number, y: number): number {
    const n = this.size;
    let i = Math.floor((x - this.minX) / this.cell);
    let j = Math.floor((y - this.minY) / this.cell);
    i = i < 0 ? 0 : i >= n ? n - 1 : i;
    j = j < 0 ? 0 : j >= n ? n - 1 : j;
    return j * n + i;
  }

  private cross(a: number, b: number, px: number, py: number): number {
    const c = this.coords;
    const ax = c[2 * a]!,
      ay = c[2 * a + 1]!;
    return (c[2 * b]! - ax) * (py - ay) - (c[2 * b + 1]! - ay) * (px - ax);
  }

  /**
   * Triangle index containing (x, y), or -1 outside the convex hull. `seeded` starts from the grid seed (many
   * queries over the whole mesh); otherwise from the previous answer (a few queries that follow each other).
   */
  locate(x: number, y: number, seeded = true): number {
    if (this.buckets) return this.buckets.locate(x, y);
    let t = this.last;
    if (seeded) {
      if (this.seeds.length === 0) this.seed();
      const s = this.seeds[this.cellOf(x, y)]!;
      if (s >= 0) t = s;
    }
    const tri = this.triangles;
    const he = this.halfedges;
    const c = this.coords;
    const out = this.outside;
    // Walk: leave through the first edge that has the point on its outer side; the edge entered by is skipped.
    let entered = -1;
    for (let steps = 0, limit = tri.length; steps < limit; steps++) {
      const e0 = 3 * t;
      const i0 = 2 * tri[e0]!,
        i1 = 2 * tri[e0 + 1]!,
        i2 = 2 * tri[e0 + 2]!;
      const x0 = c[i0]!,
        y0 = c[i0 + 1]!,
        x1 = c[i1]!,
        y1 = c[i1 + 1]!,
        x2 = c[i2]!,
        y2 = c[i2 + 1]!;
      let exit = -1;
      if (entered !== e0 && ((x1 - x0) * (y - y0) - (y1 - y0) * (x - x0)) * out > 0) exit = e0;
      else if (entered !== e0 + 1 && ((x2 - x1) * (y - y1) - (y2 - y1) * (x - x1)) * out > 0) exit = e0 + 1;
      else if (entered !== e0 + 2 && ((x0 - x2) * (y - y2) - (y0 - y2) * (x - x2)) * out > 0) exit = e0 + 2;
      if (exit < 0) {
        this.last = t;
        return t;
      }
      const opposite = he[exit]!;
      if (opposite < 0) return -1;
      entered = opposite;
      t = (opposite / 3) | 0;
    }
    return this.scan(x, y);
  }

  /** Triangle holding (x, y) by a walk from triangle `start` (a neighbour's answer), or -1 outside. */
  locateFrom(start: number, x: number, y: number): number {
    if (this.buckets) return this.buckets.locate(x, y);
    this.last = start;
    return this.locate(x, y, false);
  }

  /** Fallback for a walk that did not settle (degenerate input): test every triangle. */
  private scan(x: number, y: number): number {
    const tri = this.triangles;
    for (let t = 0; 3 * t < tri.length; t++) {
      let inside = true;
      for (let k = 0; k < 3 && inside; k++) {
        const e = 3 * t + k;
        inside = this.cross(tri[e]!, tri[k === 2 ? e - 2 : e + 1]!, x, y) * this.outside <= 0;
      }
      if (inside) return t;
    }
    return -1;
  }

  /** Linear interpolation of z over triangle t at (x, y) (barycentric weights). */
  interpolate(t: number, x: number, y: number, z: ArrayLike<number>): number {
    const tri = this.triangles,
      c = this.coords;
    const a = tri[3 * t]!,
      b = tri[3 * t + 1]!,
      d = tri[3 * t + 2]!;
    const ax = c[2 * a]!,
      ay = c[2 * a + 1]!;
    const bx = c[2 * b]! - ax,
      by = c[2 * b + 1]! - ay;
    const dx = c[2 * d]! - ax,
      dy = c[2 * d + 1]! - ay;
    const px = x - ax,
      py = y - ay;
    const det = bx * dy - by * dx;
    const u = (px * dy - py * dx) / det;
    const v = (bx * py - by * px) / det;
    return z[a]! + u * (z[b]! - z[a]!) + v * (z[d]! - z[a]!);
  }
}
