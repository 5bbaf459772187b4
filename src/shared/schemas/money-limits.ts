import type { z } from 'zod';

/**
 * Money that cannot overflow. Amounts are integer cents in JavaScript numbers, exact only up to
 * Number.MAX_SAFE_INTEGER (2^53 - 1, about $90 trillion). A project's sums (contract sum, earned to date with
 * overruns, retainage) add up many lines, so one line is held to a share of that: MAX_LINES_SUMMED lines, each up to
 * MAX_OVERRUN times its contract amount, still sum exactly.
 */
export const MAX_LINES_SUMMED = 10_000;
/** Quantities to date may run past the contract quantity; sums stay exact up to this many times the line amount. */
export const MAX_OVERRUN = 10;
/** Largest contract amount of one line (quantity x unit price): about $900 million. */
export const MAX_LINE_AMOUNT_CENTS = Math.floor(Number.MAX_SAFE_INTEGER / (MAX_LINES_SUMMED * MAX_OVERRUN));

const dollars = (cents: number) =>
  `$${(cents / 100).toLocaleString('en-US', { minimumFractionDigits: 2, maximumFractionDigits: 2 })}`;

/** Why this quantity at this unit price is refused, or null when its line amount is within MAX_LINE_AMOUNT_CENTS. */
export function lineAmountProblem(quantity: number, unitPriceCents: number): string | null {
  if (!Number.isFinite(quantity) || !Number.isFinite(unitPriceCents)) return null;
  if (Math.abs(quantity) * Math.abs(unitPriceCents) <= MAX_LINE_AMOUNT_CENTS) return null;
  return `Quantity x unit price would come to more than ${dollars(MAX_LINE_AMOUNT_CENTS)}, the largest line amount; split the item`;
}

/**
 * A zod check for an object with a quantity and a unit price: their product stays within MAX_LINE_AMOUNT_CENTS.
 * The issue names the quantity field (the price alone is bounded by its own field limit).
 */
export function lineAmountWithinLimit<T>(
  quantity: (v: T) => number | undefined,
  unitPriceCents: (v: T) => number | undefined,
  path: string,
) {
  return (v: T, ctx: z.RefinementCtx) => {
    const q = quantity(v);
    const p = unitPriceCents(v);
    if (q === undefined || p === undefined) return;
    const problem = lineAmountProblem(q, p);
    if (problem) ctx.addIssue({ code: 'custom', path: [path], message: problem });
  };
}
