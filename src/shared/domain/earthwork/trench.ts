import type { SoilClass, TrenchProtection } from '../../constants';
import { DomainError, assertNonNegative } from '../domain-error';
import { trenchCautions } from './trench-cautions';
import { TABLE_B1, limit } from './trench-slopes';
import { cubicStep, fmt, fmtLength, fmtVolume, type Trail } from './trail';
import { cubicToVolume, volumeUnitOf, type LengthUnit, type VolumeUnit } from './units';

export interface TrenchRunInput {
  length: number;
  depth: number;
  bottomWidth: number;
}

export interface TrenchInput {
  unit: LengthUnit;
  protection: TrenchProtection;
  /** Required for slope and bench (OSHA App. A class; A-short-term per Table B-1's exception). */
  soilClass?: SoilClass;
  runs: readonly TrenchRunInput[];
}

export interface TrenchRunResult {
  length: number;
  depth: number;
  bottomWidth: number;
  /** Width at the top of the cut, ft or m: bottom + 2 x (H per V) x depth. */
  topWidth: number;
  /** Cross-section area, sq ft or m2. */
  area: number;
  /** CY (unit ft) or m3. */
  volume: number;
  /** Benching only: number of benches per side. */
  benches?: number;
}

export interface TrenchResult {
  unit: LengthUnit;
  protection: TrenchProtection;
  soilClass: SoilClass | null;
  /** Side slope used, horizontal per vertical (0: vertical sides). */
  slope: number;
  volume: number;
  volumeUnit: VolumeUnit;
  runs: TrenchRunResult[];
  cautions: string[];
  trail: Trail;
}

function slopeFor(input: TrenchInput): number {
  if (input.protection === 'box') return 0;
  const soil = input.soilClass;
  if (!soil)
    throw new DomainError(
      'SOIL_CLASS_REQUIRED',
      `A soil class is needed to ${input.protection === 'slope' ? 'slope' : 'bench'} a trench`,
      ['soilClass'],
    );
  if (input.protection === 'bench' && (soil === 'C' || soil === 'A-short-term')) {
    throw new DomainError(
      'BENCHING_NOT_ALLOWED',
      soil === 'C'
        ? 'Type C soil may not be benched (29 CFR 1926 Subpart P App. B)'
        : 'The short-term 1/2:1 exception is for simple slopes; bench Type A at 3/4:1',
      ['soilClass'],
    );
  }
  return TABLE_B1[soil].horizontalPerVertical;
}

function runResult(run: TrenchRunInput, i: number, input: TrenchInput, slope: number): TrenchRunResult {
  const { unit } = input;
  assertNonNegative(run.length, ['runs', i, 'length'], true);
  assertNonNegative(run.depth, ['runs', i, 'depth'], true);
  assertNonNegative(run.bottomWidth, ['runs', i, 'bottomWidth'], true);
  if (
    input.protection === 'slope' &&
    input.soilClass === 'A-short-term' &&
    run.depth > limit('shortTermMaxDepth', unit)
  ) {
    throw new DomainError(
      'SHORT_TERM_DEPTH_EXCEEDED',
      `The short-term 1/2:1 slope applies only to Type A excavations ${fmtLength(limit('shortTermMaxDepth', unit), unit)} deep or less (Table B-1)`,
      ['runs', i, 'depth'],
    );
  }
  const { depth, bottomWidth, length } = run;
  const topWidth = bottomWidth + 2 * slope * depth;
  let area = ((bottomWidth + topWidth) / 2) * depth;
  let benches: number | undefined;
  if (input.protection === 'bench' && slope > 0) {
    // Steps of equal rise (at most the Figure B-1 maximum) whose back corners sit on the Table B-1 slope line:
    // each step leaves a triangle (slope x rise) x rise / 2 per side uncut.
    benches = Math.ceil(depth / limit('benchMaxRise', unit) - 1e-9);
    const rise = depth / benches;
    area -= benches * slope * rise * rise;
  }
  const result: TrenchRunResult = {
    length,
    depth,
    bottomWidth,
    topWidth,
    area,
    volume: cubicToVolume(area * length, unit),
  };
  if (benches !== undefined) result.benches = benches;
  return result;
}

/**
 * Trench excavation by runs: vertical sides in a trench box, side slopes of Table B-1 by soil class (OSHA 29 CFR
 * 1926 Subpart P App. B), or benches within that slope. V = area x length per run; CY (unit ft) or m3. The
 * cautions list always comes back; figures are planning aids, not a protective-system design.
 */
export function trenchVolume(input: TrenchInput): TrenchResult {
  const { unit, protection } = input;
  if (input.runs.length === 0) throw new DomainError('VALIDATION_FAILED', 'Give at least one run', ['runs']);
  const slope = slopeFor(input);
  const runs = input.runs.map((run, i) => runResult(run, i, input, slope));
  const volume = runs.reduce((sum, r) => sum + r.volume, 0);
  const soil = input.soilClass ?? null;
  const trail: Trail = [
    protection === 'box'
      ? 'Trench box: vertical sides, top width = bottom width (shield per 1926.652(c))'
      : `${protection === 'slope' ? 'Sloped' : 'Benched'} in ${soil}: Table B-1 slope ${TABLE_B1[soil!].label} (H:V) (29 CFR 1926 Subpart P App. B)`,
    'Top width = bottom width + 2 x (H per V) x depth; area = (bottom + top) / 2 x depth',
  ];
  if (protection === 'bench')
    trail.push(
      `Benches of equal rise, at most ${fmtLength(limit('benchMaxRise', unit), unit)} (OSHA 29 CFR 1926 Subpart P App. B Figure B-1), back corners on the slope line`,
    );
  runs
    .slice(0, 20)
    .forEach((r, i) =>
      trail.push(
        `Run ${i + 1}: ${fmtLength(r.length, unit)} long, ${fmtLength(r.depth, unit)} deep, bottom ${fmtLength(r.bottomWidth, unit)}, top ${fmtLength(r.topWidth, unit)}; area ${fmt(r.area)}; V = ${cubicStep(r.area * r.length, unit)}`,
      ),
    );
  if (runs.length > 20) trail.push(`... and ${runs.length - 20} more runs`);
  trail.push(`Total = ${fmtVolume(volume, unit)}`);
  return {
    unit,
    protection,
    soilClass: soil,
    slope,
    volume,
    volumeUnit: volumeUnitOf(unit),
    runs,
    cautions: trenchCautions(input, runs),
    trail,
  };
}

/**
 * Backfill volume (CY or m3) after the pipe, footing or wall volumes placed in the trench are taken out; the
 * displaced volumes are given in cubic length units (cu ft or m3) like a takeoff lists them.
 */
export function backfillVolume(excavatedVolume: number, displacedCubic: readonly number[], unit: LengthUnit): number {
  const displaced = displacedCubic.reduce((sum, v) => sum + v, 0);
  return excavatedVolume - cubicToVolume(displaced, unit);
}
