import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { DEFAULT_FEE_RATES, feeQuote, processingFeeCents, type FeeRates } from '../../src/shared/domain/payment-fees';

// Default rates: the processor's published standard US pricing, from memory (2.9 % + 30 cents per card charge;
// ACH Direct Debit 0.8 % capped at $5.00). The worked figures below are by hand.
describe('processingFeeCents', () => {
  it('card: 2.9 % + 30 cents; $100.00 costs $3.20, $13,621.90 costs $395.34', () => {
    expect(processingFeeCents('card', 10_000)).toBe(320);
    // 2.9 % of 1,362,190 = 39,503.51 -> 39,504, + 30.
    expect(processingFeeCents('card', 1_362_190)).toBe(39_534);
  });
  it('ACH: 0.8 % capped at $5.00; $100.00 costs $0.80, $625.00 exactly the cap, $13,621.90 the cap', () => {
    expect(processingFeeCents('us_bank_account', 10_000)).toBe(80);
    expect(processingFeeCents('us_bank_account', 62_500)).toBe(500);
    expect(processingFeeCents('us_bank_account', 1_362_190)).toBe(500);
  });
  it('half a cent rounds away from zero (common practice): 2.9 % of $0.50 = 1.45 -> 1, of $1.50 = 4.35 -> 4', () => {
    expect(processingFeeCents('card', 50)).toBe(31);
    expect(processingFeeCents('card', 150)).toBe(34);
  });
});

describe('feeQuote', () => {
  it('the payee absorbing: charge = amount, net = amount - fee', () => {
    expect(feeQuote(1_362_190, 'card', 'payee')).toEqual({
      method: 'card',
      bearer: 'payee',
      amountCents: 1_362_190,
      feeCents: 39_534,
      chargeCents: 1_362_190,
      netCents: 1_322_656,
    });
  });
  it('the payer bearing: $100.00 by card is charged $103.30 (fee on $103.30 = $2.9957 -> $3.00 + $0.30)', () => {
    expect(feeQuote(10_000, 'card', 'payer')).toMatchObject({ feeCents: 330, chargeCents: 10_330, netCents: 10_000 });
  });
  it('the payer bearing ACH above the cap adds exactly the cap', () => {
    expect(feeQuote(1_362_190, 'us_bank_account', 'payer')).toMatchObject({ feeCents: 500, chargeCents: 1_362_690 });
  });

  const rates = fc.record({
    card: fc.record({ percentBps: fc.integer({ min: 0, max: 2000 }), fixedCents: fc.integer({ min: 0, max: 500 }) }),
    us_bank_account: fc.record({
      percentBps: fc.integer({ min: 0, max: 2000 }),
      capCents: fc.integer({ min: 0, max: 100_000 }),
    }),
  }) as fc.Arbitrary<FeeRates>;

  it('property: when the payer bears it, charge = amount + fee(charge) and no smaller charge nets the amount', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 1e12 }),
        fc.constantFrom('card' as const, 'us_bank_account' as const),
        rates,
        (amount, method, r) => {
          const q = feeQuote(amount, method, 'payer', r);
          expect(q.chargeCents).toBe(amount + q.feeCents);
          expect(processingFeeCents(method, q.chargeCents, r)).toBe(q.feeCents);
          // A smaller charge exists only above zero (a zero amount with zero rates charges nothing).
          if (q.chargeCents > 0) {
            expect(q.chargeCents - 1 - processingFeeCents(method, q.chargeCents - 1, r)).toBeLessThan(amount);
          }
        },
      ),
    );
  });

  it('property: when the payee absorbs it, the charge is the amount and the fee that of the default schedule', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 1e12 }),
        fc.constantFrom('card' as const, 'us_bank_account' as const),
        (amount, method) => {
          const q = feeQuote(amount, method, 'payee', DEFAULT_FEE_RATES);
          expect(q.chargeCents).toBe(amount);
          expect(q.netCents).toBe(amount - processingFeeCents(method, amount));
        },
      ),
    );
  });
});
