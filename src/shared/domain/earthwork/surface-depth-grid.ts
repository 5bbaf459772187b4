import { buildTin, type SurfacePoints } from './surface-tin';

/**
 * Depth of cut (+) and fill (-) between two surveys on a regular plan grid, for a picture (the cut and fill map):
 * each cell's centre is located in both TINs (as the volume builds them: faces, breaklines or Delaunay) and each surface interpolated
 * linearly on its triangle; NaN where either survey does not cover the centre. Units are the surveys' own (ft or
 * m). Volumes never come from this grid (the overlay in surface-overlay.ts is exact); it only draws them.
 */
export interface DepthGrid {
  /** Lower-left corner of the grid and the cell size, plan units. */
  x0: number;
  y0: number;
  cell: number;
  columns: number;
  rows: number;
  /** Row-major from the bottom row: existing minus design at each cell centre; NaN outside either survey. */
  depth: Float64Array;
  /** Largest cut and largest fill depth met (both >= 0). */
  maxCut: number;
  maxFill: number;
}

/** The survey's TIN as the volume builds it (its faces, breaklines, or Delaunay), or null when it has none. */
function tin(p: SurfacePoints, ox: number, oy: number, name: 'existing' | 'design') {
  try {
    return buildTin(p, ox, oy, name);
  } catch {
    return null;
  }
}

/** The grid over the box both surveys share, `across` cells along its longer side (at most 400). */
export function depthGrid(existing: SurfacePoints, design: SurfacePoints, across = 160): DepthGrid | null {
  const box = (p: SurfacePoints) => {
    let x0 = Infinity,
      y0 = Infinity,
      x1 = -Infinity,
      y1 = -Infinity;
    for (let i = 0; i < p.x.length; i++) {
      x0 = Math.min(x0, p.x[i]!);
      x1 = Math.max(x1, p.x[i]!);
      y0 = Math.min(y0, p.y[i]!);
      y1 = Math.max(y1, p.y[i]!);
    }
    return [x0, y0, x1, y1] as const;
  };
  const a = box(existing);
  const b = box(design);
  const x0 = Math.max(a[0], b[0]),
    y0 = Math.max(a[1], b[1]),
    x1 = Math.min(a[2], b[2]),
    y1 = Math.min(a[3], b[3]);
  if (!(x1 > x0 && y1 > y0)) return null;
  const e = tin(existing, x0, y0, 'existing');
  const d = tin(design, x0, y0, 'design');
  if (!e || !d) return null;
  const n = Math.max(2, Math.min(400, Math.floor(across)));
  const cell = Math.max(x1 - x0, y1 - y0) / n;
  const columns = Math.max(1, Math.ceil((x1 - x0) / cell));
  const rows = Math.max(1, Math.ceil((y1 - y0) / cell));
  const depth = new Float64Array(columns * rows).fill(NaN);
  let maxCut = 0;
  let maxFill = 0;
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < columns; c++) {
      const x = (c + 0.5) * cell,
        y = (r + 0.5) * cell;
      const te = e.locator.locate(x, y, true);
      if (te < 0) continue;
      const td = d.locator.locate(x, y, true);
      if (td < 0) continue;
      const v = e.locator.interpolate(te, x, y, e.z) - d.locator.interpolate(td, x, y, d.z);
      depth[r * columns + c] = v;
      if (v > maxCut) maxCut = v;
      if (-v > maxFill) maxFill = -v;
    }
  }
  return { x0, y0, cell, columns, rows, depth, maxCut, maxFill };
}
