/** [x, y] in plan, or [offset, elevation] in a cross section. */
export type Point2 = readonly [number, number];

/**
 * Signed area by the coordinate (shoelace) method: 1/2 sum(x_i y_(i+1) - x_(i+1) y_i), positive when the
 * vertices run counter-clockwise. Source: Jerry Mahun, Open Access COGO text, ch. H. Coordinates are shifted to
 * the first vertex first, which leaves the area unchanged and keeps large survey coordinates from losing
 * digits.
 */
export function signedPolygonArea(points: readonly Point2[]): number {
  const n = points.length;
  if (n < 3) return 0;
  const [x0, y0] = points[0]!;
  let twice = 0;
  for (let i = 0; i < n; i++) {
    const [xa, ya] = points[i]!;
    const [xb, yb] = points[(i + 1) % n]!;
    twice += (xa - x0) * (yb - y0) - (xb - x0) * (ya - y0);
  }
  return twice / 2;
}

/** Area enclosed by a closed traverse (any orientation), coordinate method. */
export function polygonArea(points: readonly Point2[]): number {
  return Math.abs(signedPolygonArea(points));
}
