import type { Tin } from './surface-pass';

/**
 * Heights of `other` at every vertex of `own` (NaN outside other's triangles), by going through other's
 * triangles in memory order and testing the own vertices bucketed under each triangle's bounding box. Reads run
 * mostly in sequence, where walking to each vertex from a seed jumps around the mesh; total work is about one
 * test per own vertex per triangle whose box covers it.
 */
export function sampleOther(own: Tin, other: Tin): Float64Array {
  const n = own.z.length;
  const oc = own.coords;
  const at = new Float64Array(n).fill(NaN);
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (let i = 0; i < n; i++) {
    const x = oc[2 * i]!, y = oc[2 * i + 1]!;
    if (x < minX) minX = x;
    if (x > maxX) maxX = x;
    if (y < minY) minY = y;
    if (y > maxY) maxY = y;
  }
  // About one own vertex per cell.
  const span = Math.max(maxX - minX, maxY - minY, 1e-12);
  const cells = Math.max(1, Math.ceil(Math.sqrt(n)));
  const size = span / cells;
  const cx = Math.min(cells, Math.floor((maxX - minX) / size) + 1);
  const cy = Math.min(cells, Math.floor((maxY - minY) / size) + 1);
  const start = new Int32Array(cx * cy + 1);
  const cellOf = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    const gx = Math.min(cx - 1, Math.floor((oc[2 * i]! - minX) / size));
    const gy = Math.min(cy - 1, Math.floor((oc[2 * i + 1]! - minY) / size));
    const cell = gy * cx + gx;
    cellOf[i] = cell;
    start[cell + 1]!++;
  }
  for (let k = 0; k < cx * cy; k++) start[k + 1]! += start[k]!;
  const fill = start.slice(0, cx * cy);
  const ids = new Int32Array(n);
  for (let i = 0; i < n; i++) ids[fill[cellOf[i]!]!++] = i;

  const tri = other.mesh.triangles;
  const c = other.coords;
  const z = other.z;
  for (let t = 0; t < tri.length; t += 3) {
    const a = tri[t]!, b = tri[t + 1]!, d = tri[t + 2]!;
    const ax = c[2 * a]!, ay = c[2 * a + 1]!, bx = c[2 * b]!, by = c[2 * b + 1]!, dx = c[2 * d]!, dy = c[2 * d + 1]!;
    const loX = ax < bx ? (ax < dx ? ax : dx) : bx < dx ? bx : dx;
    const hiX = ax > bx ? (ax > dx ? ax : dx) : bx > dx ? bx : dx;
    const loY = ay < by ? (ay < dy ? ay : dy) : by < dy ? by : dy;
    const hiY = ay > by ? (ay > dy ? ay : dy) : by > dy ? by : dy;
    if (hiX < minX || hiY < minY || loX > maxX || loY > maxY) continue;
    // Clamped to the grid first, so truncation is the floor.
    const x0 = loX <= minX ? 0 : Math.min(cx - 1, ((loX - minX) / size) | 0);
    const y0 = loY <= minY ? 0 : Math.min(cy - 1, ((loY - minY) / size) | 0);
    const x1 = Math.min(cx - 1, ((hiX - minX) / size) | 0);
    const y1 = Math.min(cy - 1, ((hiY - minY) / size) | 0);
    const ex = bx - ax, ey = by - ay, fx = dx - ax, fy = dy - ay;
    const det = ex * fy - ey * fx;
    if (det === 0) continue;
    const inv = 1 / det;
    // Points on a shared edge may test a hair outside both triangles; a tolerance keeps them in one of them.
    const eps = -1e-12;
    const za = z[a]!, zb = z[b]! - za, zd = z[d]! - za;
    for (let gy = y0; gy <= y1; gy++) {
      const row = gy * cx;
      for (let k = start[row + x0]!, end = start[row + x1 + 1]!; k < end; k++) {
        const i = ids[k]!;
        const px = oc[2 * i]! - ax, py = oc[2 * i + 1]! - ay;
        const u = (px * fy - py * fx) * inv;
        const v = (ex * py - ey * px) * inv;
        if (u >= eps && v >= eps && u + v <= 1 - eps) at[i] = za + u * zb + v * zd;
      }
    }
  }
  return at;
}
