import type { SoilClass } from '../../constants';
import type { LengthUnit } from './units';

/**
 * OSHA 29 CFR 1926 Subpart P, Appendix B, Table B-1: maximum allowable slopes (H:V) for excavations less than
 * 20 ft deep. `A-short-term` is the table's exception for Type A excavations open 24 hours or less and 12 ft deep
 * or less (1/2:1).
 */
export const TABLE_B1: Record<SoilClass, { horizontalPerVertical: number; label: string; degrees: number }> = {
  'stable-rock': { horizontalPerVertical: 0, label: 'vertical', degrees: 90 },
  A: { horizontalPerVertical: 0.75, label: '3/4:1', degrees: 53 },
  'A-short-term': { horizontalPerVertical: 0.5, label: '1/2:1', degrees: 63 },
  B: { horizontalPerVertical: 1, label: '1:1', degrees: 45 },
  C: { horizontalPerVertical: 1.5, label: '1-1/2:1', degrees: 34 },
};

/**
 * Depth thresholds as the rule publishes them, in feet. Metric projects use the exact conversion (1 ft = 0.3048 m,
 * international foot): 5 ft = 1.524 m, 12 ft = 3.6576 m, 20 ft = 6.096 m. The decimals are written out, so each
 * is the double nearest the exact metric value, the same number a user typing it gets.
 */
export const TRENCH_LIMITS = {
  /** 1926.652(a)(1): a protective system is required at this depth and deeper (unless entirely stable rock). */
  protectiveSystemDepth: { ft: 5, m: 1.524 },
  /** Table B-1 covers excavations less than 20 ft deep; at 20 ft and deeper a registered PE designs the system. */
  engineerDepth: { ft: 20, m: 6.096 },
  /** Table B-1 short-term exception: Type A, open 24 h or less, 12 ft deep or less. */
  shortTermMaxDepth: { ft: 12, m: 3.6576 },
  /** App. B Figure B-1 bench rise (4 ft maximum; from memory of the figure). */
  benchMaxRise: { ft: 4, m: 1.2192 },
  /** 1926.651(j)(2): spoil and equipment kept back from the edge. */
  spoilSetback: { ft: 2, m: 0.6096 },
} as const;

export function limit(name: keyof typeof TRENCH_LIMITS, unit: LengthUnit): number {
  return TRENCH_LIMITS[name][unit];
}

/** "5 ft (1.524 m)" in a feet project, "1.524 m (5 ft)" in a metric one. */
export function dualLength(name: keyof typeof TRENCH_LIMITS, unit: LengthUnit): string {
  const { ft, m } = TRENCH_LIMITS[name];
  return unit === 'ft' ? `${ft} ft (${m} m)` : `${m} m (${ft} ft)`;
}
