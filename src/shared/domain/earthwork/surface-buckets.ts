/**
 * A uniform grid of cells over a mesh's box, each listing the triangles whose box meets it (compressed rows:
 * one offsets array, one ids array). Used where a visibility walk cannot be trusted: a mesh built from given
 * faces may be non-convex, have holes and not be Delaunay, so a walk can leave it through a notch or circle.
 * Coordinates are the shifted plan coordinates the mesh was built from.
 */
export class TriangleBuckets {
  private readonly triangles: Uint32Array;
  private readonly coords: Float64Array;
  private readonly size: number;
  private readonly minX: number;
  private readonly minY: number;
  private readonly cell: number;
  /** Cell k lists ids[start[k]] to ids[start[k + 1] - 1]. */
  readonly start: Int32Array;
  readonly ids: Int32Array;

  constructor(triangles: Uint32Array, coords: Float64Array) {
    this.triangles = triangles;
    this.coords = coords;
    const n = triangles.length / 3;
    let minX = Infinity,
      minY = Infinity,
      maxX = -Infinity,
      maxY = -Infinity;
    for (let i = 0; i < triangles.length; i++) {
      const x = coords[2 * triangles[i]!]!,
        y = coords[2 * triangles[i]! + 1]!;
      if (x < minX) minX = x;
      if (x > maxX) maxX = x;
      if (y < minY) minY = y;
      if (y > maxY) maxY = y;
    }
    this.size = Math.max(1, Math.ceil(Math.sqrt(n / 2)));
    this.minX = minX;
    this.minY = minY;
    this.cell = Math.max(maxX - minX, maxY - minY, 1e-12) / this.size;
    const cells = this.size * this.size;
    const count = new Int32Array(cells + 1);
    const box = new Int32Array(4);
    for (let t = 0; t < n; t++) {
      this.boxOf(t, box);
      for (let j = box[1]!; j <= box[3]!; j++) for (let i = box[0]!; i <= box[2]!; i++) count[j * this.size + i + 1]!++;
    }
    for (let c = 0; c < cells; c++) count[c + 1]! += count[c]!;
    this.start = count;
    this.ids = new Int32Array(count[cells]!);
    const fill = count.slice(0, cells);
    for (let t = 0; t < n; t++) {
      this.boxOf(t, box);
      for (let j = box[1]!; j <= box[3]!; j++)
        for (let i = box[0]!; i <= box[2]!; i++) this.ids[fill[j * this.size + i]!++] = t;
    }
  }

  private index(v: number, min: number): number {
    const i = Math.floor((v - min) / this.cell);
    return i < 0 ? 0 : i >= this.size ? this.size - 1 : i;
  }

  private boxOf(t: number, out: Int32Array): void {
    const tri = this.triangles,
      c = this.coords;
    const a = 2 * tri[3 * t]!,
      b = 2 * tri[3 * t + 1]!,
      d = 2 * tri[3 * t + 2]!;
    out[0] = this.index(Math.min(c[a]!, c[b]!, c[d]!), this.minX);
    out[1] = this.index(Math.min(c[a + 1]!, c[b + 1]!, c[d + 1]!), this.minY);
    out[2] = this.index(Math.max(c[a]!, c[b]!, c[d]!), this.minX);
    out[3] = this.index(Math.max(c[a + 1]!, c[b + 1]!, c[d + 1]!), this.minY);
  }

  /** The cell holding (x, y) (clamped to the grid). */
  cellOf(x: number, y: number): number {
    return this.index(y, this.minY) * this.size + this.index(x, this.minX);
  }

  /** Triangles whose cells meet the box (a triangle may be listed more than once; callers stamp what they saw). */
  candidates(x0: number, y0: number, x1: number, y1: number, out: number[]): void {
    out.length = 0;
    const i0 = this.index(x0, this.minX),
      i1 = this.index(x1, this.minX),
      j0 = this.index(y0, this.minY),
      j1 = this.index(y1, this.minY);
    for (let j = j0; j <= j1; j++)
      for (let i = i0; i <= i1; i++) {
        const c = j * this.size + i;
        for (let k = this.start[c]!; k < this.start[c + 1]!; k++) out.push(this.ids[k]!);
      }
  }

  /** A triangle holding (x, y) (edges included), or -1. */
  locate(x: number, y: number): number {
    const c = this.index(y, this.minY) * this.size + this.index(x, this.minX);
    const tri = this.triangles,
      p = this.coords;
    for (let k = this.start[c]!; k < this.start[c + 1]!; k++) {
      const t = this.ids[k]!;
      const a = 2 * tri[3 * t]!,
        b = 2 * tri[3 * t + 1]!,
        d = 2 * tri[3 * t + 2]!;
      const s0 = (p[b]! - p[a]!) * (y - p[a + 1]!) - (p[b + 1]! - p[a + 1]!) * (x - p[a]!);
      const s1 = (p[d]! - p[b]!) * (y - p[b + 1]!) - (p[d + 1]! - p[b + 1]!) * (x - p[b]!);
      const s2 = (p[a]! - p[d]!) * (y - p[d + 1]!) - (p[a + 1]! - p[d + 1]!) * (x - p[d]!);
      if ((s0 >= 0 && s1 >= 0 && s2 >= 0) || (s0 <= 0 && s1 <= 0 && s2 <= 0)) return t;
    }
    return -1;
  }
}
