import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { DomainError } from '../../src/shared/domain/domain-error';
import { depthsFromElevations, gridVolume } from '../../src/shared/domain/earthwork/grid';
import { M3_PER_CY } from '../../src/shared/domain/earthwork/units';

type Depths = (number | null)[][];

/** Straightforward reference: loop over cells, count weights per node, split mixed cells the same way. */
function reference(depths: Depths, cellArea: number) {
  const rows = depths.length;
  const cols = depths[0]!.length;
  const w = depths.map((r) => r.map(() => 0));
  let cut = 0;
  let fill = 0;
  for (let r = 0; r + 1 < rows; r++) {
    for (let c = 0; c + 1 < cols; c++) {
      const h = [depths[r]![c], depths[r]![c + 1], depths[r + 1]![c], depths[r + 1]![c + 1]];
      if (h.some((v) => v === null)) continue;
      for (const [rr, cc] of [[r, c], [r, c + 1], [r + 1, c], [r + 1, c + 1]] as const) w[rr]![cc]! += 1;
      const pos = (h as number[]).reduce((s, v) => s + Math.max(v, 0), 0);
      const neg = (h as number[]).reduce((s, v) => s + Math.max(-v, 0), 0);
      if (pos === 0 || neg === 0) {
        cut += pos;
        fill += neg;
      } else {
        cut += (pos * pos) / (pos + neg);
        fill += (neg * neg) / (pos + neg);
      }
    }
  }
  const counts = [0, 0, 0, 0, 0];
  const sums = [0, 0, 0, 0, 0];
  depths.forEach((row, r) => row.forEach((v, c) => {
    const k = w[r]![c]!;
    if (k > 0) {
      counts[k]!++;
      sums[k]! += v!;
    }
  }));
  return { cut: (cut * cellArea) / 4, fill: (fill * cellArea) / 4, counts, sums };
}

describe('gridVolume', () => {
  it('gives 20,000 cu ft = 740.74 CY for the 3 x 3 node, 50 ft grid (surveying texts, borrow-pit method)', () => {
    const r = gridVolume({ unit: 'ft', spacingX: 50, spacingY: 50, depths: [[1, 1.5, 2], [1.5, 2, 2.5], [2, 2.5, 3]] });
    expect(r.cut).toBeCloseTo(20_000 / 27, 10);
    expect(r.cut.toFixed(2)).toBe('740.74');
    expect(r.fill).toBe(0);
    expect(r.weights.map((w) => w.nodes)).toEqual([4, 4, 0, 1]);
    expect(r.volumeUnit).toBe('CY');
  });

  it('gives weight 3 at the re-entrant corner of an L-shaped outline (null nodes outside)', () => {
    const r = gridVolume({ unit: 'm', spacingX: 10, spacingY: 10, depths: [[1, 1, null], [1, 1, 1], [1, 1, 1]] });
    expect(r.cells).toBe(3);
    expect(r.weights.find((w) => w.weight === 3)!.nodes).toBe(1);
    expect(r.weights.reduce((s, w) => s + w.weight * w.nodes, 0)).toBe(4 * 3);
    expect(r.cut).toBeCloseTo(300, 12);
  });

  it('is exact for a plane over the grid (identity: volume = area x depth at the centroid)', () => {
    const depths = [0, 1, 2, 3, 4].map((r) => [0, 1, 2, 3, 4, 5].map((c) => 2 + 0.3 * c + 0.7 * r));
    const r = gridVolume({ unit: 'm', spacingX: 4, spacingY: 3, depths });
    const area = 5 * 4 * (4 * 3);
    expect(r.cut).toBeCloseTo(area * (2 + 0.3 * 2.5 + 0.7 * 2), 9);
  });

  it('keeps the net exact for a plane crossing zero, with cut and fill split by the transition-square formula (surveying texts, from memory)', () => {
    const depths = [0, 1, 2].map(() => [-1.5, -0.5, 0.5, 1.5, 2.5]);
    const r = gridVolume({ unit: 'm', spacingX: 1, spacingY: 1, depths });
    expect(r.net).toBeCloseTo(2 * (-1 + 0 + 1 + 2), 12);
    expect(r.mixedCells).toBe(2);
    expect(r.cut - r.fill).toBeCloseTo(r.net, 12);
    expect(r.trail.join('\n')).toMatch(/transition-square/);
  });

  it('takes depths from two elevation grids as existing - design (cut positive)', () => {
    expect(depthsFromElevations([[10, 11], [null, 9]], [[9, 12], [8, 8]])).toEqual([[1, -1], [null, 1]]);
  });

  it('throws RAGGED_GRID with the row path when a row is short', () => {
    try {
      gridVolume({ unit: 'ft', spacingX: 1, spacingY: 1, depths: [[1, 2, 3], [1, 2, 3], [1, 2]] });
      expect.unreachable();
    } catch (e) {
      expect((e as DomainError).code).toBe('RAGGED_GRID');
      expect((e as DomainError).path).toBe('depths.2');
    }
  });
});

const gridArb = fc
  .record({ rows: fc.integer({ min: 2, max: 9 }), cols: fc.integer({ min: 2, max: 9 }) })
  .chain(({ rows, cols }) =>
    fc.array(fc.array(fc.option(fc.double({ min: -5, max: 5, noNaN: true }), { freq: 5, nil: null }), { minLength: cols, maxLength: cols }), { minLength: rows, maxLength: rows }),
  );

describe('grid properties', () => {
  it('matches a cell-by-cell reference for volumes and the weight table on random outlines', () => {
    fc.assert(
      fc.property(gridArb, (depths) => {
        const r = gridVolume({ unit: 'm', spacingX: 2, spacingY: 3, depths });
        const ref = reference(depths, 6);
        expect(r.cut).toBeCloseTo(ref.cut, 8);
        expect(r.fill).toBeCloseTo(ref.fill, 8);
        expect(r.weights.map((w) => w.nodes)).toEqual(ref.counts.slice(1));
        r.weights.forEach((w) => expect(w.depthSum).toBeCloseTo(ref.sums[w.weight]!, 8));
        expect(r.cut).toBeGreaterThanOrEqual(0);
        expect(r.fill).toBeGreaterThanOrEqual(0);
      }),
      { numRuns: 300 },
    );
  });

  it('is additive when the grid is split along a row of nodes, and symmetric under mirroring', () => {
    fc.assert(
      fc.property(gridArb, fc.nat(), (depths, k) => {
        fc.pre(depths.length >= 3);
        const split = 1 + (k % (depths.length - 2));
        const all = gridVolume({ unit: 'ft', spacingX: 5, spacingY: 5, depths });
        const top = gridVolume({ unit: 'ft', spacingX: 5, spacingY: 5, depths: depths.slice(0, split + 1) });
        const bottom = gridVolume({ unit: 'ft', spacingX: 5, spacingY: 5, depths: depths.slice(split) });
        expect(top.cut + bottom.cut).toBeCloseTo(all.cut, 8);
        expect(top.fill + bottom.fill).toBeCloseTo(all.fill, 8);
        const mirrored = gridVolume({ unit: 'ft', spacingX: 5, spacingY: 5, depths: depths.map((r) => [...r].reverse()).reverse() });
        expect(mirrored.cut).toBeCloseTo(all.cut, 8);
        expect(mirrored.fill).toBeCloseTo(all.fill, 8);
      }),
    );
  });

  it('gives CY x 0.764554857984 in m3 for the same grid measured in metres', () => {
    fc.assert(
      fc.property(gridArb, (depths) => {
        const ft = gridVolume({ unit: 'ft', spacingX: 25, spacingY: 20, depths });
        const m = gridVolume({ unit: 'm', spacingX: 25 * 0.3048, spacingY: 20 * 0.3048, depths: depths.map((r) => r.map((v) => (v === null ? null : v * 0.3048))) });
        expect(m.cut).toBeCloseTo(ft.cut * M3_PER_CY, 8);
        expect(m.fill).toBeCloseTo(ft.fill * M3_PER_CY, 8);
      }),
    );
  });
});
