import { DomainError, assertNonNegative } from '../domain-error';
import { decimalOf, divRoundHalfAway, pow10, toNumber } from '../decimal';
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
  // Exact decimals throughout (decimal.ts): loose = L / 10^LS, bank = loose x 100 / (100 + swell percent).
  const LS = 12;
  let L = 0n;
  let loads = 0;
  input.loads.forEach((load, i) => {
    assertNonNegative(load.capacity, ['loads', i, 'capacity'], true);
    assertNonNegative(load.count, ['loads', i, 'count']);
    if (!Number.isInteger(load.count))
      throw new DomainError('INVALID_NUMBER', 'A load count is a whole number', ['loads', i, 'count']);
    const c = decimalOf(load.capacity);
    L +=
      (c.scale <= LS ? c.digits * pow10(LS - c.scale) : divRoundHalfAway(c.digits, pow10(c.scale - LS))) *
      BigInt(load.count);
    loads += load.count;
  });
  const loose = toNumber({ digits: L, scale: LS });
  const swell = input.swellPercent / 100;
  const sw = decimalOf(input.swellPercent);
  // Bank in hundredths, rounded half up once on the exact quotient (computed to 0.01), then paid to 0.1 from it.
  const bankHundredths = divRoundHalfAway(
    L * 100n * 100n * pow10(sw.scale),
    pow10(LS) * (100n * pow10(sw.scale) + sw.digits),
  );
  const bankVolume = toNumber({ digits: bankHundredths, scale: 2 });
  const pay = toNumber({ digits: divRoundHalfAway(bankHundredths, 10n), scale: 1 });
  const label = input.unit ? volumeUnitOf(input.unit) : 'input unit';
  const trail: Trail = [
    `Loose volume = sum of capacity x loads = ${fmt(loose, 2)} loose ${label} over ${fmt(loads, 0)} loads`,
    `Bank = loose / (1 + swell) = ${fmt(loose, 2)} / ${fmt(1 + swell, 4)} = ${fmt(bankVolume, 2)} (computed to 0.01)`,
    `Paid in bank measure: ${fmt(pay, 1)} bank ${label} (to 0.1: truck measure, state DOT construction manual section 109.11); an item paid loose takes the loose volume`,
  ];
  return {
    looseVolume: toNumber({ digits: divRoundHalfAway(L, pow10(LS - 2)), scale: 2 }),
    bankVolume,
    payQuantity: pay,
    loads,
    volumeUnit: label,
    trail,
  };
}
