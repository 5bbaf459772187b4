import type { TriangleBuckets } from './surface-buckets';

/**
 * The first two faces of a face set (counter-clockwise triangles) whose insides overlap in plan, or null.
 * Near-linear, never every pair: two triangles that overlap share a point, so both are listed in that point's
 * bucket cell (surface-buckets.ts), and each pair is tested only in the cell holding the lower-left corner of
 * the common part of their boxes. Two convex polygons have disjoint insides exactly when a line along one of
 * their edges has the other wholly on its far side or on it (separating axis); faces that only touch (a shared
 * edge or corner, a corner on another's edge) pass that test. Pairs that fail it are clipped one by the other
 * and count as overlapping when the common part exceeds a billionth of the smaller face (rounding at a corner
 * that lies on another face's edge leaves far less).
 */
export function firstOverlap(tri: Uint32Array, c: Float64Array, buckets: TriangleBuckets): [number, number] | null {
  const { start, ids } = buckets;
  let box = new Float64Array(64);
  const ring = new Float64Array(16);
  const next = new Float64Array(16);
  let found: [number, number] | null = null;
  for (let cell = 0; cell + 1 < start.length; cell++) {
    const k0 = start[cell]!,
      m = start[cell + 1]! - k0;
    if (m < 2) continue;
    if (box.length < 4 * m) box = new Float64Array(8 * m);
    for (let i = 0; i < m; i++) {
      const t = ids[k0 + i]!;
      const a = 2 * tri[3 * t]!,
        b = 2 * tri[3 * t + 1]!,
        d = 2 * tri[3 * t + 2]!;
      box[4 * i] = Math.min(c[a]!, c[b]!, c[d]!);
      box[4 * i + 1] = Math.min(c[a + 1]!, c[b + 1]!, c[d + 1]!);
      box[4 * i + 2] = Math.max(c[a]!, c[b]!, c[d]!);
      box[4 * i + 3] = Math.max(c[a + 1]!, c[b + 1]!, c[d + 1]!);
    }
    for (let i = 0; i < m; i++) {
      for (let j = i + 1; j < m; j++) {
        // Boxes that do not overlap (touching is not overlapping) cannot hold overlapping insides.
        const x0 = Math.max(box[4 * i]!, box[4 * j]!),
          y0 = Math.max(box[4 * i + 1]!, box[4 * j + 1]!);
        if (x0 >= Math.min(box[4 * i + 2]!, box[4 * j + 2]!) || y0 >= Math.min(box[4 * i + 3]!, box[4 * j + 3]!))
          continue;
        if (buckets.cellOf(x0, y0) !== cell) continue;
        const t = ids[k0 + i]!,
          s = ids[k0 + j]!;
        if (separated(tri, c, t, s) || separated(tri, c, s, t)) continue;
        if (commonArea(tri, c, t, s, ring, next) <= 1e-9 * Math.min(area(tri, c, t), area(tri, c, s))) continue;
        const pair: [number, number] = t < s ? [t, s] : [s, t];
        // The first pair in face order, whichever cell finds it.
        if (!found || pair[0] < found[0] || (pair[0] === found[0] && pair[1] < found[1])) found = pair;
      }
    }
  }
  return found;
}

/** Whether a line along an edge of triangle t has all of triangle s on its outer side or on it. */
function separated(tri: Uint32Array, c: Float64Array, t: number, s: number): boolean {
  for (let e = 0; e < 3; e++) {
    const p = 2 * tri[3 * t + e]!,
      q = 2 * tri[3 * t + (e === 2 ? 0 : e + 1)]!;
    const ex = c[q]! - c[p]!,
      ey = c[q + 1]! - c[p + 1]!;
    let out = true;
    for (let k = 0; k < 3 && out; k++) {
      const v = 2 * tri[3 * s + k]!;
      out = ex * (c[v + 1]! - c[p + 1]!) - ey * (c[v]! - c[p]!) <= 0;
    }
    if (out) return true;
  }
  return false;
}

function area(tri: Uint32Array, c: Float64Array, t: number): number {
  const a = 2 * tri[3 * t]!,
    b = 2 * tri[3 * t + 1]!,
    d = 2 * tri[3 * t + 2]!;
  return Math.abs((c[b]! - c[a]!) * (c[d + 1]! - c[a + 1]!) - (c[b + 1]! - c[a + 1]!) * (c[d]! - c[a]!)) / 2;
}

/** Plan area common to triangles t and s: s clipped by t's three edges (Sutherland-Hodgman). */
function commonArea(
  tri: Uint32Array,
  c: Float64Array,
  t: number,
  s: number,
  ring: Float64Array,
  next: Float64Array,
): number {
  let src = ring,
    dst = next;
  let m = 3;
  for (let k = 0; k < 3; k++) {
    src[2 * k] = c[2 * tri[3 * s + k]!]!;
    src[2 * k + 1] = c[2 * tri[3 * s + k]! + 1]!;
  }
  for (let e = 0; e < 3 && m > 0; e++) {
    const p = 2 * tri[3 * t + e]!,
      q = 2 * tri[3 * t + (e === 2 ? 0 : e + 1)]!;
    const px = c[p]!,
      py = c[p + 1]!,
      ex = c[q]! - px,
      ey = c[q + 1]! - py;
    let k = 0;
    for (let i = 0; i < m; i++) {
      const j = i + 1 === m ? 0 : i + 1;
      const xi = src[2 * i]!,
        yi = src[2 * i + 1]!,
        xj = src[2 * j]!,
        yj = src[2 * j + 1]!;
      const si = ex * (yi - py) - ey * (xi - px),
        sj = ex * (yj - py) - ey * (xj - px);
      if (si >= 0) {
        dst[2 * k] = xi;
        dst[2 * k + 1] = yi;
        k++;
      }
      if (si >= 0 !== sj >= 0) {
        const u = si / (si - sj);
        dst[2 * k] = xi + u * (xj - xi);
        dst[2 * k + 1] = yi + u * (yj - yi);
        k++;
      }
    }
    m = k;
    const swap = src;
    src = dst;
    dst = swap;
  }
  let a2 = 0;
  for (let i = 0; i < m; i++) {
    const j = i + 1 === m ? 0 : i + 1;
    a2 += src[2 * i]! * src[2 * j + 1]! - src[2 * j]! * src[2 * i + 1]!;
  }
  return Math.abs(a2) / 2;
}
