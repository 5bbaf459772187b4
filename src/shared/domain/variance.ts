import type { VariationPreset, VarianceStatus } from '../constants';
import { DomainError, assertFinite, assertNonNegative } from './domain-error';
import { fmt, type Trail } from './earthwork/trail';
import { lineAmountCents } from './money';

export interface VarianceBand {
  /** Percent above the contract quantity still within the band (15 for FAR 52.211-18, 25 for 125 %). */
  overPercent: number;
  /** Percent below the contract quantity still within the band. */
  underPercent: number;
}

/**
 * Published bands. FAR 52.211-18: more than 15 % either way, adjustment on the quantity above 115 % or below
 * 85 %. 23 CFR 635.109(a)(3), major items: above 125 % or below 75 %; an increase is adjusted on the portion
 * above 125 %, a decrease on the actual quantity performed. Exactly at the edge is within the band.
 */
export const VARIANCE_BANDS: Record<Exclude<VariationPreset, 'custom'>, VarianceBand & { source: string }> = {
  'far-15': { overPercent: 15, underPercent: 15, source: 'FAR 52.211-18' },
  'major-125-75': { overPercent: 25, underPercent: 25, source: '23 CFR 635.109(a)(3), major items' },
};

export interface VarianceInput {
  contractQuantity: number;
  forecastQuantity: number;
  unitPriceCents: number;
  band: VarianceBand;
  /** Optional: names the clause in the trail and, for 23 CFR, the basis of an under-run adjustment. */
  preset?: VariationPreset;
}

export interface VarianceResult {
  /** (forecast - contract) / contract x 100. */
  variancePercent: number;
  status: VarianceStatus;
  /** Quantity above the upper edge (over) or below the lower edge (under); 0 within the band. */
  quantityBeyondBand: number;
  /** quantityBeyondBand x unit price, rounded once to the cent. */
  amountBeyondBandCents: number;
  band: { lower: number; upper: number };
  /** The quantity a price adjustment is based on, where the clause says so (23 CFR under-run: all of it). */
  adjustmentBasisQuantity: number;
  trail: Trail;
}

/**
 * Compares x against c (1 + p / 100) without binary rounding deciding the edge: 11,500 against 10,000 at 15 %
 * is equal, not above. Returns -1, 0 or 1.
 */
function compareToEdge(x: number, c: number, percent: number): number {
  const lhs = x * 100;
  const rhs = c * (100 + percent);
  if (Math.abs(lhs - rhs) <= 1e-9 * Math.max(1, Math.abs(lhs), Math.abs(rhs))) return 0;
  return lhs > rhs ? 1 : -1;
}

/** Quantity variance of one bid item against its variation band. */
export function quantityVariance(input: VarianceInput): VarianceResult {
  const { contractQuantity: c, forecastQuantity: f, unitPriceCents, band } = input;
  assertNonNegative(c, ['contractQuantity'], true);
  assertNonNegative(f, ['forecastQuantity']);
  assertFinite(unitPriceCents, ['unitPriceCents']);
  if (!Number.isInteger(unitPriceCents))
    throw new DomainError('INVALID_NUMBER', 'Unit price is whole cents', ['unitPriceCents']);
  assertNonNegative(band.overPercent, ['band', 'overPercent']);
  assertNonNegative(band.underPercent, ['band', 'underPercent']);
  if (band.underPercent > 100)
    throw new DomainError('INVALID_NUMBER', 'The under band is at most 100 percent', ['band', 'underPercent']);
  const upper = (c * (100 + band.overPercent)) / 100;
  const lower = (c * (100 - band.underPercent)) / 100;
  const over = compareToEdge(f, c, band.overPercent) > 0;
  const under = compareToEdge(f, c, -band.underPercent) < 0;
  const status: VarianceStatus = over ? 'over' : under ? 'under' : 'within';
  const quantityBeyondBand = over ? f - upper : under ? lower - f : 0;
  const variancePercent = ((f - c) / c) * 100;
  const amountBeyondBandCents = lineAmountCents(quantityBeyondBand, unitPriceCents, ['unitPriceCents']);
  const cfr = input.preset === 'major-125-75';
  const adjustmentBasisQuantity = status === 'under' && cfr ? f : quantityBeyondBand;
  const source = input.preset && input.preset !== 'custom' ? VARIANCE_BANDS[input.preset].source : 'contract band';
  const trail: Trail = [
    `Variance = (forecast - contract) / contract = (${fmt(f, 3)} - ${fmt(c, 3)}) / ${fmt(c, 3)} = ${fmt(variancePercent, 2)} %`,
    `Band (${source}): ${fmt(lower, 3)} to ${fmt(upper, 3)} (-${fmt(band.underPercent, 2)} % / +${fmt(band.overPercent, 2)} %); exactly at an edge is within`,
    status === 'within'
      ? 'Within the band: no quantity beyond it'
      : `${status === 'over' ? 'Over' : 'Under'} the band by ${fmt(quantityBeyondBand, 3)}; x $${fmt(unitPriceCents / 100)} = $${fmt(amountBeyondBandCents / 100)} (rounded once to the cent)`,
  ];
  if (status === 'under' && cfr)
    trail.push(
      '23 CFR 635.109(a)(3): a decrease is adjusted on the actual quantity performed, not only the part below 75 %',
    );
  return {
    variancePercent,
    status,
    quantityBeyondBand,
    amountBeyondBandCents,
    band: { lower, upper },
    adjustmentBasisQuantity,
    trail,
  };
}

/** Major item test: the item's original amount is at least `thresholdPercent` of the original contract amount. */
export function isMajorItem(itemAmountCents: number, contractAmountCents: number, thresholdPercent: number): boolean {
  return contractAmountCents > 0 && itemAmountCents * 100 >= contractAmountCents * thresholdPercent;
}

/**
 * The band one bid item is held to under a project's clause, or null when the clause does not cover it:
 * 23 CFR 635.109(a)(3) applies to major items only; FAR 52.211-18 and a custom band apply to every item.
 */
export function bandForItem(preset: VariationPreset, custom: VarianceBand, isMajor: boolean): VarianceBand | null {
  if (preset === 'custom') return custom;
  if (preset === 'major-125-75' && !isMajor) return null;
  return { overPercent: VARIANCE_BANDS[preset].overPercent, underPercent: VARIANCE_BANDS[preset].underPercent };
}

/** Share of the band at which the watch warns early (our product's setting: 80 %). */
export const EARLY_WARNING_SHARE = 0.8;

/**
 * Early warning: the forecast is still within the band but has passed `share` of it towards either edge
 * (15 % band, 80 %: above 112 % or below 88 % of the contract quantity). Exactly at that point does not warn.
 */
export function isEarlyWarning(
  contractQuantity: number,
  forecastQuantity: number,
  band: VarianceBand,
  share = EARLY_WARNING_SHARE,
): boolean {
  if (!(contractQuantity > 0)) return false;
  const c = contractQuantity;
  const f = forecastQuantity;
  const withinBand = compareToEdge(f, c, band.overPercent) <= 0 && compareToEdge(f, c, -band.underPercent) >= 0;
  return (
    withinBand &&
    (compareToEdge(f, c, band.overPercent * share) > 0 || compareToEdge(f, c, -band.underPercent * share) < 0)
  );
}
