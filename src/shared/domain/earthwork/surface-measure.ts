import { GroupCells, HeightBounds, strictlyInsideHull } from './surface-bounds';
import { overlay, type OverlayTotals } from './surface-overlay';
import type { PayRegion } from './surface-pay';
import type { Tin } from './surface-tin';

export interface MeasuredTotals extends OverlayTotals {
  /** Triangles of `a` taken whole (inside b's footprint, the depth of one sign throughout), not clipped. */
  whole: number;
}

/** Groups of a's triangles: clipped by b, taken whole with no fill, whole with no cut, outside the pay limits. */
const CLIPPED = 0,
  WHOLE_CUT = 1,
  WHOLE_FILL = 2,
  UNPAID = 3;

/**
 * Cut and fill between the surfaces of `a` (existing) and `b` (design) over the plan area both cover, inside
 * the pay limits, exactly as the full overlay gives them (surface-overlay.ts) with far less clipping. A triangle
 * t of `a` strictly inside b's footprint whose lowest corner is at or above every height of b near it (the
 * cells of HeightBounds under its box; a linear triangle's extremes are at its corners) has no fill: its cut
 * is the prism's volume, the integral of a over t (plan area x mean corner height) less the integral of b over
 * t; likewise with the signs turned. Only the integral of b over all such triangles together is needed, and it
 * comes from b's side: b's triangles that lie wholly among them (GroupCells) are taken whole, and only those
 * on the edge of the group are clipped by a's triangles. Heights are measured from `z0` (the middle of both
 * surveys' heights) so the sums keep their digits. Faces as given (a footprint that may be non-convex) and
 * `clipAll` take the full overlay.
 */
export function measure(a: Tin, b: Tin, pay: PayRegion | null, clipAll = false): MeasuredTotals {
  if (clipAll || !a.convex || !b.convex) return { ...overlay(a, b, pay), whole: 0 };
  const statusA = pay ? pay.classify(a) : null;
  const group = groupTriangles(a, b, statusA);
  let wholeCount = 0;
  for (let t = 0; t < group.length; t++) if (group[t] === WHOLE_CUT || group[t] === WHOLE_FILL) wholeCount++;
  if (wholeCount === 0) return { ...overlay(a, b, pay, { status: statusA }), whole: 0 };
  const z0 = middleHeight(a, b);
  const skip = new Uint8Array(group.length);
  const ta = a.mesh.triangles;
  // Integral of (a - z0) over each group taken whole, and their plan areas.
  const own = new Float64Array(4);
  let whole = 0,
    wholeArea = 0,
    wholePaidArea = 0;
  for (let t = 0; t < group.length; t++) {
    const g = group[t]!;
    if (g === CLIPPED) continue;
    skip[t] = 1;
    whole++;
    const i = ta[3 * t]!,
      j = ta[3 * t + 1]!,
      k = ta[3 * t + 2]!;
    const area = planArea(a.coords, i, j, k);
    wholeArea += area;
    if (g === UNPAID) continue;
    wholePaidArea += area;
    own[g]! += area * ((a.z[i]! + a.z[j]! + a.z[k]!) / 3 - z0);
  }
  const clipped = overlay(a, b, pay, { skip, z0, status: statusA });
  const under = integralsOver(b, a, group, z0);
  return {
    cut: clipped.cut + Math.max(0, own[WHOLE_CUT]! - under[WHOLE_CUT]!),
    fill: clipped.fill + Math.max(0, under[WHOLE_FILL]! - own[WHOLE_FILL]!),
    area: clipped.area + wholePaidArea,
    overlapArea: clipped.overlapArea + wholeArea,
    pieces: clipped.pieces,
    own: clipped.own + own[WHOLE_CUT]! + own[WHOLE_FILL]!,
    whole: whole,
  };
}

/**
 * Integral of (b - z0) over each group of a's triangles (groups WHOLE_CUT and WHOLE_FILL, which lie inside b's
 * footprint and inside the pay limits): b's triangles strictly inside a's footprint whose box meets one group
 * only are taken whole, those meeting none of the two are left out, the rest are clipped by a's triangles.
 */
function integralsOver(b: Tin, a: Tin, group: Uint8Array, z0: number): Float64Array {
  const cells = new GroupCells(a, group);
  const inA = strictlyInsideHull(a, b.coords);
  const tb = b.mesh.triangles;
  const c = b.coords;
  const z = b.z;
  const sums = new Float64Array(4);
  const skip = new Uint8Array(tb.length / 3);
  const wanted = (1 << WHOLE_CUT) | (1 << WHOLE_FILL);
  for (let u = 0; u < skip.length; u++) {
    const i = tb[3 * u]!,
      j = tb[3 * u + 1]!,
      k = tb[3 * u + 2]!;
    const bits = cells.under(
      Math.min(c[2 * i]!, c[2 * j]!, c[2 * k]!),
      Math.min(c[2 * i + 1]!, c[2 * j + 1]!, c[2 * k + 1]!),
      Math.max(c[2 * i]!, c[2 * j]!, c[2 * k]!),
      Math.max(c[2 * i + 1]!, c[2 * j + 1]!, c[2 * k + 1]!),
    );
    if ((bits & wanted) === 0) {
      skip[u] = 1;
      continue;
    }
    if (!inA[i] || !inA[j] || !inA[k] || (bits !== 1 << WHOLE_CUT && bits !== 1 << WHOLE_FILL)) continue;
    skip[u] = 1;
    sums[bits === 1 << WHOLE_CUT ? WHOLE_CUT : WHOLE_FILL]! +=
      planArea(c, i, j, k) * ((z[i]! + z[j]! + z[k]!) / 3 - z0);
  }
  const of = new Uint8Array(group.length);
  for (let t = 0; t < of.length; t++) of[t] = group[t] === WHOLE_CUT || group[t] === WHOLE_FILL ? group[t]! : 0;
  overlay(b, a, null, { skip, z0, groups: { of, sums } });
  return sums;
}

/**
 * Each triangle of `a`: CLIPPED when not strictly inside b's footprint, crossing a pay limit, or with corner
 * heights that do not settle the sign of the depth against b's bounds under its box; UNPAID outside the pay
 * limits; else WHOLE_CUT (lowest corner at or above b there) or WHOLE_FILL (highest at or below).
 */
function groupTriangles(a: Tin, b: Tin, status: Uint8Array | null): Uint8Array {
  const ta = a.mesh.triangles;
  const c = a.coords;
  const z = a.z;
  const inB = strictlyInsideHull(b, c);
  const bounds = new HeightBounds(b);
  const range = new Float64Array(2);
  const group = new Uint8Array(ta.length / 3);
  for (let t = 0; t < group.length; t++) {
    const i = ta[3 * t]!,
      j = ta[3 * t + 1]!,
      k = ta[3 * t + 2]!;
    if (!inB[i] || !inB[j] || !inB[k] || (status !== null && status[t] === 3)) continue;
    if (status !== null && status[t] === 2) {
      group[t] = UNPAID;
      continue;
    }
    bounds.range(
      Math.min(c[2 * i]!, c[2 * j]!, c[2 * k]!),
      Math.min(c[2 * i + 1]!, c[2 * j + 1]!, c[2 * k + 1]!),
      Math.max(c[2 * i]!, c[2 * j]!, c[2 * k]!),
      Math.max(c[2 * i + 1]!, c[2 * j + 1]!, c[2 * k + 1]!),
      range,
    );
    if (Math.min(z[i]!, z[j]!, z[k]!) >= range[1]!) group[t] = WHOLE_CUT;
    else if (Math.max(z[i]!, z[j]!, z[k]!) <= range[0]!) group[t] = WHOLE_FILL;
  }
  return group;
}

/** Plan area of a triangle (a prism's volume is this times the mean of its corner heights). */
function planArea(c: Float64Array, i: number, j: number, k: number): number {
  const x0 = c[2 * i]!,
    y0 = c[2 * i + 1]!;
  return Math.abs((c[2 * j]! - x0) * (c[2 * k + 1]! - y0) - (c[2 * j + 1]! - y0) * (c[2 * k]! - x0)) / 2;
}

function middleHeight(a: Tin, b: Tin): number {
  let lo = Infinity,
    hi = -Infinity;
  for (const z of [a.z, b.z]) {
    for (let i = 0; i < z.length; i++) {
      if (z[i]! < lo) lo = z[i]!;
      if (z[i]! > hi) hi = z[i]!;
    }
  }
  return (lo + hi) / 2;
}
