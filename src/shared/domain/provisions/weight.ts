import { MIN_FACTOR_LOADS } from '../../constants';
import { DomainError, assertNonNegative } from '../domain-error';
import { roundTo } from '../rounding';

/**
 * Weight measure (a state DOT Resident Engineer's Manual section 109.12). Weights are in tons (or tonnes) to
 * 0.01; net = gross - tare. A material source's ton-to-volume factor (tons per CY) comes from at least three
 * weighed loads whose volume was also measured, computed to 4 decimals and used to 3.
 */
export const WEIGHT_DECIMALS = 2;
export const FACTOR_COMPUTE_DECIMALS = 4;
export const FACTOR_USE_DECIMALS = 3;

export function netWeight(gross: number, tare: number): number {
  assertNonNegative(gross, ['gross'], true);
  assertNonNegative(tare, ['tare']);
  if (tare >= gross) throw new DomainError('INVALID_QUANTITY', 'Tare must be below gross', ['tare']);
  return roundTo(gross - tare, WEIGHT_DECIMALS);
}

export interface WeighedLoad {
  /** Net weight of the load, tons. */
  netTons: number;
  /** Volume of the same load, CY (measured in the truck bed, or in place). */
  volumeCy: number;
}

export interface ConversionFactor {
  /** Tons per CY computed to 4 decimals. */
  computed: number;
  /** The factor used for pay: the computed figure to 3 decimals. */
  used: number;
  loads: number;
}

/**
 * Ton-to-volume factor from weighed loads: total net tons / total volume (each load weighs by its size; our
 * choice, recorded in DEVELOPERS.md), computed to 4 decimals, used to 3. Needs MIN_FACTOR_LOADS loads.
 */
export function conversionFactor(loads: readonly WeighedLoad[]): ConversionFactor {
  if (loads.length < MIN_FACTOR_LOADS) {
    throw new DomainError('VALIDATION_FAILED', `A conversion factor needs at least ${MIN_FACTOR_LOADS} weighed loads`, [
      'loads',
    ]);
  }
  let tons = 0;
  let volume = 0;
  loads.forEach((load, i) => {
    assertNonNegative(load.netTons, ['loads', i, 'netTons'], true);
    assertNonNegative(load.volumeCy, ['loads', i, 'volumeCy'], true);
    tons += load.netTons;
    volume += load.volumeCy;
  });
  const computed = roundTo(tons / volume, FACTOR_COMPUTE_DECIMALS);
  return { computed, used: roundTo(computed, FACTOR_USE_DECIMALS), loads: loads.length };
}

/**
 * Moisture correction: above the stated moisture the dry weight is net x 100 / (100 + M), M the moisture in
 * percent of dry weight (Resident Engineer's Manual section 109.12). At or below the stated moisture the net
 * weight is paid as weighed. Result to 0.01.
 */
export function moistureCorrected(
  netTons: number,
  moisturePercent: number | null,
  statedMoisturePercent: number,
): number {
  assertNonNegative(netTons, ['netTons']);
  assertNonNegative(statedMoisturePercent, ['statedMoisturePercent']);
  if (moisturePercent === null || moisturePercent <= statedMoisturePercent) return roundTo(netTons, WEIGHT_DECIMALS);
  assertNonNegative(moisturePercent, ['moisturePercent']);
  return roundTo((netTons * 100) / (100 + moisturePercent), WEIGHT_DECIMALS);
}

/**
 * Rounds a volume from tons to the 0.5 CY bands of the Resident Engineer's Manual section 109.12: .01-.24 down to
 * the whole, .25-.49 up to .5, .51-.74 down to .5, .76-.99 up to the next whole. The manual leaves .50 and .75
 * open; we keep .50 as .5 (it is on the band) and take .75 up to the next whole, so the rule is "nearest 0.5, a
 * tie goes up", the same way the manual treats .25. Works on the 0.01 figure.
 */
export function bandToHalfCy(volumeCy: number): number {
  assertNonNegative(volumeCy, ['volumeCy']);
  const hundredths = Math.round(roundTo(volumeCy, 2) * 100);
  const halves = Math.floor((hundredths + 25) / 50);
  return halves / 2;
}

/** Tons to CY with the factor used to 3 decimals: tons / factor, to 0.01, then banded to 0.5 CY. */
export function tonsToCubicYards(tons: number, factorUsed: number): { computedCy: number; payCy: number } {
  assertNonNegative(tons, ['tons']);
  assertNonNegative(factorUsed, ['factor'], true);
  const computedCy = roundTo(tons / roundTo(factorUsed, FACTOR_USE_DECIMALS), 2);
  return { computedCy, payCy: bandToHalfCy(computedCy) };
}
