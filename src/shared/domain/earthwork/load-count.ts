import { DomainError, assertNonNegative } from '../domain-error';
import { roundTo } from '../rounding';
import { fmt, type Trail } from './trail';
import { volumeUnitOf, type LengthUnit, type VolumeUnit } from './units';

export interface LoadInput {
  /** Body capacity of the truck, loose CY (or m3). */
  capacity: number;
  /** Number of loads (tickets). */
  count: number;
}

export interface LoadCountInput {
  swellPercent: number;
  loads: readonly LoadInput[];
  /** Optional: labels the result (CY for ft projects, m3 for metric). */
  unit?: LengthUnit;
}

export interface LoadCountResult {
  /** Sum of capacity x count, loose measure, to 0.01. */
  looseVolume: number;
  /** Loose / (1 + swell), bank measure, computed to 0.01. */
  bankVolume: number;
  /** Bank volume paid to 0.1 (from the 0.01 figure). */
  payQuantity: number;
  loads: number;
  volumeUnit: VolumeUnit | 'input unit';
  trail: Trail;
}

/** Truck measure: compute to 0.01, pay to 0.1 (a state DOT construction manual, section 109.11). */
export function measuredQuantity(value: number): number {
  return roundTo(value, 2);
}

export function payQuantity(value: number): number {
  return roundTo(measuredQuantity(value), 1);
}

/** Load count: loose volume hauled (capacity x loads) to bank volume with the material's swell. */
export function loadCount(input: LoadCountInput): LoadCountResult {
  assertNonNegative(input.swellPercent, ['swellPercent']);
  if (input.loads.length === 0) throw new DomainError('VALIDATION_FAILED', 'Give at least one load line', ['loads']);
  let loose = 0;
  let loads = 0;
  input.loads.forEach((load, i) => {
    assertNonNegative(load.capacity, ['loads', i, 'capacity'], true);
    assertNonNegative(load.count, ['loads', i, 'count']);
    if (!Number.isInteger(load.count)) throw new DomainError('INVALID_NUMBER', 'A load count is a whole number', ['loads', i, 'count']);
    loose += load.capacity * load.count;
    loads += load.count;
  });
  const swell = input.swellPercent / 100;
  const bankVolume = measuredQuantity(loose / (1 + swell));
  const pay = payQuantity(bankVolume);
  const label = input.unit ? volumeUnitOf(input.unit) : 'input unit';
  const trail: Trail = [
    `Loose volume = sum of capacity x loads = ${fmt(loose, 2)} loose ${label} over ${fmt(loads, 0)} loads`,
    `Bank = loose / (1 + swell) = ${fmt(loose, 2)} / ${fmt(1 + swell, 4)} = ${fmt(bankVolume, 2)} (computed to 0.01)`,
    `Pay quantity ${fmt(pay, 1)} bank ${label} (paid to 0.1: truck measure, state DOT construction manual section 109.11)`,
  ];
  return { looseVolume: measuredQuantity(loose), bankVolume, payQuantity: pay, loads, volumeUnit: label, trail };
}
