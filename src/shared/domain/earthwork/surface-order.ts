/**
 * Renumbers a mesh's triangles in plan order (row-major over a coarse grid of their centroids) with a counting
 * sort, and remaps the half-edges to match. Delaunator emits triangles in sweep order, scattered in memory
 * relative to plan position; after this, neighbouring triangles sit close in memory, so point walks and the
 * volume passes read mostly from cache.
 */
export function renumberTriangles(
  triangles: Uint32Array,
  halfedges: Int32Array,
  coords: Float64Array,
): { triangles: Uint32Array; halfedges: Int32Array } {
  const count = triangles.length / 3;
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (let i = 0; i < coords.length; i += 2) {
    const x = coords[i]!, y = coords[i + 1]!;
    if (x < minX) minX = x;
    if (x > maxX) maxX = x;
    if (y < minY) minY = y;
    if (y > maxY) maxY = y;
  }
  const size = Math.max(1, Math.ceil(Math.sqrt(count / 4)));
  const cell = Math.max(maxX - minX, maxY - minY, 1e-12) / size;
  const key = new Int32Array(count);
  const start = new Int32Array(size * size + 1);
  for (let k = 0; k < count; k++) {
    const a = 2 * triangles[3 * k]!, b = 2 * triangles[3 * k + 1]!, c = 2 * triangles[3 * k + 2]!;
    let i = Math.floor(((coords[a]! + coords[b]! + coords[c]!) / 3 - minX) / cell);
    let j = Math.floor(((coords[a + 1]! + coords[b + 1]! + coords[c + 1]!) / 3 - minY) / cell);
    i = i < 0 ? 0 : i >= size ? size - 1 : i;
    j = j < 0 ? 0 : j >= size ? size - 1 : j;
    // Rows run alternately left-right and right-left so consecutive cells stay neighbours.
    const cellIndex = j * size + (j & 1 ? size - 1 - i : i);
    key[k] = cellIndex;
    start[cellIndex + 1]!++;
  }
  for (let c = 0; c < size * size; c++) start[c + 1]! += start[c]!;
  // key becomes the new index of each old triangle.
  for (let k = 0; k < count; k++) key[k] = start[key[k]!]!++;
  const tri = new Uint32Array(triangles.length);
  const he = new Int32Array(halfedges.length);
  for (let k = 0; k < count; k++) {
    const n = 3 * key[k]!;
    for (let e = 0; e < 3; e++) {
      tri[n + e] = triangles[3 * k + e]!;
      const o = halfedges[3 * k + e]!;
      he[n + e] = o < 0 ? -1 : 3 * key[(o / 3) | 0]! + (o % 3);
    }
  }
  return { triangles: tri, halfedges: he };
}
