import { describe, expect, it } from 'vitest';
import { pointsFromRows, surfaceVolume } from '@/shared/domain/earthwork/surface';
import { depthMap, MAP_MAX_POINTS, MAP_STEPS, type DepthMap } from '@/shared/domain/earthwork/surface-map';
import { grid, rel } from './surface-reference';

/**
 * The cut and fill map is drawn from the overlay's own pieces, cut where the depth crosses a band's limit. Checked
 * on two planes, whose depth is linear, so each band is a strip of known width (geometry), and against the volume:
 * the pieces cover the footprint exactly.
 */
const square = (z: (x: number, y: number) => number): [number, number, number][] =>
  [
    [0, 0],
    [100, 0],
    [100, 100],
    [0, 100],
    [50, 50],
  ].map(([x, y]) => [x!, y!, z(x!, y!)]);

/** Area and integral of the depth over each polygon, by band, from the map's own corners (shoelace). */
function byBand(m: DepthMap, depth?: (x: number, y: number) => number) {
  const area = new Map<number, number>();
  let at = 0;
  for (let k = 0; k < m.counts.length; k++) {
    const n = m.counts[k]!;
    let a2 = 0;
    for (let i = 0; i < n; i++) {
      const j = (i + 1) % n;
      const [xi, yi, xj, yj] = [m.xy[at + 2 * i]!, m.xy[at + 2 * i + 1]!, m.xy[at + 2 * j]!, m.xy[at + 2 * j + 1]!];
      a2 += xi * yj - xj * yi;
      if (!depth) continue;
      // Every corner's depth lies in its polygon's band (float32 corners: 1e-4 ft slack).
      const v = depth(xi + m.x0, yi + m.y0);
      const b = m.band[k]!;
      if (b > 0) expect(v).toBeGreaterThanOrEqual(Math.max(m.level, (b - 1) * m.step) - 1e-4);
      if (b > 0 && b < MAP_STEPS) expect(v).toBeLessThanOrEqual(b * m.step + 1e-4);
      if (b < 0) expect(-v).toBeGreaterThanOrEqual(Math.max(m.level, (-b - 1) * m.step) - 1e-4);
      if (b === 0) expect(Math.abs(v)).toBeLessThanOrEqual(m.level + 1e-4);
    }
    area.set(m.band[k]!, (area.get(m.band[k]!) ?? 0) + Math.abs(a2) / 2);
    at += 2 * n;
  }
  return area;
}

describe('cut and fill map from the overlay pieces', () => {
  it('two planes: each band is a strip of the width its depth range gives (geometry), the blank strip too', () => {
    // Depth 1 - 0.02 x over the 100 x 100 ft square: deepest cut and fill 1 ft, bands of 1/6 ft, each 1/6 / 0.02 =
    // 8.33 ft wide (833.3 sq ft); band 1 starts at the 0.01 ft precision limit: (1/6 - 0.01) / 0.02 x 100.
    const design = (x: number) => 9 + 0.02 * x;
    const m = depthMap(pointsFromRows(square(() => 10)), pointsFromRows(square((x) => design(x))), 'ft')!;
    expect([m.maxCut, m.maxFill, m.thinnedCell]).toEqual([1, 1, 0]);
    const area = byBand(m, (x) => 10 - design(x));
    for (let b = 2; b <= MAP_STEPS; b++) {
      expect(area.get(b)).toBeCloseTo(100 * (1 / 6 / 0.02), 2); // float32 corners
      expect(area.get(-b)).toBeCloseTo(100 * (1 / 6 / 0.02), 2); // float32 corners
    }
    expect(area.get(1)).toBeCloseTo(((1 / 6 - 0.01) / 0.02) * 100, 2);
    expect(area.get(0)).toBeCloseTo((0.02 / 0.02) * 100, 2);
  });

  it('covers the footprint both surveys reach, as the volume measures it (different densities and footprints)', () => {
    const existing = grid(15, 12, 0, 0, 140, 110, (x, y) => 50 + 2 * Math.sin(x / 20) + 0.01 * y, 0.3, 31);
    const design = grid(9, 8, 20, -10, 100, 100, (x) => 50.5 + 0.01 * x, 0.3, 32);
    const r = surfaceVolume({ unit: 'ft', existing, design });
    const m = depthMap(pointsFromRows(existing), pointsFromRows(design), 'ft')!;
    let total = 0;
    for (const a of byBand(m).values()) total += a;
    expect(rel(total, r.footprintArea)).toBeLessThan(1e-6); // float32 corners
    expect(m.pieces).toBeGreaterThan(r.overlay.existingTriangles);
  });

  it('thins surveys above MAP_MAX_POINTS for the picture, keeping the pieces bounded', () => {
    const big = grid(150, 150, 0, 0, 1490, 1490, (x) => 100 + Math.sin(x / 90), 0.3, 33);
    const m = depthMap(pointsFromRows(big), pointsFromRows(square((x) => 99 + x / 1000)), 'ft')!;
    expect(m.thinnedCell).toBeGreaterThan(0);
    expect(m.pieces).toBeLessThan(12 * MAP_MAX_POINTS);
    expect(m.maxCut).toBeGreaterThan(0);
  });
});
