import type { SpoilShape } from '../../constants';
import { DomainError, assertNonNegative } from '../domain-error';
import { dualLength, limit } from './trench-slopes';
import { fmt, fmtArea, fmtLength, fmtVolume, type Trail } from './trail';
import {
  areaUnitOf,
  cubicToVolume,
  volumeToCubic,
  volumeUnitOf,
  type AreaUnit,
  type LengthUnit,
  type VolumeUnit,
} from './units';

export interface SpoilInput {
  unit: LengthUnit;
  shape: SpoilShape;
  /** Excavated bank volume, CY (unit ft) or m3. */
  bankVolume: number;
  swellPercent: number;
  angleOfReposeDeg: number;
  /** Bank shape only: length of the spoil bank along the trench, ft or m. */
  length?: number;
}

export interface SpoilResult {
  unit: LengthUnit;
  shape: SpoilShape;
  /** Bank x (1 + swell), CY or m3. */
  looseVolume: number;
  volumeUnit: VolumeUnit;
  height: number;
  /** Pile only. */
  diameter?: number;
  /** Bank only: base width across the bank. */
  width?: number;
  footprintArea: number;
  areaUnit: AreaUnit;
  /** 1926.651(j)(2): the toe stays this far from the excavation edge (2 ft, 0.6096 m). */
  setback: number;
  /** Edge of the excavation to the pile's centre (or the bank's ridge line): setback + radius or half width. */
  centerFromEdge: number;
  cautions: string[];
  trail: Trail;
}

const RAD = Math.PI / 180;

/** Loose volume of a cone pile from its height and angle of repose, CY or m3 (stockpile tables). */
export function conePileVolume(height: number, angleOfReposeDeg: number, unit: LengthUnit): number {
  const r = height / Math.tan(angleOfReposeDeg * RAD);
  return cubicToVolume((Math.PI * r * r * height) / 3, unit);
}

/**
 * Spoil planner. Pile: a cone, V = (1/3) pi r^2 h with h = r tan(a), so r = (3 V / (pi tan a))^(1/3), V loose.
 * Bank: a triangular prism along `length`, loose area per unit length A = B H / 2 with H = (B/2) tan(a), so
 * B = sqrt(4 A / tan a) (derivation; textbook form from memory). Heights and widths in ft or m.
 */
export function spoilPlan(input: SpoilInput): SpoilResult {
  const { unit, shape, bankVolume, swellPercent, angleOfReposeDeg } = input;
  assertNonNegative(bankVolume, ['bankVolume']);
  assertNonNegative(swellPercent, ['swellPercent']);
  assertNonNegative(angleOfReposeDeg, ['angleOfReposeDeg'], true);
  if (angleOfReposeDeg >= 90)
    throw new DomainError('INVALID_NUMBER', 'An angle of repose is below 90 degrees', ['angleOfReposeDeg']);
  const looseVolume = bankVolume * (1 + swellPercent / 100);
  const cubic = volumeToCubic(looseVolume, unit);
  const tan = Math.tan(angleOfReposeDeg * RAD);
  const setback = limit('spoilSetback', unit);
  const trail: Trail = [
    `Loose = bank x (1 + swell) = ${fmt(bankVolume, 2)} x ${fmt(1 + swellPercent / 100, 4)} = ${fmtVolume(looseVolume, unit)}`,
  ];
  const base = { unit, shape, looseVolume, volumeUnit: volumeUnitOf(unit), areaUnit: areaUnitOf(unit), setback };
  const cautions = [
    `Keep the toe of the spoil and equipment at least ${dualLength('spoilSetback', unit)} from the excavation edge, or retain it (29 CFR 1926.651(j)(2)).`,
    'Planning aid only: follow the governing local code and a competent person on site.',
  ];
  if (shape === 'pile') {
    const r = Math.cbrt((3 * cubic) / (Math.PI * tan));
    const height = r * tan;
    const footprintArea = Math.PI * r * r;
    trail.push(
      `Cone pile at ${fmt(angleOfReposeDeg, 1)} deg: r = (3 V / (pi tan a))^(1/3) = ${fmtLength(r, unit, 3)}; h = r tan a = ${fmtLength(height, unit, 3)}`,
      `Diameter ${fmtLength(2 * r, unit, 3)}, footprint pi r^2 = ${fmtArea(footprintArea, unit)}; centre ${fmtLength(setback + r, unit, 2)} from the edge (setback + r)`,
    );
    return { ...base, height, diameter: 2 * r, footprintArea, centerFromEdge: setback + r, cautions, trail };
  }
  const length = input.length;
  if (length === undefined)
    throw new DomainError('LENGTH_REQUIRED', 'A spoil bank needs its length along the trench', ['length']);
  assertNonNegative(length, ['length'], true);
  const area = cubic / length;
  const width = Math.sqrt((4 * area) / tan);
  const height = (width / 2) * tan;
  trail.push(
    `Spoil bank ${fmtLength(length, unit)} long: loose area per unit length A = V / L = ${fmtArea(area, unit)}`,
    `Triangular section at ${fmt(angleOfReposeDeg, 1)} deg: B = sqrt(4 A / tan a) = ${fmtLength(width, unit, 3)}; H = (B/2) tan a = ${fmtLength(height, unit, 3)} (derived from the section's area and the angle of repose)`, // textbook form, from memory
    `Footprint B x L = ${fmtArea(width * length, unit)}; ridge ${fmtLength(setback + width / 2, unit, 2)} from the edge (setback + B/2)`,
  );
  return {
    ...base,
    height,
    width,
    footprintArea: width * length,
    centerFromEdge: setback + width / 2,
    cautions,
    trail,
  };
}
