import { add, dinero, halfAwayFromZero, multiply, subtract, toSnapshot, transformScale, type Dinero } from 'dinero.js';
import {
  USD as USD_BIG,
  dinero as dineroBig,
  halfAwayFromZero as halfAwayFromZeroBig,
  multiply as multiplyBig,
  toSnapshot as toSnapshotBig,
  transformScale as transformScaleBig,
} from 'dinero.js/bigint';
import { USD } from 'dinero.js/currencies';
import { decimalOf } from './decimal';
import { DomainError, type FieldPath } from './domain-error';

/** Money is integer cents (USD, scale 2) everywhere; dinero.js does the arithmetic. */
export type Cents = number;

export function usd(cents: Cents): Dinero<number> {
  if (!Number.isSafeInteger(cents)) throw new RangeError(`Money must be whole cents, got ${cents}`);
  return dinero({ amount: cents, currency: USD });
}

/** Integer cents of a dinero value at scale 2 (rounding half away from zero if it carries more decimals). */
export function toCents(value: Dinero<number>): Cents {
  return toSnapshot(transformScale(value, 2, halfAwayFromZero)).amount;
}

/**
 * A decimal quantity as an exact scaled integer, e.g. 12.345 -> { amount: 12345, scale: 3 }: the decimal the
 * number stands for (its shortest text), so 0.1 stays 1 / 10 and 1.00005 stays 100005 / 10^5 (never rounded to
 * 4 places first). Throws RangeError when the digits are beyond a safe integer (use the bigint path).
 */
export function toScaled(quantity: number): { amount: number; scale: number } {
  const { digits, scale } = decimalOf(quantity);
  const amount = Number(digits);
  if (!Number.isSafeInteger(amount)) throw new RangeError(`Quantity ${quantity} has more digits than a safe integer`);
  return { amount, scale };
}

/** Cents from an exact bigint, or INVALID_NUMBER naming `path` when beyond what the ledger stores. */
function safeCents(amount: bigint, path: FieldPath, what: string): Cents {
  const cents = Number(amount);
  if (!Number.isSafeInteger(cents)) {
    throw new DomainError(
      'INVALID_NUMBER',
      `${what} comes to ${amount} cents, beyond the largest amount stored (${Number.MAX_SAFE_INTEGER} cents)`,
      path,
    );
  }
  return cents;
}

/** cents x (digits / 10^scale), rounded once to the cent (half away from zero), exactly (dinero.js, bigint). */
function scaleCents(cents: Cents, factor: { digits: bigint; scale: number }, path: FieldPath, what: string): Cents {
  const product = multiplyBig(dineroBig({ amount: BigInt(cents), currency: USD_BIG }), {
    amount: factor.digits,
    scale: BigInt(factor.scale),
  });
  return safeCents(toSnapshotBig(transformScaleBig(product, 2n, halfAwayFromZeroBig)).amount, path, what);
}

/**
 * Amount of one line: quantity x unit price, rounded to the cent once (half away from zero, common practice
 * for pay estimates). The quantity is priced exactly as given (no rounding before pricing). An amount beyond
 * a safe integer of cents is refused as INVALID_NUMBER naming `path` (a 400, not a RangeError).
 */
export function lineAmountCents(quantity: number, unitPriceCents: Cents, path: FieldPath = []): Cents {
  if (!Number.isSafeInteger(unitPriceCents))
    throw new DomainError('INVALID_NUMBER', `Unit price must be whole cents, got ${unitPriceCents}`, path);
  if (!Number.isFinite(quantity))
    throw new DomainError('INVALID_NUMBER', `Quantity must be finite, got ${quantity}`, path);
  return scaleCents(unitPriceCents, decimalOf(quantity), path, 'Quantity x unit price');
}

/** Sum of integer-cent amounts through dinero.js. */
export function sumCents(amounts: readonly Cents[]): Cents {
  return toCents(amounts.reduce((total, cents) => add(total, usd(cents)), usd(0)));
}

// --- Quantity engine helpers (issue 3): percentages and interest on integer cents, rounded once. ---

/** `percent` % of an amount, rounded once to the cent (half away from zero): retainage on a line. */
export function percentOfCents(amountCents: Cents, percent: number, path: FieldPath = []): Cents {
  const { digits, scale } = decimalOf(percent);
  return scaleCents(amountCents, { digits, scale: scale + 2 }, path, `${percent} % of the amount`);
}

/** a - b through dinero.js. */
export function subtractCents(a: Cents, b: Cents): Cents {
  return toCents(subtract(usd(a), usd(b)));
}

/**
 * Simple interest on a late payment, FAR 52.232-27 style: amount x annual rate x days / 360, rounded once to the
 * cent ($100,000 ten days late at 4.875 % gives $135.42).
 */
export function lateInterestCents(amountCents: Cents, annualRatePercent: number, daysLate: number): Cents {
  const rate = toScaled(annualRatePercent);
  const perYear = multiply(usd(amountCents), { amount: rate.amount * daysLate, scale: rate.scale + 2 });
  // Divide by 360 exactly: multiply by 1/360 is not a finite decimal, so scale up, then divide the integer.
  const snap = toSnapshot(perYear);
  const exact = snap.amount / 360 / 10 ** (snap.scale - 2);
  return roundHalfAwayFromZero(exact);
}

function roundHalfAwayFromZero(value: number): number {
  const r = Math.round(Math.abs(value) + 1e-9);
  return value < 0 ? -r : r;
}
