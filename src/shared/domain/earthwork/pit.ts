import { DomainError, assertNonNegative } from '../domain-error';
import { cubicStep, fmt, fmtArea, fmtLength, type Trail } from './trail';
import { areaUnitOf, cubicToVolume, volumeUnitOf, type AreaUnit, type LengthUnit, type VolumeUnit } from './units';

export interface PitInput {
  unit: LengthUnit;
  /** Plan length and width of the pit bottom, ft or m. */
  length: number;
  width: number;
  /** Depths at the four corners, ft or m. */
  cornerDepths: readonly [number, number, number, number] | readonly number[];
  /** Side slope, horizontal per vertical (1.5 for 1-1/2:1); absent or 0 for vertical sides. */
  sideSlope?: number;
}

export interface PitResult {
  unit: LengthUnit;
  method: 'average-depth' | 'prismoid';
  /** Plan area of the bottom, sq ft or m2. */
  area: number;
  averageDepth: number;
  volume: number;
  volumeUnit: VolumeUnit;
  areaUnit: AreaUnit;
  /** Sloped pits: top outline (bottom grown by slope x average depth on every side) and the mid-depth area. */
  top?: { length: number; width: number; area: number };
  midArea?: number;
  trail: Trail;
}

/**
 * Pit by average corner depth (common practice): V = plan area x mean of the four corner depths. With side
 * slopes on level ground (all four corner depths equal) the pit is a prismoid: bottom L x W at depth d, top (L + 2 s d) x (W + 2 s d), and the
 * prismoidal formula V = d (A_bottom + 4 A_mid + A_top) / 6, exact for a prismoid. Plan dimensions are taken as
 * the bottom of the pit. CY (unit ft) or m3.
 */
export function pitVolume(input: PitInput): PitResult {
  const { unit, length, width, cornerDepths } = input;
  assertNonNegative(length, ['length'], true);
  assertNonNegative(width, ['width'], true);
  if (cornerDepths.length !== 4)
    throw new DomainError('VALIDATION_FAILED', 'Give exactly 4 corner depths', ['cornerDepths']);
  cornerDepths.forEach((d, i) => assertNonNegative(d, ['cornerDepths', i]));
  const slope = input.sideSlope ?? 0;
  assertNonNegative(slope, ['sideSlope']);
  const area = length * width;
  const averageDepth = (cornerDepths[0]! + cornerDepths[1]! + cornerDepths[2]! + cornerDepths[3]!) / 4;
  const trail: Trail = [
    `Plan area = ${fmtLength(length, unit)} x ${fmtLength(width, unit)} = ${fmtArea(area, unit)}`,
    `Average depth = (${cornerDepths.map((d) => fmt(d, 3)).join(' + ')}) / 4 = ${fmtLength(averageDepth, unit, 3)} (common practice)`,
  ];
  if (slope === 0) {
    const cubic = area * averageDepth;
    trail.push(`V = area x average depth = ${cubicStep(cubic, unit)}`);
    return {
      unit,
      method: 'average-depth',
      area,
      averageDepth,
      volume: cubicToVolume(cubic, unit),
      volumeUnit: volumeUnitOf(unit),
      areaUnit: areaUnitOf(unit),
      trail,
    };
  }
  if (cornerDepths.some((d) => d !== cornerDepths[0])) {
    // The prismoid needs level ground: with a tilt the slopes daylight at different distances on each side, and
    // reducing the tilt to the average depth understates the volume (by 1 to 80 % in checks against exact
    // integration). Refused rather than approximated.
    throw new DomainError(
      'SLOPED_PIT_ON_SLOPING_GROUND',
      'Side slopes on sloping ground (the corner depths differ) cannot be measured as one prismoid: use the grid worksheet with depths over the pit and its slopes, or give vertical sides (side slope 0)',
      ['sideSlope'],
    );
  }
  const grow = 2 * slope * averageDepth;
  const top = { length: length + grow, width: width + grow, area: (length + grow) * (width + grow) };
  const midArea = (length + grow / 2) * (width + grow / 2);
  const cubic = (averageDepth * (area + 4 * midArea + top.area)) / 6;
  trail.push(
    `Side slope ${fmt(slope, 2)}:1 (H:V): top = ${fmt(top.length, 3)} x ${fmt(top.width, 3)} = ${fmtArea(top.area, unit)}, mid-depth area ${fmtArea(midArea, unit)}`,
    `Prismoid V = d (A_bottom + 4 A_mid + A_top) / 6 = ${cubicStep(cubic, unit)} (prismoidal formula, exact for a prismoid)`,
  );
  return {
    unit,
    method: 'prismoid',
    area,
    averageDepth,
    volume: cubicToVolume(cubic, unit),
    volumeUnit: volumeUnitOf(unit),
    areaUnit: areaUnitOf(unit),
    top,
    midArea,
    trail,
  };
}
