import { add, dinero, halfAwayFromZero, multiply, subtract, toSnapshot, transformScale, type Dinero } from 'dinero.js';
import { USD } from 'dinero.js/currencies';

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
 * A decimal quantity as an exact scaled integer, e.g. 12.345 -> { amount: 12345, scale: 3 }. Quantities are
 * stored with at most 4 decimals; the decimal text of the number is used so 0.1 stays 1 / 10.
 */
export function toScaled(quantity: number): { amount: number; scale: number } {
  if (!Number.isFinite(quantity)) throw new RangeError(`Quantity must be finite, got ${quantity}`);
  const text = quantity.toFixed(4).replace(/0+$/, '').replace(/\.$/, '');
  const [whole = '0', fraction = ''] = text.split('.');
  const sign = whole.startsWith('-') ? -1 : 1;
  const amount = Number(whole.replace('-', '') + fraction) * sign;
  return { amount, scale: fraction.length };
}

/**
 * Amount of one line: quantity x unit price, rounded to the cent once (half away from zero, common practice
 * for pay estimates).
 */
export function lineAmountCents(quantity: number, unitPriceCents: Cents): Cents {
  return toCents(multiply(usd(unitPriceCents), toScaled(quantity)));
}

/** Sum of integer-cent amounts through dinero.js. */
export function sumCents(amounts: readonly Cents[]): Cents {
  return toCents(amounts.reduce((total, cents) => add(total, usd(cents)), usd(0)));
}

// --- Quantity engine helpers (issue 3): percentages and interest on integer cents, rounded once. ---

/** `percent` % of an amount, rounded once to the cent (half away from zero): retainage on a line. */
export function percentOfCents(amountCents: Cents, percent: number): Cents {
  const { amount, scale } = toScaled(percent);
  return toCents(multiply(usd(amountCents), { amount, scale: scale + 2 }));
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
