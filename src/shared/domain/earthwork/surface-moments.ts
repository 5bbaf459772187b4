/**
 * Integrals of a linear depth d(x, y) = d0 + dx (x - x0) + dy (y - y0) over a polygon, from the polygon's area
 * and first moments (shoelace sums, Green's theorem): integral of d = d0 A + dx Sx + dy Sy, with Sx and Sy the
 * moments about (x0, y0). True for any simple polygon, convex or not, and for the outlines a half-plane clip
 * leaves. The positive part comes from the polygon clipped to d >= 0 (one half-plane, Sutherland-Hodgman), so
 * cut and fill are split exactly along the line where the two surfaces cross.
 */
export class Ring {
  x: Float64Array;
  y: Float64Array;
  n = 0;
  constructor(capacity: number) {
    this.x = new Float64Array(capacity);
    this.y = new Float64Array(capacity);
  }
  push(x: number, y: number): void {
    if (this.n === this.x.length) this.grow();
    this.x[this.n] = x;
    this.y[this.n] = y;
    this.n++;
  }
  private grow(): void {
    const x = new Float64Array(this.x.length * 2);
    const y = new Float64Array(this.y.length * 2);
    x.set(this.x);
    y.set(this.y);
    this.x = x;
    this.y = y;
  }
}

/** A linear function d(x, y) = d0 + dx (x - x0) + dy (y - y0). */
export interface Linear {
  d0: number;
  dx: number;
  dy: number;
  x0: number;
  y0: number;
}

/** Signed integral of f over the ring (positive when counter-clockwise), with its signed area: [integral, area] (`out` has room for 3). */
export function integrateRing(r: Ring, f: Linear, out: Float64Array): void {
  moments(r, f.x0, f.y0, out);
  const a2 = out[0]!;
  out[0] = (f.d0 * a2) / 2 + (f.dx * out[1]! + f.dy * out[2]!) / 6;
  out[1] = a2 / 2;
}

/** Ring clipped to f >= 0 into `dst` (Sutherland-Hodgman against one half-plane). */
export function clipPositive(src: Ring, f: Linear, dst: Ring): void {
  dst.n = 0;
  const n = src.n;
  for (let i = 0; i < n; i++) {
    const j = i + 1 === n ? 0 : i + 1;
    const xi = src.x[i]!,
      yi = src.y[i]!,
      xj = src.x[j]!,
      yj = src.y[j]!;
    const di = f.d0 + f.dx * (xi - f.x0) + f.dy * (yi - f.y0);
    const dj = f.d0 + f.dx * (xj - f.x0) + f.dy * (yj - f.y0);
    if (di >= 0) dst.push(xi, yi);
    if (di >= 0 !== dj >= 0) {
      const t = di / (di - dj);
      dst.push(xi + t * (xj - xi), yi + t * (yj - yi));
    }
  }
}

/**
 * Adds the cut (f > 0) and fill (f < 0) of f over the ring to acc [cut, fill, area], as positive volumes and
 * area whatever the ring's orientation, and with `g` (a second linear function about the same point x0, y0)
 * its integral to acc[3] with the same orientation. `scratch` holds the clipped ring; `tmp` has room for 3.
 * Answers the ring's signed area.
 */
export function addRing(
  r: Ring,
  f: Linear,
  acc: Float64Array,
  scratch: Ring,
  tmp: Float64Array,
  sign = 1,
  g: Linear | null = null,
): number {
  if (r.n < 3) return 0;
  moments(r, f.x0, f.y0, tmp);
  const a2 = tmp[0]!,
    sx6 = tmp[1]!,
    sy6 = tmp[2]!;
  const signed = a2 / 2;
  const orient = signed < 0 ? -sign : sign;
  const net = ((f.d0 * a2) / 2 + (f.dx * sx6 + f.dy * sy6) / 6) * orient;
  acc[2]! += signed * orient;
  if (g) acc[3]! += ((g.d0 * a2) / 2 + (g.dx * sx6 + g.dy * sy6) / 6) * orient;
  let pos = 0;
  let neg = 0;
  for (let i = 0; i < r.n; i++) {
    const d = f.d0 + f.dx * (r.x[i]! - f.x0) + f.dy * (r.y[i]! - f.y0);
    if (d > 0) pos++;
    else if (d < 0) neg++;
  }
  if (neg === 0) {
    acc[0]! += net;
    return signed;
  }
  if (pos === 0) {
    acc[1]! -= net;
    return signed;
  }
  clipPositive(r, f, scratch);
  integrateRing(scratch, f, tmp);
  const cut = tmp[0]! * orient;
  acc[0]! += cut;
  acc[1]! += cut - net;
  return signed;
}

/** Twice the signed area and six times the first moments about (x0, y0) of the ring: [2A, 6Sx, 6Sy] in `out`. */
function moments(r: Ring, x0: number, y0: number, out: Float64Array): void {
  let a2 = 0;
  let sx6 = 0;
  let sy6 = 0;
  const n = r.n;
  for (let i = 0; i < n; i++) {
    const j = i + 1 === n ? 0 : i + 1;
    const xi = r.x[i]! - x0,
      yi = r.y[i]! - y0,
      xj = r.x[j]! - x0,
      yj = r.y[j]! - y0;
    const c = xi * yj - xj * yi;
    a2 += c;
    sx6 += (xi + xj) * c;
    sy6 += (yi + yj) * c;
  }
  out[0] = a2;
  out[1] = sx6;
  out[2] = sy6;
}
