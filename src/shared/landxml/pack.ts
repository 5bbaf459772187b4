/** Points as one run of x, y, z triples (the stored form of a baseline surface): float64, in the given order. */
export function packXyz(x: ArrayLike<number>, y: ArrayLike<number>, z: ArrayLike<number>): Float64Array {
  const n = x.length;
  const xyz = new Float64Array(3 * n);
  for (let i = 0; i < n; i++) {
    xyz[3 * i] = x[i]!;
    xyz[3 * i + 1] = y[i]!;
    xyz[3 * i + 2] = z[i]!;
  }
  return xyz;
}
