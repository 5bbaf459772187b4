/**
 * Cut and fill of a linear depth d over one triangle, exactly: where d changes sign the triangle splits along
 * the zero line. With one vertex p on its own side and q, r on the other, the part on p's side is a triangle
 * whose volume is A p^3 / (3 (p - q)(p - r)); the whole is A (p + q + r) / 3. Accumulates into acc: [cut, fill,
 * plan area], in coordinate units (length^3 and length^2).
 */
export function addTriangle(area: number, da: number, db: number, dc: number, acc: Float64Array): void {
  const net = (area * (da + db + dc)) / 3;
  acc[2]! += area;
  if (da >= 0 && db >= 0 && dc >= 0) {
    acc[0]! += net;
    return;
  }
  if (da <= 0 && db <= 0 && dc <= 0) {
    acc[1]! -= net;
    return;
  }
  const positives = (da > 0 ? 1 : 0) + (db > 0 ? 1 : 0) + (dc > 0 ? 1 : 0);
  if (positives === 1) {
    const [p, q, r] = da > 0 ? [da, db, dc] : db > 0 ? [db, da, dc] : [dc, da, db];
    const cut = (area * p * p * p) / (3 * (p - q) * (p - r));
    acc[0]! += cut;
    acc[1]! += cut - net;
  } else {
    const [n, q, r] = da < 0 ? [da, db, dc] : db < 0 ? [db, da, dc] : [dc, da, db];
    const fill = (area * -n * n * n) / (3 * (q - n) * (r - n));
    acc[1]! += fill;
    acc[0]! += net + fill;
  }
}

/**
 * Convex clip outline (the other surface's convex hull) with the other surface's z along its edges, so a point
 * cut on a hull edge gets that surface's exact height there (a Delaunay mesh's boundary is its hull).
 */
export interface ClipHull {
  x: Float64Array;
  y: Float64Array;
  z: Float64Array;
  /** +1 when the hull runs counter-clockwise (inside on the left), -1 otherwise. */
  orientation: number;
}

/** Scratch polygon: x, y and the other surface's z per vertex; up to `capacity` vertices. */
export class ClipPolygon {
  x: Float64Array;
  y: Float64Array;
  z: Float64Array;
  n = 0;
  constructor(capacity: number) {
    this.x = new Float64Array(capacity);
    this.y = new Float64Array(capacity);
    this.z = new Float64Array(capacity);
  }
  push(x: number, y: number, z: number): void {
    this.x[this.n] = x;
    this.y[this.n] = y;
    this.z[this.n] = z;
    this.n++;
  }
}

/**
 * Sutherland-Hodgman clip of `input` to the hull, into `output` (`scratch` is swapped with it). A vertex whose
 * other-surface z is unknown (NaN: it lies outside that surface) always counts as outside.
 */
export function clipToHull(input: ClipPolygon, hull: ClipHull, scratch: ClipPolygon): ClipPolygon {
  let src = input;
  let dst = scratch;
  const h = hull.x.length;
  for (let k = 0; k < h && src.n > 0; k++) {
    const k2 = k + 1 === h ? 0 : k + 1;
    const ax = hull.x[k]!, ay = hull.y[k]!, ex = hull.x[k2]! - ax, ey = hull.y[k2]! - ay;
    const len2 = ex * ex + ey * ey;
    const side = (i: number) => {
      const s = (ex * (src.y[i]! - ay) - ey * (src.x[i]! - ax)) * hull.orientation;
      return src.z[i]! === src.z[i]! ? s : Math.min(s, -1e-300);
    };
    dst.n = 0;
    for (let i = 0; i < src.n; i++) {
      const j = i + 1 === src.n ? 0 : i + 1;
      const si = side(i);
      const sj = side(j);
      if (si >= 0) dst.push(src.x[i]!, src.y[i]!, src.z[i]!);
      if ((si >= 0) !== (sj >= 0)) {
        const t = Math.min(1, Math.max(0, si / (si - sj)));
        const px = src.x[i]! + t * (src.x[j]! - src.x[i]!);
        const py = src.y[i]! + t * (src.y[j]! - src.y[i]!);
        // Height of the other surface along this hull edge, at the projection of the cut point.
        const u = len2 > 0 ? Math.min(1, Math.max(0, ((px - ax) * ex + (py - ay) * ey) / len2)) : 0;
        dst.push(px, py, hull.z[k]! + u * (hull.z[k2]! - hull.z[k]!));
      }
    }
    const t = src;
    src = dst;
    dst = t;
  }
  return src;
}
