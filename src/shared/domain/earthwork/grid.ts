import type { GridMixedCellSplit } from '../../constants';
import { DomainError, assertNonNegative } from '../domain-error';
import { bilinearCutFill } from './grid-bilinear';
import { gridTotals, type GridTotals } from './grid-core';
import { cubicStep, fmt, fmtArea, fmtVolume, type Trail } from './trail';
import { areaUnitOf, cubicToVolume, volumeUnitOf, type AreaUnit, type LengthUnit, type VolumeUnit } from './units';

export interface GridInput {
  unit: LengthUnit;
  /** Distance between columns of nodes, ft or m. */
  spacingX: number;
  /** Distance between rows of nodes, ft or m. */
  spacingY: number;
  /** Rows of nodes: depth (cut +, fill -), ft or m; null outside an irregular outline. */
  depths: readonly (readonly (number | null)[])[];
  /** Mixed cells: 'transition-square' (default, the published formula) or 'exact-bilinear'. */
  mixedCellSplit?: GridMixedCellSplit;
}

export interface GridResult {
  unit: LengthUnit;
  cut: number;
  fill: number;
  net: number;
  volumeUnit: VolumeUnit;
  cellArea: number;
  areaUnit: AreaUnit;
  rows: number;
  cols: number;
  cells: number;
  mixedCells: number;
  mixedCellSplit: GridMixedCellSplit;
  /** Nodes by weight 1..4 and the sum of their depths (the borrow-pit table). */
  weights: { weight: 1 | 2 | 3 | 4; nodes: number; depthSum: number }[];
  /** Defined nodes that belong to no complete cell (ignored). */
  loneNodes: number;
  trail: Trail;
}

/** Packs rows of nodes into a Float64Array (null -> NaN); errors name the ragged row or the bad node. */
export function packGrid(depths: GridInput['depths']): { values: Float64Array; rows: number; cols: number } {
  const rows = depths.length;
  const cols = depths[0]?.length ?? 0;
  if (rows < 2 || cols < 2)
    throw new DomainError('GRID_TOO_SMALL', 'A grid needs at least 2 rows of 2 nodes', ['depths']);
  const values = new Float64Array(rows * cols);
  for (let r = 0; r < rows; r++) {
    const row = depths[r]!;
    if (row.length !== cols) {
      throw new DomainError('RAGGED_GRID', `Row ${r} has ${row.length} nodes; row 0 has ${cols}`, ['depths', r]);
    }
    for (let c = 0; c < cols; c++) {
      const v = row[c];
      if (v === null || v === undefined) values[r * cols + c] = NaN;
      else if (!Number.isFinite(v))
        throw new DomainError('INVALID_NUMBER', `Expected a finite depth or null, got ${v}`, ['depths', r, c]);
      else values[r * cols + c] = v;
    }
  }
  return { values, rows, cols };
}

/** Depths from two elevation grids of the same shape: existing - design (cut positive); null where either is. */
export function depthsFromElevations(
  existing: readonly (readonly (number | null)[])[],
  design: readonly (readonly (number | null)[])[],
): (number | null)[][] {
  return existing.map((row, r) => {
    const other = design[r];
    if (!other || other.length !== row.length) {
      throw new DomainError('RAGGED_GRID', `Design row ${r} does not match the existing grid`, ['design', r]);
    }
    return row.map((z, c) => {
      const w = other[c];
      return z === null || z === undefined || w === null || w === undefined ? null : z - w;
    });
  });
}

/** Grid volumes from packed nodes (the hot path the benchmark measures). */
export function gridVolumeFromArray(
  values: Float64Array,
  rows: number,
  cols: number,
  spacingX: number,
  spacingY: number,
  unit: LengthUnit,
  mixedCellSplit: GridMixedCellSplit = 'transition-square',
): GridResult {
  assertNonNegative(spacingX, ['spacingX'], true);
  assertNonNegative(spacingY, ['spacingY'], true);
  const cellArea = spacingX * spacingY;
  const totals = gridTotals(values, rows, cols, cellArea);
  if (mixedCellSplit === 'exact-bilinear' && totals.mixedCells > 0)
    exactMixedCells(values, rows, cols, cellArea, totals);
  return present(totals, rows, cols, cellArea, unit, mixedCellSplit);
}

/** Replaces the transition-square split of the mixed cells with the exact bilinear integral (grid-bilinear.ts). */
function exactMixedCells(values: Float64Array, rows: number, cols: number, cellArea: number, t: GridTotals): void {
  let cut = 0;
  let fill = 0;
  for (let r = 0; r + 1 < rows; r++) {
    for (let c = 0; c + 1 < cols; c++) {
      const a = values[r * cols + c]!,
        b = values[r * cols + c + 1]!,
        d = values[(r + 1) * cols + c]!,
        e = values[(r + 1) * cols + c + 1]!;
      const s = a + b + d + e;
      if (s !== s || Math.abs(a) + Math.abs(b) + Math.abs(d) + Math.abs(e) === Math.abs(s)) continue;
      const [p, q] = bilinearCutFill(a, b, d, e);
      cut += p;
      fill += q;
    }
  }
  t.cutCubic += cut * cellArea - t.mixedCutCubic;
  t.fillCubic += fill * cellArea - t.mixedFillCubic;
  t.mixedCutCubic = cut * cellArea;
  t.mixedFillCubic = fill * cellArea;
}

/**
 * Borrow-pit grid volumes, cut and fill separately: V = (cell area / 4) x weighted depth sum, mixed cells split
 * by the transition-square formula (see grid-core.ts). CY (unit ft) or m3.
 */
export function gridVolume(input: GridInput): GridResult {
  const { values, rows, cols } = packGrid(input.depths);
  return gridVolumeFromArray(values, rows, cols, input.spacingX, input.spacingY, input.unit, input.mixedCellSplit);
}

function present(
  t: GridTotals,
  rows: number,
  cols: number,
  cellArea: number,
  unit: LengthUnit,
  split: GridMixedCellSplit,
): GridResult {
  const cut = cubicToVolume(t.cutCubic, unit);
  const fill = cubicToVolume(t.fillCubic, unit);
  const weights = ([1, 2, 3, 4] as const).map((w) => ({
    weight: w,
    nodes: t.weightCounts[w],
    depthSum: t.weightSums[w],
  }));
  const weighted = weights.reduce((sum, w) => sum + w.weight * w.depthSum, 0);
  const weightTotal = weights.reduce((sum, w) => sum + w.weight * w.nodes, 0);
  const trail: Trail = [
    `Grid of ${fmt(rows, 0)} x ${fmt(cols, 0)} nodes, cell area ${fmtArea(cellArea, unit)}, ${fmt(t.cells, 0)} complete cells`,
    `Node weights from the cells sharing each node: ${weights.map((w) => `${fmt(w.nodes, 0)} of weight ${w.weight}`).join(', ')} (sum of weights ${fmt(weightTotal, 0)} = 4 x ${fmt(t.cells, 0)} cells)`,
    `Weighted depth sum = sum h1 + 2 sum h2 + 3 sum h3 + 4 sum h4 = ${weights.map((w) => fmt(w.depthSum, 3)).join(' / ')} -> ${fmt(weighted, 3)} ${unit}`,
    `Net V = (cell area / 4) x weighted sum = ${cubicStep((cellArea / 4) * weighted, unit)} (surveying texts, borrow-pit method)`,
    split === 'exact-bilinear'
      ? `${fmt(t.mixedCells, 0)} cells have corners in both cut and fill: split exactly under the bilinear surface through their four corners (integrated in closed form); net unchanged`
      : `${fmt(t.mixedCells, 0)} cells have corners in both cut and fill: split by the transition-square formula V_cut = (A/4)(sum cut)^2 / (sum cut + sum fill) (surveying texts, transition-square method); net unchanged`, // formula from memory of the texts
    `Cut = ${fmtVolume(cut, unit)}; fill = ${fmtVolume(fill, unit)}; net = ${fmtVolume(cut - fill, unit)}`,
  ];
  if (t.weightCounts[0] > 0)
    trail.push(
      `${fmt(t.weightCounts[0], 0)} ${t.weightCounts[0] === 1 ? 'node belongs' : 'nodes belong'} to no complete cell (all four corners given) and ${t.weightCounts[0] === 1 ? 'was' : 'were'} left out`,
    );
  return {
    unit,
    cut,
    fill,
    net: cut - fill,
    volumeUnit: volumeUnitOf(unit),
    cellArea,
    areaUnit: areaUnitOf(unit),
    rows,
    cols,
    cells: t.cells,
    mixedCells: t.mixedCells,
    mixedCellSplit: split,
    weights,
    loneNodes: t.weightCounts[0],
    trail,
  };
}
