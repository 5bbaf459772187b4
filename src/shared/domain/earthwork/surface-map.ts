import type { LengthUnit } from '../../constants';
import { overlay } from './surface-overlay';
import { Ring, type Linear } from './surface-moments';
import { buildTin, type SurfacePoints } from './surface-tin';

/** Depth bands each side of zero: equal colours mean equal bands of depth. */
export const MAP_STEPS = 6;
/** Surveys above this many points are thinned for the picture (about 130,000 pieces at most), never the volume. */
export const MAP_MAX_POINTS = 12_000;

/**
 * The cut and fill map: the overlay's own pieces (each existing triangle clipped by the design triangles under it,
 * surface-overlay.ts), over each of which the depth (existing less design) is linear, cut along the lines where
 * the depth crosses a band's limit, so every polygon lies in one band. Polygons in plan, relative to (x0, y0) in
 * the surveys' units.
 */
export interface DepthMap {
  x0: number;
  y0: number;
  /** Width and height of the box the polygons fill. */
  width: number;
  height: number;
  /** Corners of each polygon (x, y relative to x0, y0), polygon after polygon. */
  xy: Float32Array;
  /** Corner count of each polygon. */
  counts: Uint8Array;
  /** Band of each polygon: 1..MAP_STEPS cut, -1..-MAP_STEPS fill, 0 within the survey precision. */
  band: Int8Array;
  /** Depth of one band; deepest cut and fill (>= 0) over the pieces, at their corners. */
  step: number;
  maxCut: number;
  maxFill: number;
  /** Depths below this (0.01 ft, 0.003 m; common practice) are within survey precision and left blank. */
  level: number;
  /** Overlay pieces drawn. */
  pieces: number;
  /** Plan cell each large survey was thinned to (one point kept a cell) for the picture; 0 when not thinned. */
  thinnedCell: number;
}

/**
 * One point a plan cell (the one nearest the cell's centre), about `max` points in all; the survey itself when it
 * has no more. A thinned survey is triangulated anew (Delaunay): its faces and breaklines are left out.
 */
export function thinSurvey(p: SurfacePoints, max: number): { points: SurfacePoints; cell: number } {
  const n = p.x.length;
  if (n <= max) return { points: p, cell: 0 };
  let x0 = Infinity,
    y0 = Infinity,
    x1 = -Infinity,
    y1 = -Infinity;
  for (let i = 0; i < n; i++) {
    x0 = Math.min(x0, p.x[i]!);
    x1 = Math.max(x1, p.x[i]!);
    y0 = Math.min(y0, p.y[i]!);
    y1 = Math.max(y1, p.y[i]!);
  }
  const cell = Math.sqrt((Math.max(x1 - x0, 1e-9) * Math.max(y1 - y0, 1e-9)) / max);
  const across = Math.max(1, Math.ceil((x1 - x0) / cell) + 1);
  const down = Math.max(1, Math.ceil((y1 - y0) / cell) + 1);
  const best = new Int32Array(across * down).fill(-1);
  const dist = new Float64Array(across * down);
  for (let i = 0; i < n; i++) {
    const fx = (p.x[i]! - x0) / cell,
      fy = (p.y[i]! - y0) / cell;
    const c = Math.min(down - 1, Math.floor(fy)) * across + Math.min(across - 1, Math.floor(fx));
    const d = (fx - Math.floor(fx) - 0.5) ** 2 + (fy - Math.floor(fy) - 0.5) ** 2;
    if (best[c]! < 0 || d < dist[c]!) {
      best[c] = i;
      dist[c] = d;
    }
  }
  const kept: number[] = [];
  for (const i of best) if (i >= 0) kept.push(i);
  const pick = (col: ArrayLike<number>) => Float64Array.from(kept, (i) => col[i]!);
  return { points: { x: pick(p.x), y: pick(p.y), z: pick(p.z) }, cell };
}

/** The overlay's pieces kept flat: corners, where each piece starts, and its depth (d0, dx, dy, x0, y0). */
class Pieces {
  xy = new Float64Array(4096);
  start = new Int32Array(1025);
  f = new Float64Array(5 * 1024);
  n = 0;
  add(r: Ring, f: Linear): void {
    const at = this.start[this.n]!;
    if (at + 2 * r.n > this.xy.length) this.xy = grown(this.xy, at + 2 * r.n);
    if (this.n + 2 > this.start.length) {
      this.start = grown(this.start, this.n + 2);
      this.f = grown(this.f, 5 * this.start.length);
    }
    for (let i = 0; i < r.n; i++) {
      this.xy[at + 2 * i] = r.x[i]!;
      this.xy[at + 2 * i + 1] = r.y[i]!;
    }
    const g = 5 * this.n;
    this.f[g] = f.d0;
    this.f[g + 1] = f.dx;
    this.f[g + 2] = f.dy;
    this.f[g + 3] = f.x0;
    this.f[g + 4] = f.y0;
    this.start[++this.n] = at + 2 * r.n;
  }
  read(p: number, into: Ring, f: Linear): void {
    into.n = 0;
    for (let k = this.start[p]!; k < this.start[p + 1]!; k += 2) into.push(this.xy[k]!, this.xy[k + 1]!);
    const g = 5 * p;
    f.d0 = this.f[g]!;
    f.dx = this.f[g + 1]!;
    f.dy = this.f[g + 2]!;
    f.x0 = this.f[g + 3]!;
    f.y0 = this.f[g + 4]!;
  }
}

/** Growable columns of band polygons. */
class Polygons {
  xy = new Float32Array(1024);
  counts = new Uint8Array(256);
  band = new Int8Array(256);
  n = 0;
  used = 0;
  add(r: Ring, band: number): void {
    if (r.n < 3) return;
    if (this.used + 2 * r.n > this.xy.length) this.xy = grown(this.xy, this.used + 2 * r.n);
    if (this.n === this.counts.length) {
      this.counts = grown(this.counts, this.n + 1);
      this.band = grown(this.band, this.n + 1);
    }
    for (let i = 0; i < r.n; i++) {
      this.xy[this.used++] = r.x[i]!;
      this.xy[this.used++] = r.y[i]!;
    }
    this.counts[this.n] = r.n;
    this.band[this.n++] = band;
  }
}

function grown<T extends Float64Array | Float32Array | Int32Array | Uint8Array | Int8Array>(a: T, need: number): T {
  const b = new (a.constructor as new (n: number) => T)(Math.max(need, 2 * a.length));
  b.set(a);
  return b;
}

/** Keeps the part of `src` where the depth is on one side of `limit` (`above`: d >= limit) into `dst`. */
function clipDepth(src: Ring, f: Linear, limit: number, above: boolean, dst: Ring): void {
  dst.n = 0;
  const s = above ? 1 : -1;
  const n = src.n;
  for (let i = 0; i < n; i++) {
    const j = i + 1 === n ? 0 : i + 1;
    const di = s * (f.d0 + f.dx * (src.x[i]! - f.x0) + f.dy * (src.y[i]! - f.y0) - limit);
    const dj = s * (f.d0 + f.dx * (src.x[j]! - f.x0) + f.dy * (src.y[j]! - f.y0) - limit);
    if (di >= 0) dst.push(src.x[i]!, src.y[i]!);
    if (di >= 0 !== dj >= 0) {
      const t = di / (di - dj);
      dst.push(src.x[i]! + t * (src.x[j]! - src.x[i]!), src.y[i]! + t * (src.y[j]! - src.y[i]!));
    }
  }
}

/**
 * The map of two surveys (as the volume builds their TINs: faces, breaklines or Delaunay; thinned above
 * MAP_MAX_POINTS points, see thinSurvey), or null when they cannot be triangulated or do not overlap. Pay limits
 * are drawn over it by the picture; the pieces cover the whole area both surveys reach.
 */
export function depthMap(existing: SurfacePoints, design: SurfacePoints, unit: LengthUnit): DepthMap | null {
  const e0 = thinSurvey(existing, MAP_MAX_POINTS);
  const d0 = thinSurvey(design, MAP_MAX_POINTS);
  let ox = Infinity,
    oy = Infinity;
  for (const p of [e0.points, d0.points])
    for (let i = 0; i < p.x.length; i++) {
      ox = Math.min(ox, p.x[i]!);
      oy = Math.min(oy, p.y[i]!);
    }
  let e, d;
  try {
    e = buildTin(e0.points, ox, oy, 'existing');
    d = buildTin(d0.points, ox, oy, 'design');
  } catch {
    return null;
  }
  // First the pieces with their corner depths (the deepest sets the bands), kept flat (no object a piece), then
  // each cut into bands.
  const kept = new Pieces();
  let maxCut = 0,
    maxFill = 0;
  overlay(e, d, null, {
    sink: (piece, f) => {
      for (let i = 0; i < piece.n; i++) {
        const v = f.d0 + f.dx * (piece.x[i]! - f.x0) + f.dy * (piece.y[i]! - f.y0);
        if (v > maxCut) maxCut = v;
        if (-v > maxFill) maxFill = -v;
      }
      kept.add(piece, f);
    },
  });
  if (kept.n === 0) return null;
  const level = unit === 'm' ? 0.003 : 0.01;
  const step = Math.max(maxCut, maxFill, level) / MAP_STEPS;
  // Band limits in depth order: fill bands, the blank band about zero, cut bands.
  const limits: number[] = [];
  for (let k = MAP_STEPS - 1; k >= 1; k--) limits.push(-k * step);
  limits.push(-level, level);
  for (let k = 1; k < MAP_STEPS; k++) limits.push(k * step);
  const bandOf = (v: number) =>
    Math.abs(v) < level ? 0 : Math.sign(v) * Math.min(MAP_STEPS, Math.floor(Math.abs(v) / step) + 1);
  const out = new Polygons();
  let x1 = 0,
    y1 = 0;
  const below = new Ring(16);
  let current = new Ring(16),
    other = new Ring(16);
  const f: Linear = { d0: 0, dx: 0, dy: 0, x0: 0, y0: 0 };
  for (let p = 0; p < kept.n; p++) {
    kept.read(p, current, f);
    let lo = Infinity,
      hi = -Infinity;
    for (let i = 0; i < current.n; i++) {
      const v = f.d0 + f.dx * (current.x[i]! - f.x0) + f.dy * (current.y[i]! - f.y0);
      lo = Math.min(lo, v);
      hi = Math.max(hi, v);
      x1 = Math.max(x1, current.x[i]!);
      y1 = Math.max(y1, current.y[i]!);
    }
    let from = lo;
    for (const limit of limits) {
      if (limit <= from || limit >= hi) continue;
      clipDepth(current, f, limit, false, below);
      out.add(below, bandOf((from + limit) / 2));
      clipDepth(current, f, limit, true, other);
      const swap = current;
      current = other;
      other = swap;
      from = limit;
    }
    out.add(current, bandOf((from + hi) / 2));
  }
  return {
    x0: ox,
    y0: oy,
    width: x1,
    height: y1,
    xy: out.xy.slice(0, out.used),
    counts: out.counts.slice(0, out.n),
    band: out.band.slice(0, out.n),
    step,
    maxCut,
    maxFill,
    level,
    pieces: kept.n,
    thinnedCell: Math.max(e0.cell, d0.cell),
  };
}
