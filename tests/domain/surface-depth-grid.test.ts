import { describe, expect, it } from 'vitest';
import { pointsFromRows } from '@/shared/domain/earthwork/surface';
import { depthGrid } from '@/shared/domain/earthwork/surface-depth-grid';

// The map's depth grid against analytic cases: linear interpolation on a triangle reproduces a plane exactly
// (barycentric coordinates, any surveying or finite-element text), so the depth of two planes is their difference.
const square = (z: (x: number, y: number) => number) =>
  pointsFromRows(
    [
      [0, 0],
      [100, 0],
      [100, 100],
      [0, 100],
      [50, 50],
    ].map(([x, y]) => [x!, y!, z(x!, y!)] as [number, number, number]),
  );

describe('depth grid for the cut and fill map', () => {
  it('gives existing minus design at each cell centre for two planes', () => {
    const g = depthGrid(
      square(() => 10),
      square((x) => 9 + 0.02 * x),
      10,
    )!;
    expect([g.columns, g.rows, g.cell]).toEqual([10, 10, 10]);
    for (let c = 0; c < 10; c++) expect(g.depth[3 * 10 + c]).toBeCloseTo(1 - 0.02 * (c * 10 + 5), 12);
    expect(g.maxCut).toBeCloseTo(0.9, 12);
    expect(g.maxFill).toBeCloseTo(0.9, 12);
  });

  it('covers only the plan both surveys share (NaN outside)', () => {
    const half = pointsFromRows([
      [0, 0, 5],
      [50, 0, 5],
      [0, 100, 5],
    ]);
    const g = depthGrid(
      square(() => 6),
      half,
      10,
    )!;
    // The design triangle covers x / 50 + y / 100 <= 1: the cell at (2.5, 5) is in, the one at (47.5, 95) is out.
    expect(g.depth[0]).toBeCloseTo(1, 12);
    expect(Number.isNaN(g.depth[(g.rows - 1) * g.columns + g.columns - 1]!)).toBe(true);
  });

  it('answers null when the surveys do not overlap', () => {
    const far = pointsFromRows([
      [500, 500, 1],
      [600, 500, 1],
      [500, 600, 1],
    ]);
    expect(
      depthGrid(
        square(() => 1),
        far,
      ),
    ).toBeNull();
  });
});
