import { DEFAULT_SUBSTANTIAL_ERROR_CENTS, DEFAULT_SUBSTANTIAL_ERROR_PERCENT } from '../../constants';
import { DomainError, assertNonNegative } from '../domain-error';
import { lineAmountCents, percentOfCents, type Cents } from '../money';
import { roundTo } from '../rounding';

export interface SubstantialErrorTest {
  /** Percent of the item's contract amount (FDOT 9-3.2.1: 5 %). */
  percent: number;
  /** A set amount of money, cents (FDOT 9-3.2.1: $5,000). */
  amountCents: Cents;
}

export const DEFAULT_SUBSTANTIAL_ERROR_TEST: SubstantialErrorTest = {
  percent: DEFAULT_SUBSTANTIAL_ERROR_PERCENT,
  amountCents: DEFAULT_SUBSTANTIAL_ERROR_CENTS,
};

export interface SubstantialErrorResult {
  substantial: boolean;
  /** The smaller of the two limits, cents. */
  limitCents: Cents;
  /** Value of the difference (|found - plan| x unit price), cents. */
  differenceCents: Cents;
}

/**
 * A plan (contract) quantity is revised only for a substantial error: a difference worth more than the smaller
 * of `percent` % of the item's amount and the set amount (FDOT standard specifications 9-3.2.1). The revision
 * then goes through a change order.
 */
export function substantialError(
  planQuantity: number,
  foundQuantity: number,
  unitPriceCents: Cents,
  test: SubstantialErrorTest = DEFAULT_SUBSTANTIAL_ERROR_TEST,
): SubstantialErrorResult {
  assertNonNegative(planQuantity, ['planQuantity']);
  assertNonNegative(foundQuantity, ['foundQuantity']);
  assertNonNegative(test.percent, ['percent']);
  assertNonNegative(test.amountCents, ['amountCents']);
  const itemCents = lineAmountCents(planQuantity, unitPriceCents);
  const limitCents = Math.min(percentOfCents(itemCents, test.percent), test.amountCents);
  const differenceCents = lineAmountCents(roundTo(Math.abs(foundQuantity - planQuantity), 4), unitPriceCents);
  return { substantial: differenceCents > limitCents, limitCents, differenceCents };
}

/** Plan quantity earned at a percent complete: plan x percent / 100, to the measured decimals. */
export function planQuantityEarned(planQuantity: number, percentComplete: number, decimals: number): number {
  assertNonNegative(planQuantity, ['planQuantity']);
  assertNonNegative(percentComplete, ['percentComplete']);
  if (percentComplete > 100) {
    throw new DomainError('INVALID_QUANTITY', 'Percent complete cannot exceed 100', ['percentComplete']);
  }
  return roundTo((planQuantity * percentComplete) / 100, decimals);
}
