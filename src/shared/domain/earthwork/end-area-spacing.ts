import type { ZeroAreaEndRule } from '../../constants';
import { averageEndAreaTotals, type StationInput } from './end-area-core';
import { fmt, fmtVolume, listSome } from './trail';
import { cubicToVolume, formatStation, type LengthUnit } from './units';

/**
 * Spacing check thresholds (common practice, from memory: sections at 50 ft, or 20 m, where the ground or the
 * template changes; an intermediate section wherever the area changes by more than about half between
 * sections). A segment is flagged when it is longer than `maxSpacing` AND its cut or fill area changes by more
 * than `maxAreaChange` of the larger end area.
 */
export const SPACING_CHECK = {
  maxSpacing: { ft: 50, m: 20 },
  maxAreaChange: 0.5,
  /** Flagged rows listed in full up to this count; the count itself is always exact. */
  maxListed: 1000,
} as const;

export interface FlaggedSegment {
  from: number;
  to: number;
  length: number;
  /** |A2 - A1| / max(A1, A2) for cut and for fill (0 when both are zero). */
  cutChange: number;
  fillChange: number;
  /**
   * How much the average end area likely overstates this segment, CY or m3: L/6 (sqrt A1 - sqrt A2)^2 for cut
   * plus fill, exact for sections that grow similarly and linearly (frustum; pyramid when one end is zero).
   */
  estimatedOverstatement: number;
}

export interface SpacingReport {
  maxSpacing: number;
  maxAreaChange: number;
  flaggedCount: number;
  flagged: FlaggedSegment[];
  /**
   * Sensitivity: totals by average end area with every other intermediate section dropped (first and last
   * kept), against the same method on all sections. Null with fewer than 3 stations.
   */
  dropEveryOther: {
    keptStations: number;
    cut: number;
    fill: number;
    net: number;
    /** Dropped minus full, CY or m3. */
    cutChange: number;
    fillChange: number;
    netChange: number;
    /** Change as a percent of the full total (null when the full total is zero). */
    cutChangePercent: number | null;
    fillChangePercent: number | null;
  } | null;
}

function change(a1: number, a2: number): number {
  const big = Math.max(a1, a2);
  return big === 0 ? 0 : Math.abs(a2 - a1) / big;
}

function frustumGap(a1: number, a2: number, length: number): number {
  const d = Math.sqrt(a1) - Math.sqrt(a2);
  return (length / 6) * d * d;
}

function percent(delta: number, total: number): number | null {
  return total === 0 ? null : (delta / total) * 100;
}

export function spacingCheck(
  stations: readonly StationInput[],
  unit: LengthUnit,
  rule: ZeroAreaEndRule,
): SpacingReport {
  const maxSpacing = SPACING_CHECK.maxSpacing[unit];
  const flagged: FlaggedSegment[] = [];
  let flaggedCount = 0;
  for (let i = 0; i + 1 < stations.length; i++) {
    const a = stations[i]!;
    const b = stations[i + 1]!;
    const length = b.station - a.station;
    if (length <= maxSpacing) continue;
    const cutChange = change(a.cutArea, b.cutArea);
    const fillChange = change(a.fillArea, b.fillArea);
    if (Math.max(cutChange, fillChange) <= SPACING_CHECK.maxAreaChange) continue;
    flaggedCount++;
    if (flagged.length >= SPACING_CHECK.maxListed) continue;
    const gap = frustumGap(a.cutArea, b.cutArea, length) + frustumGap(a.fillArea, b.fillArea, length);
    flagged.push({
      from: a.station,
      to: b.station,
      length,
      cutChange,
      fillChange,
      estimatedOverstatement: cubicToVolume(gap, unit),
    });
  }
  return {
    maxSpacing,
    maxAreaChange: SPACING_CHECK.maxAreaChange,
    flaggedCount,
    flagged,
    dropEveryOther: dropEveryOther(stations, unit, rule),
  };
}

function dropEveryOther(
  stations: readonly StationInput[],
  unit: LengthUnit,
  rule: ZeroAreaEndRule,
): SpacingReport['dropEveryOther'] {
  const n = stations.length;
  if (n < 3) return null;
  const full = averageEndAreaTotals(stations, 1, rule);
  const dropped = averageEndAreaTotals(stations, 2, rule);
  const kept = Math.ceil(n / 2) + (n % 2 === 0 ? 1 : 0);
  const cut = cubicToVolume(dropped.cut, unit);
  const fill = cubicToVolume(dropped.fill, unit);
  const fullCut = cubicToVolume(full.cut, unit);
  const fullFill = cubicToVolume(full.fill, unit);
  return {
    keptStations: kept,
    cut,
    fill,
    net: cut - fill,
    cutChange: cut - fullCut,
    fillChange: fill - fullFill,
    netChange: cut - fill - (fullCut - fullFill),
    cutChangePercent: percent(cut - fullCut, fullCut),
    fillChangePercent: percent(fill - fullFill, fullFill),
  };
}

export function spacingTrail(report: SpacingReport, unit: LengthUnit): string[] {
  const lines = [
    `Spacing check (common practice): segments over ${fmt(report.maxSpacing, 0)} ${unit} whose cut or fill area changes by more than ${fmt(report.maxAreaChange * 100, 0)} %: ${fmt(report.flaggedCount, 0)} flagged`,
    ...listSome(
      report.flagged,
      5,
      (f) =>
        `  ${formatStation(f.from, unit)} to ${formatStation(f.to, unit)} (${fmt(f.length)} ${unit}): end areas may overstate it by about ${fmtVolume(f.estimatedOverstatement, unit)}`,
    ),
  ];
  const d = report.dropEveryOther;
  if (d) {
    const pct = (p: number | null) => (p === null ? 'n/a' : `${fmt(p)} %`);
    lines.push(
      `Dropping every other section (${fmt(d.keptStations, 0)} kept, average end area on both): cut moves ${fmtVolume(d.cutChange, unit)} (${pct(d.cutChangePercent)}), fill ${fmtVolume(d.fillChange, unit)} (${pct(d.fillChangePercent)})`,
    );
  }
  return lines;
}
