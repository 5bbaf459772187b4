import { EdgeTally } from './grid-edges';

/**
 * Borrow-pit grid on a flat Float64Array: node (row r, column c) at index r * cols + c, depth in length units,
 * cut positive, fill negative, NaN outside the outline. One pass over the cells, no allocation per node.
 *
 * A cell exists where all four corner nodes are defined; a node's weight (1 to 4) is the number of cells that
 * share it (3 at a re-entrant corner of an irregular outline). Uniform cells give (cell area / 4) x corner sum,
 * so the total is V = (cell area / 4)(sum h1 + 2 sum h2 + 3 sum h3 + 4 sum h4) (surveying texts, "computation of
 * earthwork from spot levels").
 *
 * Mixed cells (corners in both cut and fill) are split by the transition-square formula of surveying texts
 * (e.g. Davis, Foote, Anderson and Mikhail, Surveying: Theory and Practice; cited from memory):
 *   V_cut = (A / 4) (sum cut depths)^2 / (sum cut depths + sum fill depths),
 *   V_fill = (A / 4) (sum fill depths)^2 / (sum cut depths + sum fill depths).
 * V_cut - V_fill = (A / 4)(sum of corner depths), so the net stays exact.
 *
 * Speed: complete cells are recorded as runs per row, edge nodes (weight 1 to 3) are tallied from the runs, and
 * weight-4 nodes follow from the identities sum of weights = 4 x cells and sum of w h = sum of cell corner sums.
 */
export interface GridTotals {
  /** Cubic length units (cu ft or m3). */
  cutCubic: number;
  fillCubic: number;
  /** (cell area / 4) x sum of the corner depths of every cell: the exact net, cubic length units. */
  netCubic: number;
  cells: number;
  mixedCells: number;
  /** The transition-square split of the mixed cells alone, cubic length units (part of cutCubic and fillCubic). */
  mixedCutCubic: number;
  mixedFillCubic: number;
  /** Nodes by weight, index 1..4. */
  weightCounts: [number, number, number, number, number];
  /** Sum of the depths of the nodes of each weight (index 1..4), length units. */
  weightSums: [number, number, number, number, number];
}

export function gridTotals(values: Float64Array, rows: number, cols: number, cellArea: number): GridTotals {
  // Two accumulators each for cut and fill (even and odd cells) so the additions do not wait on each other.
  let cutA = 0;
  let cutB = 0;
  let fillA = 0;
  let fillB = 0;
  let mixedCut = 0;
  let mixedFill = 0;
  let mixedNet = 0;
  let mixed = 0;
  let cells = 0;
  const edge = new EdgeTally();
  // Runs of complete cells of the cell row above (up) and this one (down), as flat start/end pairs. A run is
  // closed only when a missing cell is met, so complete cells cost nothing extra.
  let up = new Int32Array(cols + 1);
  let down = new Int32Array(cols + 1);
  let upRuns = 0;
  for (let r = 0; r + 1 < rows; r++) {
    const top = r * cols;
    const bottom = top + cols;
    let runs = 0;
    let lastMissing = -1;
    let pairSum = values[top]! + values[bottom]!;
    let pairAbs = Math.abs(values[top]!) + Math.abs(values[bottom]!);
    // Two cells per step (cell j - 1, then cell j) with their own accumulators.
    for (let j = 1; j < cols; j += 2) {
      const b = values[top + j]!;
      const d = values[bottom + j]!;
      const rightSum = b + d;
      const rightAbs = Math.abs(b) + Math.abs(d);
      const s = pairSum + rightSum;
      const abs = pairAbs + rightAbs;
      // Equal sums of |h| and h: all corners on one side. NaN never compares equal, so a cell with a missing
      // corner falls through to the last branch.
      if (abs === Math.abs(s)) {
        if (s > 0) cutA += s;
        else fillA -= s;
      } else if (s === s) {
        mixed++;
        mixedNet += s;
        const p = (abs + s) * 0.5;
        const q = (abs - s) * 0.5;
        mixedCut += (p * p) / abs;
        mixedFill += (q * q) / abs;
      } else {
        if (j - 1 > lastMissing + 1) {
          down[2 * runs] = lastMissing + 1;
          down[2 * runs + 1] = j - 2;
          cells += j - 2 - lastMissing;
          runs++;
        }
        lastMissing = j - 1;
      }
      if (j + 1 === cols) break;
      const b2 = values[top + j + 1]!;
      const d2 = values[bottom + j + 1]!;
      const nextSum = b2 + d2;
      const nextAbs = Math.abs(b2) + Math.abs(d2);
      const s2 = rightSum + nextSum;
      const abs2 = rightAbs + nextAbs;
      if (abs2 === Math.abs(s2)) {
        if (s2 > 0) cutB += s2;
        else fillB -= s2;
      } else if (s2 === s2) {
        mixed++;
        mixedNet += s2;
        const p = (abs2 + s2) * 0.5;
        const q = (abs2 - s2) * 0.5;
        mixedCut += (p * p) / abs2;
        mixedFill += (q * q) / abs2;
      } else {
        if (j > lastMissing + 1) {
          down[2 * runs] = lastMissing + 1;
          down[2 * runs + 1] = j - 1;
          cells += j - 1 - lastMissing;
          runs++;
        }
        lastMissing = j;
      }
      pairSum = nextSum;
      pairAbs = nextAbs;
    }
    if (cols - 2 > lastMissing) {
      down[2 * runs] = lastMissing + 1;
      down[2 * runs + 1] = cols - 2;
      cells += cols - 2 - lastMissing;
      runs++;
    }
    edge.row(values, top, cols, up, upRuns, down, runs);
    const t = up;
    up = down;
    down = t;
    upRuns = runs;
  }
  edge.row(values, (rows - 1) * cols, cols, up, upRuns, down, 0);
  const cut = cutA + cutB;
  const fill = fillA + fillB;
  // Uniform cells: cut and fill are exact corner sums, so their net is cut - fill; mixed cells carry their own.
  const net = cut - fill + mixedNet;
  const counts = edge.counts;
  const sums = edge.sums;
  counts[4] = (4 * cells - counts[1] - 2 * counts[2] - 3 * counts[3]) / 4;
  sums[4] = (net - sums[1] - 2 * sums[2] - 3 * sums[3]) / 4;
  const k = cellArea / 4;
  return {
    cutCubic: (cut + mixedCut) * k,
    fillCubic: (fill + mixedFill) * k,
    netCubic: net * k,
    cells,
    mixedCells: mixed,
    mixedCutCubic: mixedCut * k,
    mixedFillCubic: mixedFill * k,
    weightCounts: counts,
    weightSums: sums,
  };
}
