import Delaunator from 'delaunator';
import { endAreaVolumes } from '../src/shared/domain/earthwork/end-area';
import { gridVolumeFromArray } from '../src/shared/domain/earthwork/grid';
import { surfaceVolumeFromPoints } from '../src/shared/domain/earthwork/surface';
import { roundPitGrid, stations, survey, type Survey } from './engine-inputs';
import { defineBench, type BenchEntry } from './types';

const GRID = 1000;

const grid: BenchEntry<Float64Array> = {
  name: 'grid-1000x1000',
  baseline: 'plain pass summing the same Float64Array',
  budget: 2,
  // Runs take about a millisecond: many of them let the fastest of each side find a quiet moment.
  repeats: 200,
  warmups: 20,
  setup: () => roundPitGrid(GRID),
  run: (values) => gridVolumeFromArray(values, GRID, GRID, 10, 10, 'ft'),
  runBaseline: (values) => {
    let sum = 0;
    for (let i = 0; i < values.length; i++) {
      const v = values[i]!;
      if (v === v) sum += v;
    }
    return sum;
  },
};

/** Delaunator on both surveys, from the same columns the engine starts from. */
function triangulateBoth(s: { existing: Survey; design: Survey }): number {
  let triangles = 0;
  for (const p of [s.existing, s.design]) {
    const coords = new Float64Array(2 * p.x.length);
    for (let i = 0; i < p.x.length; i++) {
      coords[2 * i] = p.x[i]!;
      coords[2 * i + 1] = p.y[i]!;
    }
    triangles += new Delaunator(coords).triangles.length;
  }
  return triangles;
}

const surface: BenchEntry<{ existing: Survey; design: Survey }> = {
  name: 'surface-1m-points-each',
  baseline: 'delaunator triangulation of both surveys alone',
  // Issue 13: the exact overlay of both triangulations in at most 2.5x triangulating both, under 1.5 GB.
  budget: 2.5,
  memoryBudgetMB: 1536,
  repeats: 3,
  setup: () => ({
    existing: survey(1000, 1, (x, y) => 100 + 5 * Math.sin(x / 50) + 0.01 * y),
    design: survey(1000, 7, (x, y) => 101 + 0.002 * x + (Math.abs(x - 500) < 200 && Math.abs(y - 500) < 150 ? -2 : 0)),
  }),
  run: (s) => surfaceVolumeFromPoints('ft', s.existing, s.design),
  runBaseline: triangulateBoth,
};

type StationRows = ReturnType<typeof stations>;

const endAreas: BenchEntry<StationRows> = {
  name: 'end-area-100k-stations',
  baseline: 'plain loop building the same per-segment rows',
  // Beyond the rows every answer must carry, the engine validates, runs the spacing check, the
  // drop-every-other totals and writes the trail.
  budget: 2.5,
  repeats: 60,
  warmups: 15,
  setup: () => stations(100_000),
  run: (rows) => endAreaVolumes({ unit: 'ft', stations: rows }),
  runBaseline: (rows) => {
    const segments: { from: number; to: number; length: number; cut: number; fill: number }[] = [];
    let cut = 0;
    let fill = 0;
    for (let i = 1; i < rows.length; i++) {
      const a = rows[i - 1]!;
      const b = rows[i]!;
      const length = b.station - a.station;
      const row = {
        from: a.station,
        to: b.station,
        length,
        cut: ((a.cutArea + b.cutArea) * length) / 2 / 27,
        fill: ((a.fillArea + b.fillArea) * length) / 2 / 27,
      };
      cut += row.cut;
      fill += row.fill;
      segments.push(row);
    }
    return { cut, fill, segments };
  },
};

export const benchmarks = [defineBench(grid), defineBench(surface), defineBench(endAreas)];
