import type { ZeroAreaEndRule } from '../../constants';

export interface StationInput {
  /** Station in length units (12+50 is 1250 ft). */
  station: number;
  /** Cut end area, sq ft (unit ft) or m2. */
  cutArea: number;
  /** Fill end area, sq ft (unit ft) or m2. */
  fillArea: number;
}

/**
 * Volume between two end areas, cubic length units. Average end area V = L (A1 + A2) / 2 (FHWA FP Section 109;
 * US Army FM 5-233 ch. 4); with the pyramid rule, V = A L / 3 where exactly one end area is zero (Wikibooks,
 * Fundamentals of Transportation / Earthwork).
 */
export function endAreaPair(a1: number, a2: number, length: number, zeroAreaEnds: ZeroAreaEndRule): number {
  if (zeroAreaEnds === 'pyramid' && (a1 === 0) !== (a2 === 0)) return ((a1 + a2) * length) / 3;
  return ((a1 + a2) * length) / 2;
}

export function isPyramid(a1: number, a2: number, zeroAreaEnds: ZeroAreaEndRule): boolean {
  return zeroAreaEnds === 'pyramid' && (a1 === 0) !== (a2 === 0);
}

/** Prismoidal formula V = L (A1 + 4 Am + A2) / 6 with Am the area measured at mid-length. */
export function prismoidal(a1: number, am: number, a2: number, length: number): number {
  return (length * (a1 + 4 * am + a2)) / 6;
}

/**
 * Cut and fill totals (cubic length units) by average end area over every `stride`-th station from the first,
 * plus the last one (stride 1: all of them). Used for the full run and for the drop-every-other sensitivity.
 */
export function averageEndAreaTotals(
  stations: readonly StationInput[],
  stride: number,
  zeroAreaEnds: ZeroAreaEndRule,
): { cut: number; fill: number } {
  let cut = 0;
  let fill = 0;
  const last = stations.length - 1;
  for (let i = 0; i < last; ) {
    const j = Math.min(i + stride, last);
    const a = stations[i]!;
    const b = stations[j]!;
    const length = b.station - a.station;
    cut += endAreaPair(a.cutArea, b.cutArea, length, zeroAreaEnds);
    fill += endAreaPair(a.fillArea, b.fillArea, length, zeroAreaEnds);
    i = j;
  }
  return { cut, fill };
}

/**
 * US Navy field shortcut (NAVEDTRA 14081, Equipment Operator): CY = (A1 + A2) x 1.85 x D, areas in sq ft, D in
 * 100 ft stations (1.85 is about 100 / 54). For hand checks only; the engine itself divides by 27 exactly.
 */
export function navyShortcutCubicYards(a1: number, a2: number, stations100: number): number {
  return (a1 + a2) * 1.85 * stations100;
}
