/**
 * Limits of the calculation API (POST /api/calc/:method), checked by the schemas in calc.ts. Arrays beyond them
 * are rejected with a field path, before any computation.
 */
export const CALC_LIMITS = {
  /** Points per line of a cross section (ground or design). */
  sectionPoints: 10_000,
  /** End-area stations. */
  stations: 100_000,
  /** Mass-haul stations (the layer integration grows with the square of the stations in one loop). */
  massHaulStations: 10_000,
  /** Grid nodes in all (rows x columns), e.g. 1,000 x 1,000. */
  gridNodes: 1_000_000,
  trenchRuns: 10_000,
  loadLines: 10_000,
  /** Points per surface survey. */
  surfacePoints: 1_000_000,
  /** Faces given per surface (a TIN has at most twice as many triangles as points). */
  surfaceFaces: 2_000_000,
  /** Breaklines per survey, and vertices in all of one survey's breaklines. */
  breaklines: 10_000,
  breaklineVertices: 100_000,
  payAppLines: 5_000,
  /** Corners of one pay-limit polygon (outer boundary or void) of a surface comparison, and voids in all. */
  payLimitCorners: 10_000,
  payLimitVoids: 1_000,
  /** Largest magnitude of any coordinate, dimension or quantity: keeps products finite and digits meaningful. */
  maxMagnitude: 1e9,
  /** Largest swell percent accepted (well-blasted rock is about 65 %). */
  maxSwellPercent: 300,
  /** Side slope of a pit, horizontal per vertical. */
  maxSideSlope: 20,
} as const;
