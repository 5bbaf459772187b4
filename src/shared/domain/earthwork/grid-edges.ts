/**
 * Edge-node tally for the grid. A node's weight is the number of complete cells around it. For one row of
 * nodes, the cell rows above (U) and below (D) come as runs of complete cells, [start, end] in cell columns.
 * From one cell row, node j counts 2 inside a run (cells j - 1 and j complete), 1 at its ends, 0 elsewhere, so
 * the weight is piecewise constant between run ends: only nodes of weight 1 to 3 are visited one by one.
 */
export class EdgeTally {
  /** Nodes by weight, index 1..3 (weight 4 is derived by the caller from identities). */
  readonly counts: [number, number, number, number, number] = [0, 0, 0, 0, 0];
  readonly sums: [number, number, number, number, number] = [0, 0, 0, 0, 0];
  /** Defined nodes of weight 0 (in no complete cell): counts[0]. Stretches of weight 0 are read for them. */

  /** Tallies the node row at `offset`, given the run lists (flat start/end pairs) of the cell rows around it. */
  row(
    values: Float64Array,
    offset: number,
    cols: number,
    up: Int32Array,
    upRuns: number,
    down: Int32Array,
    downRuns: number,
  ): void {
    let iu = 0;
    let id = 0;
    let x = 0;
    while (x < cols) {
      while (iu < upRuns && up[2 * iu + 1]! + 2 <= x) iu++;
      while (id < downRuns && down[2 * id + 1]! + 2 <= x) id++;
      const w = countAt(up, upRuns, iu, x) + countAt(down, downRuns, id, x);
      const next = Math.min(nextBreak(up, upRuns, iu, x), nextBreak(down, downRuns, id, x), cols);
      if (w === 0) {
        let lone = 0;
        for (let j = x; j < next; j++) if (values[offset + j] === values[offset + j]) lone++;
        this.counts[0] += lone;
      } else if (w < 4) {
        let sum = 0;
        for (let j = x; j < next; j++) sum += values[offset + j]!;
        this.counts[w]! += next - x;
        this.sums[w]! += sum;
      }
      x = next;
    }
  }
}

/** Complete cells among cells j - 1 and j of one cell row, scanning runs from `from` (runs ending before j - 1 skipped). */
function countAt(runs: Int32Array, n: number, from: number, j: number): number {
  let c = 0;
  for (let k = from; k < n; k++) {
    const s = runs[2 * k]!;
    if (s > j) break;
    const e = runs[2 * k + 1]!;
    if (j - 1 >= s && j - 1 <= e) c++;
    if (j <= e) c++;
  }
  return c;
}

/** Smallest of s, s + 1, e + 1, e + 2 above x over the runs from `from` (the weight only changes there). */
function nextBreak(runs: Int32Array, n: number, from: number, x: number): number {
  for (let k = from; k < n; k++) {
    const s = runs[2 * k]!;
    const e = runs[2 * k + 1]!;
    if (s > x) return s;
    if (s + 1 > x) return s + 1;
    if (e + 1 > x) return e + 1;
    if (e + 2 > x) return e + 2;
  }
  return Number.MAX_SAFE_INTEGER;
}
