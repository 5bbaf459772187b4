import type { FeeBearer, PaymentMethod } from '../constants';
import { DomainError } from './domain-error';
import { percentOfCents, subtractCents, sumCents, type Cents } from './money';

/** The processor's fee per method: cards a percentage plus a fixed amount per charge; bank debits a capped percentage. */
export type FeeRates = {
  card: { percentBps: number; fixedCents: Cents };
  us_bank_account: { percentBps: number; capCents: Cents };
};

/**
 * Default rates, the one place they are written: the payment processor's (Stripe's) published standard US
 * pricing, from memory: 2.9 % + 30 cents per successful domestic card charge, and ACH Direct Debit at 0.8 %
 * capped at $5.00. They are configuration (the server reads `PAYMENT_FEE_RATES`), not a promise of what a
 * negotiated account pays; the local Stripe stand-in charges these same defaults.
 */
export const DEFAULT_FEE_RATES: FeeRates = {
  card: { percentBps: 290, fixedCents: 30 },
  us_bank_account: { percentBps: 80, capCents: 500 },
};

/** Rates the schedule accepts: whole basis points below 100 %, whole non-negative cents. */
export function checkFeeRates(rates: FeeRates): FeeRates {
  const bps = [rates.card.percentBps, rates.us_bank_account.percentBps];
  const cents = [rates.card.fixedCents, rates.us_bank_account.capCents];
  if (
    !bps.every((b) => Number.isInteger(b) && b >= 0 && b < 10_000) ||
    !cents.every((c) => Number.isSafeInteger(c) && c >= 0)
  )
    throw new DomainError('INVALID_NUMBER', 'Fee rates are whole basis points below 10,000 and whole cents', [
      'feeRates',
    ]);
  return rates;
}

/**
 * The processor's fee on one charge of `chargeCents`, in cents: the percentage rounded once to the cent (half
 * away from zero), plus the fixed amount for a card, or capped for a bank debit.
 */
export function processingFeeCents(
  method: PaymentMethod,
  chargeCents: Cents,
  rates: FeeRates = DEFAULT_FEE_RATES,
): Cents {
  if (!Number.isSafeInteger(chargeCents) || chargeCents < 0)
    throw new DomainError('INVALID_NUMBER', 'A charge is whole cents, zero or more', ['amountCents']);
  if (method === 'card') {
    const r = rates.card;
    return sumCents([percentOfCents(chargeCents, r.percentBps / 100), r.fixedCents]);
  }
  const r = rates.us_bank_account;
  return Math.min(r.capCents, percentOfCents(chargeCents, r.percentBps / 100));
}

export type FeeQuote = {
  method: PaymentMethod;
  bearer: FeeBearer;
  /** Applied to the pay application. */
  amountCents: Cents;
  /** The processor's fee on the charge. */
  feeCents: Cents;
  /** What the payer is charged: amount + fee when the payer bears it, else the amount. */
  chargeCents: Cents;
  /** What reaches the payee after the processor's fee. */
  netCents: Cents;
};

/**
 * What a payment of `amountCents` costs and who bears it. The payee absorbing: the charge is the amount and the
 * payee nets amount - fee. The payer bearing: the charge is the smallest total T with T - fee(T) >= amount; for
 * that T, fee(T) = T - amount exactly (fee is non-decreasing and rises at most a cent per cent), so the charge
 * is amount + fee and the payee nets the whole amount.
 */
export function feeQuote(
  amountCents: Cents,
  method: PaymentMethod,
  bearer: FeeBearer,
  rates: FeeRates = DEFAULT_FEE_RATES,
): FeeQuote {
  if (bearer === 'payee') {
    const feeCents = processingFeeCents(method, amountCents, rates);
    return {
      method,
      bearer,
      amountCents,
      feeCents,
      chargeCents: amountCents,
      netCents: subtractCents(amountCents, feeCents),
    };
  }
  // T(k+1) = amount + fee(T(k)) from T(0) = amount rises to the least fixed point (fee is monotone, rate < 100 %).
  let charge = amountCents;
  for (let i = 0; i < 200; i++) {
    const next = sumCents([amountCents, processingFeeCents(method, charge, rates)]);
    if (next === charge)
      return {
        method,
        bearer,
        amountCents,
        feeCents: subtractCents(charge, amountCents),
        chargeCents: charge,
        netCents: amountCents,
      };
    charge = next;
  }
  throw new DomainError('INVALID_NUMBER', 'The fee did not settle; check the fee rates', ['feeRates']);
}
