import polygonClipping, { type MultiPolygon, type Pair } from 'polygon-clipping';
import { addRing, Ring, type Linear } from './surface-moments';
import type { Tin } from './surface-overlay';

/** Pay limits in plan: an outer boundary and void polygons, [x, y] rings in the surveys' units. */
export interface PayLimits {
  outer?: readonly (readonly [number, number])[];
  voids?: readonly (readonly [number, number])[][];
}

/**
 * The paid region (outer boundary less the voids, by polygon-clipping) and a sorter of one mesh's triangles:
 * 1 inside, 2 outside, 3 crossing an edge of the region. Only crossing triangles have their pieces clipped to
 * the region; the others are taken whole or left out.
 */
export class PayRegion {
  readonly region: MultiPolygon;
  readonly area: number;
  private readonly edges: Float64Array;
  private readonly grid: Int32Array[];
  private readonly size: number;
  private readonly minX: number;
  private readonly minY: number;
  private readonly cell: number;
  private readonly ring = new Ring(16);

  constructor(limits: PayLimits, ox: number, oy: number, everything: [number, number, number, number]) {
    const shift = (r: readonly (readonly [number, number])[]): Pair[] => r.map(([x, y]) => [x - ox, y - oy] as Pair);
    const [x0, y0, x1, y1] = everything;
    const outer: Pair[] = limits.outer
      ? shift(limits.outer)
      : [
          [x0, y0],
          [x1, y0],
          [x1, y1],
          [x0, y1],
        ];
    const voids = (limits.voids ?? []).map((v) => [shift(v)]);
    this.region = voids.length > 0 ? polygonClipping.difference([outer], ...voids) : polygonClipping.union([outer]);
    const list: number[] = [];
    let area = 0;
    for (const poly of this.region) {
      for (const ring of poly) {
        for (let i = 0; i + 1 < ring.length; i++) {
          list.push(ring[i]![0], ring[i]![1], ring[i + 1]![0], ring[i + 1]![1]);
          area += (ring[i]![0] * ring[i + 1]![1] - ring[i + 1]![0] * ring[i]![1]) / 2;
        }
      }
    }
    this.area = Math.abs(area);
    this.edges = Float64Array.from(list);
    let minX = Infinity,
      minY = Infinity,
      maxX = -Infinity,
      maxY = -Infinity;
    for (let i = 0; i < list.length; i += 2) {
      minX = Math.min(minX, list[i]!);
      maxX = Math.max(maxX, list[i]!);
      minY = Math.min(minY, list[i + 1]!);
      maxY = Math.max(maxY, list[i + 1]!);
    }
    const count = list.length / 4;
    this.size = Math.max(1, Math.ceil(Math.sqrt(count)));
    this.minX = minX;
    this.minY = minY;
    this.cell = Math.max(maxX - minX, maxY - minY, 1e-9) / this.size;
    const buckets: number[][] = Array.from({ length: this.size * this.size }, () => []);
    for (let e = 0; e < count; e++) {
      const ex0 = Math.min(list[4 * e]!, list[4 * e + 2]!),
        ex1 = Math.max(list[4 * e]!, list[4 * e + 2]!);
      const ey0 = Math.min(list[4 * e + 1]!, list[4 * e + 3]!),
        ey1 = Math.max(list[4 * e + 1]!, list[4 * e + 3]!);
      for (let j = this.cellY(ey0); j <= this.cellY(ey1); j++)
        for (let i = this.cellX(ex0); i <= this.cellX(ex1); i++) buckets[j * this.size + i]!.push(e);
    }
    this.grid = buckets.map((b) => Int32Array.from(b));
  }

  private cellX(x: number): number {
    return Math.min(this.size - 1, Math.max(0, Math.floor((x - this.minX) / this.cell)));
  }
  private cellY(y: number): number {
    return Math.min(this.size - 1, Math.max(0, Math.floor((y - this.minY) / this.cell)));
  }

  /** Whether an edge of the region has a bounding box meeting [x0, x1] x [y0, y1]. */
  private near(x0: number, y0: number, x1: number, y1: number): boolean {
    const s = this.size;
    const ex = this.minX + s * this.cell,
      ey = this.minY + s * this.cell;
    if (x1 < this.minX || y1 < this.minY || x0 > ex || y0 > ey) return false;
    const e = this.edges;
    for (let j = this.cellY(y0); j <= this.cellY(y1); j++) {
      for (let i = this.cellX(x0); i <= this.cellX(x1); i++) {
        for (const k of this.grid[j * s + i]!) {
          const a = 4 * k;
          if (
            Math.max(e[a]!, e[a + 2]!) >= x0 &&
            Math.min(e[a]!, e[a + 2]!) <= x1 &&
            Math.max(e[a + 1]!, e[a + 3]!) >= y0 &&
            Math.min(e[a + 1]!, e[a + 3]!) <= y1
          )
            return true;
        }
      }
    }
    return false;
  }

  /** Even-odd test against every edge (used once per connected group of triangles). */
  contains(x: number, y: number): boolean {
    const e = this.edges;
    let inside = false;
    for (let a = 0; a < e.length; a += 4) {
      const xa = e[a]!,
        ya = e[a + 1]!,
        xb = e[a + 2]!,
        yb = e[a + 3]!;
      if (ya > y !== yb > y && x < xa + ((y - ya) * (xb - xa)) / (yb - ya)) inside = !inside;
    }
    return inside;
  }

  /**
   * Status of each triangle of the mesh. Triangles near no region edge keep one status across shared edges (an
   * edge of the region between two of them would meet both their boxes), so each connected group is tested once.
   */
  classify(t: Tin): Uint8Array {
    const tri = t.mesh.triangles;
    const he = t.mesh.halfedges;
    const c = t.coords;
    const n = tri.length / 3;
    const status = new Uint8Array(n);
    for (let k = 0; k < n; k++) {
      const a = 2 * tri[3 * k]!,
        b = 2 * tri[3 * k + 1]!,
        d = 2 * tri[3 * k + 2]!;
      const x0 = Math.min(c[a]!, c[b]!, c[d]!),
        x1 = Math.max(c[a]!, c[b]!, c[d]!);
      const y0 = Math.min(c[a + 1]!, c[b + 1]!, c[d + 1]!),
        y1 = Math.max(c[a + 1]!, c[b + 1]!, c[d + 1]!);
      if (this.near(x0, y0, x1, y1)) status[k] = 3;
    }
    const stack: number[] = [];
    for (let k = 0; k < n; k++) {
      if (status[k] !== 0) continue;
      const a = 2 * tri[3 * k]!,
        b = 2 * tri[3 * k + 1]!,
        d = 2 * tri[3 * k + 2]!;
      const value = this.contains((c[a]! + c[b]! + c[d]!) / 3, (c[a + 1]! + c[b + 1]! + c[d + 1]!) / 3) ? 1 : 2;
      status[k] = value;
      stack.push(k);
      while (stack.length > 0) {
        const s = stack.pop()!;
        for (let e = 3 * s; e < 3 * s + 3; e++) {
          const o = he[e]!;
          if (o < 0) continue;
          const nb = (o / 3) | 0;
          if (status[nb] === 0) {
            status[nb] = value;
            stack.push(nb);
          }
        }
      }
    }
    return status;
  }

  /** Cut and fill of f (and the integral of g) over the piece's part inside the region (polygon-clipping; holes subtract). */
  addClipped(
    piece: Ring,
    f: Linear,
    acc: Float64Array,
    scratch: Ring,
    tmp: Float64Array,
    g: Linear | null = null,
  ): void {
    const ringIn: Pair[] = [];
    for (let i = 0; i < piece.n; i++) ringIn.push([piece.x[i]!, piece.y[i]!]);
    const parts = polygonClipping.intersection([ringIn], this.region);
    for (const poly of parts) {
      poly.forEach((ring, h) => {
        const r = this.ring;
        r.n = 0;
        for (let i = 0; i + 1 < ring.length; i++) r.push(ring[i]![0], ring[i]![1]);
        addRing(r, f, acc, scratch, tmp, h === 0 ? 1 : -1, g);
      });
    }
  }
}
