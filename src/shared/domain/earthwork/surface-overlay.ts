import type { PayRegion } from './surface-pay';
import { addRing, integrateRing, Ring, type Linear } from './surface-moments';
import type { Tin } from './surface-tin';

export type { Tin } from './surface-tin';

export interface OverlayTotals {
  /** Cubic and square coordinate units, inside the pay limits when given. */
  cut: number;
  fill: number;
  area: number;
  /** Plan area both surfaces cover, pay limits left aside. */
  overlapArea: number;
  /** Convex pieces (triangle of one clipped by a triangle of the other) with positive area. */
  pieces: number;
  /** Integral of a's height less `z0` over the pieces (inside the pay limits when given). */
  own: number;
}

export interface OverlayOptions {
  /** Triangles of `a` marked 1 are left out (the caller takes them whole). */
  skip?: Uint8Array | null;
  /** Height subtracted from a's surface in `own` (keeps digits when elevations are large). */
  z0?: number;
  /** `pay.classify(a)` when the caller already has it. */
  status?: Uint8Array | null;
  /**
   * Integrals by group instead of cut and fill: each piece adds the integral of (a's height - z0) over it to
   * `sums[of[s]]`, s the triangle of `b` under it (group 0 is not summed). Pay limits are not applied.
   */
  groups?: { of: Uint8Array; sums: Float64Array } | null;
  /** Shown each convex piece and its depth (a's height less b's, linear over it), for a picture (surface-map.ts). */
  sink?: ((piece: Ring, depth: Linear) => void) | null;
}

/** Plan area of a mesh (sum of its triangles). */
export function tinArea(t: Tin): number {
  const tri = t.mesh.triangles;
  const c = t.coords;
  let twice = 0;
  for (let i = 0; i < tri.length; i += 3) {
    const a = 2 * tri[i]!,
      b = 2 * tri[i + 1]!,
      d = 2 * tri[i + 2]!;
    twice += Math.abs((c[b]! - c[a]!) * (c[d + 1]! - c[a + 1]!) - (c[b + 1]! - c[a + 1]!) * (c[d]! - c[a]!));
  }
  return twice / 2;
}

function orientationOf(t: Tin): number {
  const tri = t.mesh.triangles;
  const c = t.coords;
  for (let i = 0; i < tri.length; i += 3) {
    const a = 2 * tri[i]!,
      b = 2 * tri[i + 1]!,
      d = 2 * tri[i + 2]!;
    const cr = (c[b]! - c[a]!) * (c[d + 1]! - c[a + 1]!) - (c[b + 1]! - c[a + 1]!) * (c[d]! - c[a]!);
    if (cr !== 0) return Math.sign(cr);
  }
  return 1;
}

/** Keeps the part of `src` on the inner side of the directed edge p -> q (orientation o) into `dst`. */
function clipEdge(src: Ring, px: number, py: number, qx: number, qy: number, o: number, dst: Ring): void {
  dst.n = 0;
  const ex = qx - px,
    ey = qy - py;
  const n = src.n;
  if (n === 0) return;
  let xi = src.x[n - 1]!,
    yi = src.y[n - 1]!;
  let si = (ex * (yi - py) - ey * (xi - px)) * o;
  for (let j = 0; j < n; j++) {
    const xj = src.x[j]!,
      yj = src.y[j]!;
    const sj = (ex * (yj - py) - ey * (xj - px)) * o;
    if (si >= 0 !== sj >= 0) {
      const t = si / (si - sj);
      dst.push(xi + t * (xj - xi), yi + t * (yj - yi));
    }
    if (sj >= 0) dst.push(xj, yj);
    xi = xj;
    yi = yj;
    si = sj;
  }
}

function ringArea(r: Ring): number {
  let a2 = 0;
  for (let i = 0, n = r.n; i < n; i++) {
    const j = i + 1 === n ? 0 : i + 1;
    a2 += r.x[i]! * r.y[j]! - r.x[j]! * r.y[i]!;
  }
  return a2 / 2;
}

/**
 * Exact volume between two triangulated surfaces by overlaying their triangulations (the triangular-prism
 * method: each prism's volume = plan area x mean of its depths; surveying texts, reference.md section 9). For
 * every triangle t of `a`, the triangles of `b` that overlap it are found by walking `b`'s mesh: the one under
 * t's centroid (a located walk), then neighbour to neighbour across shared edges while the overlap has area.
 * Each overlap is t clipped by the b triangle (Sutherland-Hodgman against three edges): a convex piece over
 * which both surfaces are planes, so the depth a - b is linear and its cut and fill split exactly along the
 * line where they cross (surface-moments.ts). A triangle of `a` whose centroid is outside `b` is first clipped
 * to `b`'s convex hull (the boundary of a Delaunay mesh), and walked from a point inside that part. When `b` is
 * a file's faces as given (its boundary need not be convex), the walks start from every triangle of `b` listed in
 * the bucket cells under t's box (surface-buckets.ts) that no earlier walk for t reached.
 */
export function overlay(a: Tin, b: Tin, pay: PayRegion | null, options: OverlayOptions = {}): OverlayTotals {
  const skip = options.skip ?? null;
  const z0 = options.z0 ?? 0;
  const groups = options.groups ?? null;
  const sink = options.sink ?? null;
  const ta = a.mesh.triangles;
  const tb = b.mesh.triangles;
  const hb = b.mesh.halfedges;
  const ca = a.coords;
  const cb = b.coords;
  const za = a.z;
  const ob = orientationOf(b);
  const stamp = new Int32Array(tb.length / 3);
  let stack = new Int32Array(64);
  const tri = new Ring(4);
  const r1 = new Ring(8);
  const r2 = new Ring(8);
  const scratch = new Ring(16);
  const acc = new Float64Array(4);
  const tmp = new Float64Array(3);
  const f: Linear = { d0: 0, dx: 0, dy: 0, x0: 0, y0: 0 };
  const g: Linear = { d0: 0, dx: 0, dy: 0, x0: 0, y0: 0 };
  const hull = b.convex ? hullRing(b) : null;
  // b's planes, worked when a piece first needs one (most of b may lie under triangles left out).
  const planeB = new Float64Array(tb.length);
  const planeKnown = new Uint8Array(tb.length / 3);
  const buckets = b.convex ? null : b.buckets;
  const seeds: number[] = [];
  const status = pay && !groups ? (options.status ?? pay.classify(a)) : null;
  let overlapArea = 0;
  let pieces = 0;

  // Triangles of `a` in their (plan-ordered, surface-tin.ts) numbering: each is located in `b` by a walk from
  // where an earlier neighbour was found (a step or two), else from the grid seed.
  const hint = new Int32Array(ta.length / 3).fill(-1);
  const ha = a.mesh.halfedges;
  for (let k = 0; k < ta.length; k += 3) {
    const tIndex = k / 3;
    if (skip && skip[tIndex] === 1) continue;
    const ia = ta[k]!,
      ib = ta[k + 1]!,
      ic = ta[k + 2]!;
    const ax = ca[2 * ia]!,
      ay = ca[2 * ia + 1]!;
    const ex = ca[2 * ib]! - ax,
      ey = ca[2 * ib + 1]! - ay,
      fx = ca[2 * ic]! - ax,
      fy = ca[2 * ic + 1]! - ay;
    const det = ex * fy - ey * fx;
    if (det === 0) continue;
    const zA = za[ia]!,
      dzb = za[ib]! - zA,
      dzc = za[ic]! - zA;
    const pA = (dzb * fy - dzc * ey) / det;
    const qA = (dzc * ex - dzb * fx) / det;
    g.x0 = ax;
    g.y0 = ay;
    g.d0 = zA - z0;
    g.dx = pA;
    g.dy = qA;
    tri.n = 0;
    tri.push(ax, ay);
    tri.push(ax + ex, ay + ey);
    tri.push(ax + fx, ay + fy);
    const tx0 = Math.min(ax, ax + ex, ax + fx),
      tx1 = Math.max(ax, ax + ex, ax + fx);
    const ty0 = Math.min(ay, ay + ey, ay + fy),
      ty1 = Math.max(ay, ay + ey, ay + fy);
    let seed = -1;
    if (buckets) buckets.candidates(tx0, ty0, tx1, ty1, seeds);
    else {
      const h = hint[tIndex]!;
      const cx = ax + (ex + fx) / 3,
        cy = ay + (ey + fy) / 3;
      seed = h >= 0 ? b.locator.locateFrom(h, cx, cy) : b.locator.locate(cx, cy, true);
      if (seed < 0) seed = seedFromHull(tri, hull!, b, r1, r2);
      if (seed < 0) continue;
      for (let e = k; e < k + 3; e++) {
        const o = ha[e]!;
        if (o >= 0) {
          const nb = (o / 3) | 0;
          if (hint[nb]! < 0) hint[nb] = seed;
        }
      }
    }
    const mark = tIndex + 1;
    // A convex mesh: one walk from the seed reaches every overlapping triangle. Faces as given (maybe with
    // notches or holes, where the overlap with t can come apart): a walk from each candidate not yet reached.
    for (let q = 0, count = buckets ? seeds.length : 1; q < count; q++) {
      const first = buckets ? seeds[q]! : seed;
      if (stamp[first] === mark) continue;
      stamp[first] = mark;
      stack[0] = first;
      let top = 1;
      while (top > 0) {
        const s = stack[--top]!;
        const e0 = 3 * s;
        const j0 = tb[e0]!,
          j1 = tb[e0 + 1]!,
          j2 = tb[e0 + 2]!;
        const x0 = cb[2 * j0]!,
          y0 = cb[2 * j0 + 1]!,
          x1 = cb[2 * j1]!,
          y1 = cb[2 * j1 + 1]!,
          x2 = cb[2 * j2]!,
          y2 = cb[2 * j2 + 1]!;
        // Boxes apart: no overlap (the cheapest test).
        if (
          (x0 > tx1 && x1 > tx1 && x2 > tx1) ||
          (x0 < tx0 && x1 < tx0 && x2 < tx0) ||
          (y0 > ty1 && y1 > ty1 && y2 > ty1) ||
          (y0 < ty0 && y1 < ty0 && y2 < ty0)
        )
          continue;
        // Sides of t's corners against each edge of s: all outside one edge means no overlap; none outside an
        // edge means the neighbour across it cannot overlap t (it lies beyond that edge), so it is not walked to.
        const bx0 = ax,
          by0 = ay,
          bx1 = ax + ex,
          by1 = ay + ey,
          bx2 = ax + fx,
          by2 = ay + fy;
        let g0 = x1 - x0,
          h0 = y1 - y0;
        const a0 = (g0 * (by0 - y0) - h0 * (bx0 - x0)) * ob,
          a1 = (g0 * (by1 - y0) - h0 * (bx1 - x0)) * ob,
          a2 = (g0 * (by2 - y0) - h0 * (bx2 - x0)) * ob;
        if (a0 <= 0 && a1 <= 0 && a2 <= 0) continue;
        g0 = x2 - x1;
        h0 = y2 - y1;
        const c0 = (g0 * (by0 - y1) - h0 * (bx0 - x1)) * ob,
          c1 = (g0 * (by1 - y1) - h0 * (bx1 - x1)) * ob,
          c2 = (g0 * (by2 - y1) - h0 * (bx2 - x1)) * ob;
        if (c0 <= 0 && c1 <= 0 && c2 <= 0) continue;
        g0 = x0 - x2;
        h0 = y0 - y2;
        const d0 = (g0 * (by0 - y2) - h0 * (bx0 - x2)) * ob,
          d1 = (g0 * (by1 - y2) - h0 * (bx1 - x2)) * ob,
          d2 = (g0 * (by2 - y2) - h0 * (bx2 - x2)) * ob;
        if (d0 <= 0 && d1 <= 0 && d2 <= 0) continue;
        const out0 = a0 < 0 || a1 < 0 || a2 < 0;
        const out1 = c0 < 0 || c1 < 0 || c2 < 0;
        const out2 = d0 < 0 || d1 < 0 || d2 < 0;
        let piece = tri;
        // Clipped only by the edges some corner of t lies outside: t is convex, so it (and any part of it) lies
        // wholly inside the others' half-planes.
        if (out0) {
          clipEdge(piece, x0, y0, x1, y1, ob, r1);
          piece = r1;
          if (piece.n === 0) continue;
        }
        if (out1) {
          const dst = piece === r1 ? r2 : r1;
          clipEdge(piece, x1, y1, x2, y2, ob, dst);
          piece = dst;
          if (piece.n === 0) continue;
        }
        if (out2) {
          const dst = piece === r1 ? r2 : r1;
          clipEdge(piece, x2, y2, x0, y0, ob, dst);
          piece = dst;
        }
        if (piece.n < 3) continue;
        let area: number;
        if (groups) {
          integrateRing(piece, g, tmp);
          area = tmp[1]!;
          const group = groups.of[s]!;
          if (group !== 0) groups.sums[group]! += area < 0 ? -tmp[0]! : tmp[0]!;
        } else {
          // Depth = (a's plane) - (b's plane), both written about t's first corner; b's plane from its table.
          if (planeKnown[s] === 0) {
            planeOf(b, s, planeB);
            planeKnown[s] = 1;
          }
          const pB = planeB[3 * s]!,
            qB = planeB[3 * s + 1]!;
          f.x0 = ax;
          f.y0 = ay;
          f.d0 = zA - (planeB[3 * s + 2]! + pB * ax + qB * ay);
          f.dx = pA - pB;
          f.dy = qA - qB;
          if (sink) sink(piece, f);
          // The piece's signed area comes with its integral (one pass over its corners).
          if (!status || status[tIndex] === 1) area = addRing(piece, f, acc, scratch, tmp, 1, g);
          else {
            if (status[tIndex] === 3) pay!.addClipped(piece, f, acc, scratch, tmp, g);
            area = ringArea(piece);
          }
        }
        if (!(area !== 0)) continue;
        pieces++;
        overlapArea += Math.abs(area);
        for (let e = e0; e < e0 + 3; e++) {
          if (!(e === e0 ? out0 : e === e0 + 1 ? out1 : out2)) continue;
          const opp = hb[e]!;
          if (opp < 0) continue;
          const nb = (opp / 3) | 0;
          if (stamp[nb] === mark) continue;
          stamp[nb] = mark;
          if (top === stack.length) {
            const bigger = new Int32Array(stack.length * 2);
            bigger.set(stack);
            stack = bigger;
          }
          stack[top++] = nb;
        }
      }
    }
  }
  return { cut: acc[0]!, fill: acc[1]!, area: acc[2]!, overlapArea, pieces, own: acc[3]! };
}

/** Triangle k's plane z = p x + q y + c (shifted plan coordinates) into out[3k..3k+2] as [p, q, c]. */
function planeOf(t: Tin, k: number, out: Float64Array): void {
  const tri = t.mesh.triangles;
  const c = t.coords;
  const z = t.z;
  const j0 = tri[3 * k]!,
    j1 = tri[3 * k + 1]!,
    j2 = tri[3 * k + 2]!;
  const x0 = c[2 * j0]!,
    y0 = c[2 * j0 + 1]!;
  const gx = c[2 * j1]! - x0,
    gy = c[2 * j1 + 1]! - y0,
    hx = c[2 * j2]! - x0,
    hy = c[2 * j2 + 1]! - y0;
  const det = gx * hy - gy * hx;
  const z0 = z[j0]!,
    dz1 = z[j1]! - z0,
    dz2 = z[j2]! - z0;
  const p = (dz1 * hy - dz2 * gy) / det;
  const q = (dz2 * gx - dz1 * hx) / det;
  out[3 * k] = p;
  out[3 * k + 1] = q;
  out[3 * k + 2] = z0 - p * x0 - q * y0;
}

interface HullRing {
  ring: Ring;
  orientation: number;
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

function hullRing(t: Tin): HullRing {
  const ids = t.mesh.hull;
  const ring = new Ring(ids.length);
  let minX = Infinity,
    minY = Infinity,
    maxX = -Infinity,
    maxY = -Infinity;
  for (let i = 0; i < ids.length; i++) {
    const x = t.coords[2 * ids[i]!]!,
      y = t.coords[2 * ids[i]! + 1]!;
    ring.push(x, y);
    if (x < minX) minX = x;
    if (x > maxX) maxX = x;
    if (y < minY) minY = y;
    if (y > maxY) maxY = y;
  }
  return { ring, orientation: Math.sign(ringArea(ring)) || 1, minX, minY, maxX, maxY };
}

/**
 * A triangle of the other mesh under part of `tri` when `tri`'s centroid is outside that mesh: `tri` clipped
 * to the mesh's convex hull, and the centroid of what is left located by a walk. -1 when nothing is left.
 */
function seedFromHull(tri: Ring, hull: HullRing, b: Tin, r1: Ring, r2: Ring): number {
  let minX = Infinity,
    minY = Infinity,
    maxX = -Infinity,
    maxY = -Infinity;
  for (let i = 0; i < tri.n; i++) {
    minX = Math.min(minX, tri.x[i]!);
    maxX = Math.max(maxX, tri.x[i]!);
    minY = Math.min(minY, tri.y[i]!);
    maxY = Math.max(maxY, tri.y[i]!);
  }
  if (maxX < hull.minX || maxY < hull.minY || minX > hull.maxX || minY > hull.maxY) return -1;
  const h = hull.ring;
  let src = r1;
  let dst = r2;
  src.n = 0;
  for (let i = 0; i < tri.n; i++) src.push(tri.x[i]!, tri.y[i]!);
  for (let k = 0; k < h.n && src.n > 0; k++) {
    const k2 = k + 1 === h.n ? 0 : k + 1;
    clipEdge(src, h.x[k]!, h.y[k]!, h.x[k2]!, h.y[k2]!, hull.orientation, dst);
    const t = src;
    src = dst;
    dst = t;
  }
  if (src.n < 3) return -1;
  // Centroid of the clipped polygon (strictly inside it, so inside some triangle of the mesh).
  let a2 = 0,
    cx = 0,
    cy = 0;
  const x0 = src.x[0]!,
    y0 = src.y[0]!;
  for (let i = 1; i + 1 < src.n; i++) {
    const ux = src.x[i]! - x0,
      uy = src.y[i]! - y0,
      vx = src.x[i + 1]! - x0,
      vy = src.y[i + 1]! - y0;
    const c = ux * vy - uy * vx;
    a2 += c;
    cx += c * (ux + vx);
    cy += c * (uy + vy);
  }
  if (a2 === 0) return -1;
  return b.locator.locate(x0 + cx / (3 * a2), y0 + cy / (3 * a2), true);
}
