import type { EndAreaFormula, ZeroAreaEndRule } from '../../constants';
import { DomainError, assertFinite, assertNonNegative } from '../domain-error';
import { endAreaPair, isPyramid, prismoidal, type StationInput } from './end-area-core';
import { spacingCheck, spacingTrail, type SpacingReport } from './end-area-spacing';
import { fmt, fmtVolume, type Trail } from './trail';
import { cubicToVolume, formatStation, volumeUnitOf, type LengthUnit, type VolumeUnit } from './units';

export type { StationInput } from './end-area-core';

export interface EndAreaInput {
  unit: LengthUnit;
  stations: readonly StationInput[];
  formula?: EndAreaFormula;
  zeroAreaEnds?: ZeroAreaEndRule;
}

export interface EndAreaSegment {
  from: number;
  to: number;
  length: number;
  /** CY (unit ft) or m3. */
  cut: number;
  fill: number;
  /** Prismoidal rows only: the mid section's station. */
  mid?: number;
  /** Which of cut and fill used the pyramid rule in this segment, if any. */
  pyramid?: 'cut' | 'fill' | 'both';
}

export interface EndAreaResult {
  unit: LengthUnit;
  formula: EndAreaFormula;
  cut: number;
  fill: number;
  net: number;
  volumeUnit: VolumeUnit;
  segments: EndAreaSegment[];
  spacing: SpacingReport;
  trail: Trail;
}

const INTERVAL_TOLERANCE = 1e-9;

function checkStations(stations: readonly StationInput[]): void {
  if (stations.length < 2) throw new DomainError('VALIDATION_FAILED', 'At least 2 stations are needed', ['stations']);
  let previous = -Infinity;
  for (let i = 0; i < stations.length; i++) {
    const s = stations[i]!;
    // One cheap test per station; the helpers only run to name the failing field.
    if (!(
      s.station > previous &&
      s.cutArea >= 0 &&
      s.fillArea >= 0 &&
      s.cutArea < Infinity &&
      s.fillArea < Infinity &&
      s.station < Infinity
    )) {
      assertFinite(s.station, ['stations', i, 'station']);
      assertNonNegative(s.cutArea, ['stations', i, 'cutArea']);
      assertNonNegative(s.fillArea, ['stations', i, 'fillArea']);
      throw new DomainError('STATIONS_NOT_INCREASING', `Station ${i} must be beyond station ${i - 1}`, [
        'stations',
        i,
        'station',
      ]);
    }
    previous = s.station;
  }
}

function pyramidTag(cut: boolean, fill: boolean): EndAreaSegment['pyramid'] {
  return cut && fill ? 'both' : cut ? 'cut' : fill ? 'fill' : undefined;
}

function averageRows(stations: readonly StationInput[], unit: LengthUnit, rule: ZeroAreaEndRule): EndAreaSegment[] {
  const rows: EndAreaSegment[] = [];
  const perCubic = unit === 'ft' ? 27 : 1;
  for (let i = 0; i + 1 < stations.length; i++) {
    const a = stations[i]!;
    const b = stations[i + 1]!;
    const length = b.station - a.station;
    const row: EndAreaSegment = {
      from: a.station,
      to: b.station,
      length,
      cut: endAreaPair(a.cutArea, b.cutArea, length, rule) / perCubic,
      fill: endAreaPair(a.fillArea, b.fillArea, length, rule) / perCubic,
    };
    if (rule === 'pyramid') {
      const tag = pyramidTag(isPyramid(a.cutArea, b.cutArea, rule), isPyramid(a.fillArea, b.fillArea, rule));
      if (tag) row.pyramid = tag;
    }
    rows.push(row);
  }
  return rows;
}

/** Stations in threes (end, mid, end) over equal pairs of intervals; an error names the offending station. */
function prismoidalRows(stations: readonly StationInput[], unit: LengthUnit): EndAreaSegment[] {
  if (stations.length < 3 || stations.length % 2 === 0) {
    throw new DomainError(
      'PRISMOIDAL_NEEDS_ODD_STATIONS',
      `The prismoidal formula takes stations in threes (end, mid, end): an odd count of 3 or more, got ${stations.length}`,
      ['stations'],
    );
  }
  const rows: EndAreaSegment[] = [];
  for (let i = 0; i + 2 < stations.length; i += 2) {
    const a = stations[i]!;
    const m = stations[i + 1]!;
    const b = stations[i + 2]!;
    const first = m.station - a.station;
    const second = b.station - m.station;
    if (Math.abs(first - second) > INTERVAL_TOLERANCE * Math.max(1, first + second)) {
      throw new DomainError(
        'PRISMOIDAL_UNEQUAL_INTERVALS',
        `Station ${i + 1} must be halfway between stations ${i} and ${i + 2} (intervals ${first} and ${second})`,
        ['stations', i + 1, 'station'],
      );
    }
    const length = b.station - a.station;
    rows.push({
      from: a.station,
      to: b.station,
      length,
      mid: m.station,
      cut: cubicToVolume(prismoidal(a.cutArea, m.cutArea, b.cutArea, length), unit),
      fill: cubicToVolume(prismoidal(a.fillArea, m.fillArea, b.fillArea, length), unit),
    });
  }
  return rows;
}

/**
 * Earthwork volumes between cross sections, cut and fill separately: by average end area (default; optional
 * pyramid rule where one end area is zero) or by the prismoidal formula. Volumes in CY (unit ft: sq ft x ft / 27)
 * or m3, one row per segment (per pair of intervals for prismoidal), plus a spacing check.
 */
export function endAreaVolumes(input: EndAreaInput): EndAreaResult {
  const { unit, stations } = input;
  const formula = input.formula ?? 'average-end-area';
  const rule = input.zeroAreaEnds ?? 'average';
  checkStations(stations);
  const segments = formula === 'prismoidal' ? prismoidalRows(stations, unit) : averageRows(stations, unit, rule);
  let cut = 0;
  let fill = 0;
  let pyramids = 0;
  for (const row of segments) {
    cut += row.cut;
    fill += row.fill;
    if (row.pyramid) pyramids++;
  }
  const spacing = spacingCheck(stations, unit, rule);
  const first = stations[0]!.station;
  const last = stations[stations.length - 1]!.station;
  const trail: Trail = [
    formula === 'prismoidal'
      ? 'Prismoidal formula V = L (A1 + 4 Am + A2) / 6, Am measured at the mid section (surveying texts)'
      : 'Average end area V = L (A1 + A2) / 2 (FHWA FP Section 109; US Army FM 5-233 ch. 4)',
    `${fmt(stations.length, 0)} stations from ${formatStation(first, unit)} to ${formatStation(last, unit)} (${fmt(last - first)} ${unit}), ${fmt(segments.length, 0)} segment${segments.length === 1 ? '' : 's'}`,
  ];
  if (formula === 'average-end-area' && rule === 'pyramid') {
    trail.push(
      `Pyramid rule V = A L / 3 where one end area is zero (Wikibooks, Fundamentals of Transportation / Earthwork): ${fmt(pyramids, 0)} segments`,
    );
  }
  if (unit === 'ft') trail.push('Areas in sq ft times lengths in ft give cu ft; divided by 27 for CY');
  trail.push(
    `Cut = ${fmtVolume(cut, unit)}; fill = ${fmtVolume(fill, unit)}; net (cut - fill) = ${fmtVolume(cut - fill, unit)}`,
    ...spacingTrail(spacing, unit),
  );
  return { unit, formula, cut, fill, net: cut - fill, volumeUnit: volumeUnitOf(unit), segments, spacing, trail };
}
