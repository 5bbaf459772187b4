import type { Tin } from './surface-tin';

/**
 * A uniform grid over a mesh's plan box, about two triangles a cell. The cell of a coordinate is monotonic in
 * it (one multiplication, then clamped), so a point inside a box always falls in one of the cells the box's
 * corners fall in, rounding aside: a mesh's triangle and any box it meets share a cell.
 */
class PlanGrid {
  protected readonly across: number;
  protected readonly down: number;
  private readonly minX: number;
  private readonly minY: number;
  private readonly perX: number;
  private readonly perY: number;

  constructor(t: Tin) {
    const c = t.coords;
    let minX = Infinity,
      minY = Infinity,
      maxX = -Infinity,
      maxY = -Infinity;
    for (let i = 0; i < c.length; i += 2) {
      if (c[i]! < minX) minX = c[i]!;
      if (c[i]! > maxX) maxX = c[i]!;
      if (c[i + 1]! < minY) minY = c[i + 1]!;
      if (c[i + 1]! > maxY) maxY = c[i + 1]!;
    }
    const w = Math.max(maxX - minX, 1e-12),
      h = Math.max(maxY - minY, 1e-12);
    const cells = Math.max(1, t.mesh.triangles.length / 6);
    this.across = Math.max(1, Math.ceil(Math.sqrt((cells * w) / h)));
    this.down = Math.max(1, Math.ceil(cells / this.across));
    this.minX = minX;
    this.minY = minY;
    this.perX = this.across / w;
    this.perY = this.down / h;
  }

  protected col(x: number): number {
    const v = (x - this.minX) * this.perX;
    return v <= 0 ? 0 : v >= this.across ? this.across - 1 : v | 0;
  }

  protected row(y: number): number {
    const v = (y - this.minY) * this.perY;
    return v <= 0 ? 0 : v >= this.down ? this.down - 1 : v | 0;
  }
}

/**
 * Lowest and highest height of a mesh over any plan box: each cell holds the lowest and highest corner height of
 * the mesh's triangles whose box meets it. A linear triangle takes its extremes at its corners, so the mesh
 * over a box lies within the range of the cells the box meets. Shifted plan coordinates, as the mesh's.
 */
export class HeightBounds extends PlanGrid {
  private readonly lo: Float64Array;
  private readonly hi: Float64Array;

  constructor(t: Tin) {
    super(t);
    const tri = t.mesh.triangles;
    const c = t.coords;
    const z = t.z;
    this.lo = new Float64Array(this.across * this.down).fill(Infinity);
    this.hi = new Float64Array(this.across * this.down).fill(-Infinity);
    for (let k = 0; k < tri.length; k += 3) {
      const a = tri[k]!,
        b = tri[k + 1]!,
        d = tri[k + 2]!;
      const zl = Math.min(z[a]!, z[b]!, z[d]!),
        zh = Math.max(z[a]!, z[b]!, z[d]!);
      const i0 = this.col(Math.min(c[2 * a]!, c[2 * b]!, c[2 * d]!)),
        i1 = this.col(Math.max(c[2 * a]!, c[2 * b]!, c[2 * d]!));
      const j0 = this.row(Math.min(c[2 * a + 1]!, c[2 * b + 1]!, c[2 * d + 1]!)),
        j1 = this.row(Math.max(c[2 * a + 1]!, c[2 * b + 1]!, c[2 * d + 1]!));
      for (let j = j0; j <= j1; j++) {
        for (let i = i0, cell = j * this.across + i0; i <= i1; i++, cell++) {
          if (zl < this.lo[cell]!) this.lo[cell] = zl;
          if (zh > this.hi[cell]!) this.hi[cell] = zh;
        }
      }
    }
  }

  /** [lowest, highest] height of the mesh over the box (Infinity, -Infinity where it has none) into `out`. */
  range(x0: number, y0: number, x1: number, y1: number, out: Float64Array): void {
    let lo = Infinity,
      hi = -Infinity;
    const i0 = this.col(x0),
      i1 = this.col(x1);
    for (let j = this.row(y0), j1 = this.row(y1); j <= j1; j++) {
      for (let i = i0, cell = j * this.across + i0; i <= i1; i++, cell++) {
        if (this.lo[cell]! < lo) lo = this.lo[cell]!;
        if (this.hi[cell]! > hi) hi = this.hi[cell]!;
      }
    }
    out[0] = lo;
    out[1] = hi;
  }
}

/**
 * Which groups of a mesh's triangles are near a plan box: each cell holds one bit per group (1 << group) of the
 * triangles whose box meets it. A point of the mesh lies in a triangle whose box meets the point's cell, so a
 * box inside the mesh whose cells carry one group's bit alone lies wholly in that group.
 */
export class GroupCells extends PlanGrid {
  private readonly bits: Uint8Array;

  constructor(t: Tin, group: Uint8Array) {
    super(t);
    const tri = t.mesh.triangles;
    const c = t.coords;
    this.bits = new Uint8Array(this.across * this.down);
    for (let k = 0; k < tri.length; k += 3) {
      const a = 2 * tri[k]!,
        b = 2 * tri[k + 1]!,
        d = 2 * tri[k + 2]!;
      const bit = 1 << group[k / 3]!;
      const i0 = this.col(Math.min(c[a]!, c[b]!, c[d]!)),
        i1 = this.col(Math.max(c[a]!, c[b]!, c[d]!));
      const j0 = this.row(Math.min(c[a + 1]!, c[b + 1]!, c[d + 1]!)),
        j1 = this.row(Math.max(c[a + 1]!, c[b + 1]!, c[d + 1]!));
      for (let j = j0; j <= j1; j++)
        for (let i = i0, cell = j * this.across + i0; i <= i1; i++, cell++) this.bits[cell]! |= bit;
    }
  }

  /** The groups' bits of the cells the box meets. */
  under(x0: number, y0: number, x1: number, y1: number): number {
    let bits = 0;
    const i0 = this.col(x0),
      i1 = this.col(x1);
    for (let j = this.row(y0), j1 = this.row(y1); j <= j1; j++)
      for (let i = i0, cell = j * this.across + i0; i <= i1; i++, cell++) bits |= this.bits[cell]!;
    return bits;
  }
}

/**
 * Which points lie strictly inside a convex mesh's hull (its plan footprint): a fan from the hull's first
 * corner, the wedge found by bisection, then the wedge's hull edge. `coords` are [x, y] pairs (shifted alike). Doubtful points (on or near an edge, where
 * rounding could decide) answer outside: callers treat outside as "clip it", which is always right.
 */
export function strictlyInsideHull(hullOf: Tin, coords: Float64Array): Uint8Array {
  const ids = hullOf.mesh.hull;
  const c = hullOf.coords;
  const h = ids.length;
  const hx = new Float64Array(h),
    hy = new Float64Array(h);
  for (let i = 0; i < h; i++) {
    hx[i] = c[2 * ids[i]!]!;
    hy[i] = c[2 * ids[i]! + 1]!;
  }
  // Counter-clockwise order.
  let a2 = 0;
  for (let i = 0; i < h; i++) {
    const j = i + 1 === h ? 0 : i + 1;
    a2 += hx[i]! * hy[j]! - hx[j]! * hy[i]!;
  }
  if (a2 < 0) {
    hx.reverse();
    hy.reverse();
  }
  const n = coords.length / 2;
  const out = new Uint8Array(n);
  if (h < 3) return out;
  const x0 = hx[0]!,
    y0 = hy[0]!;
  const side = (i: number, px: number, py: number) => (hx[i]! - x0) * (py - y0) - (hy[i]! - y0) * (px - x0);
  for (let p = 0; p < n; p++) {
    const px = coords[2 * p]!,
      py = coords[2 * p + 1]!;
    if (!(side(1, px, py) > 0) || !(side(h - 1, px, py) < 0)) continue;
    // Largest i in [1, h - 2] with the point left of (or on) the ray to corner i.
    let lo = 1,
      hi = h - 2;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (side(mid, px, py) >= 0) lo = mid;
      else hi = mid - 1;
    }
    if (!(side(lo, px, py) >= 0) || !(side(lo + 1, px, py) <= 0)) continue;
    const ex = hx[lo + 1]! - hx[lo]!,
      ey = hy[lo + 1]! - hy[lo]!;
    if (ex * (py - hy[lo]!) - ey * (px - hx[lo]!) > 0) out[p] = 1;
  }
  return out;
}
