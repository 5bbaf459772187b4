import type Delaunator from 'delaunator';
import { ClipPolygon, addTriangle, clipToHull, type ClipHull } from './surface-integrate';
import type { TinLocator } from './surface-locate';

/** One surface's mesh with its shifted coordinates and heights. */
export interface Tin {
  mesh: Delaunator<Float64Array>;
  coords: Float64Array;
  z: Float64Array;
  locator: TinLocator;
}

export interface PassTotals {
  /** Cubic and square coordinate units. */
  cut: number;
  fill: number;
  area: number;
  triangles: number;
  clipped: number;
}

/** The convex hull of a mesh as a clip outline carrying that mesh's heights. */
export function hullOf(tin: Tin): ClipHull {
  const ids = tin.mesh.hull;
  const n = ids.length;
  const x = new Float64Array(n), y = new Float64Array(n), z = new Float64Array(n);
  let twice = 0;
  for (let i = 0; i < n; i++) {
    x[i] = tin.coords[2 * ids[i]!]!;
    y[i] = tin.coords[2 * ids[i]! + 1]!;
    z[i] = tin.z[ids[i]!]!;
  }
  for (let i = 0; i < n; i++) {
    const j = (i + 1) % n;
    twice += x[i]! * y[j]! - x[j]! * y[i]!;
  }
  return { x, y, z, orientation: twice >= 0 ? 1 : -1 };
}

/**
 * Own's triangles that hold a corner of other's hull: they can overlap other's footprint with all their own
 * corners outside it, so they are clipped too. The hull is walked in order, each search starting where the last
 * one ended.
 */
export function markHullCorners(own: Tin, hull: ClipHull): Uint8Array {
  const marked = new Uint8Array(own.mesh.triangles.length / 3);
  for (let i = 0; i < hull.x.length; i++) {
    const t = own.locator.locate(hull.x[i]!, hull.y[i]!, false);
    if (t >= 0) marked[t] = 1;
  }
  return marked;
}

/**
 * Integrates d = sign x (own z - other z) over own's triangles within other's hull. Triangles with all three
 * corners inside are integrated directly (d is linear over own's triangle once other's heights are sampled at
 * its corners); those with a corner outside, or holding a corner of the hull, are clipped to the hull first.
 */
export function integratePass(own: Tin, otherAt: Float64Array, hull: ClipHull, marked: Uint8Array, sign: number): PassTotals {
  const tri = own.mesh.triangles;
  const c = own.coords;
  const z = own.z;
  const acc = new Float64Array(3);
  const poly = new ClipPolygon(hull.x.length + 8);
  const scratch = new ClipPolygon(hull.x.length + 8);
  // Depth per vertex once (NaN outside the other surface), so each triangle reads three numbers.
  const depth = new Float64Array(z.length);
  for (let i = 0; i < z.length; i++) depth[i] = sign * (z[i]! - otherAt[i]!);
  // Uniform triangles add twice-area x depth sum here (divided by 6 at the end); mixed ones go through addTriangle.
  let cut6 = 0;
  let fill6 = 0;
  let area2 = 0;
  let clipped = 0;
  for (let t = 0; t < tri.length; t += 3) {
    const a = tri[t]!, b = tri[t + 1]!, d = tri[t + 2]!;
    const da = depth[a]!, db = depth[b]!, dd = depth[d]!;
    const ax = c[2 * a]!, ay = c[2 * a + 1]!, bx = c[2 * b]!, by = c[2 * b + 1]!, dx = c[2 * d]!, dy = c[2 * d + 1]!;
    if (da === da && db === db && dd === dd) {
      const twice = Math.abs((bx - ax) * (dy - ay) - (by - ay) * (dx - ax));
      const sum = da + db + dd;
      if (da >= 0 && db >= 0 && dd >= 0) {
        cut6 += twice * sum;
        area2 += twice;
      } else if (da <= 0 && db <= 0 && dd <= 0) {
        fill6 -= twice * sum;
        area2 += twice;
      } else addTriangle(twice / 2, da, db, dd, acc);
      continue;
    }
    if (!(da === da || db === db || dd === dd || marked[t / 3] === 1)) continue;
    clipped++;
    poly.n = 0;
    poly.push(ax, ay, otherAt[a]!);
    poly.push(bx, by, otherAt[b]!);
    poly.push(dx, dy, otherAt[d]!);
    const out = clipToHull(poly, hull, scratch);
    addPolygon(out, own, t / 3, sign, acc);
  }
  return { cut: acc[0]! + cut6 / 6, fill: acc[1]! + fill6 / 6, area: acc[2]! + area2 / 2, triangles: tri.length / 3, clipped };
}

/** Fan over a clipped (convex) polygon; own z from own triangle's plane, other z carried by the clip. */
function addPolygon(p: ClipPolygon, own: Tin, t: number, sign: number, acc: Float64Array): void {
  if (p.n < 3) return;
  const d = new Float64Array(p.n);
  for (let i = 0; i < p.n; i++) d[i] = sign * (own.locator.interpolate(t, p.x[i]!, p.y[i]!, own.z) - p.z[i]!);
  for (let i = 1; i + 1 < p.n; i++) {
    const area = Math.abs((p.x[i]! - p.x[0]!) * (p.y[i + 1]! - p.y[0]!) - (p.y[i]! - p.y[0]!) * (p.x[i + 1]! - p.x[0]!)) / 2;
    addTriangle(area, d[0]!, d[i]!, d[i + 1]!, acc);
  }
}
