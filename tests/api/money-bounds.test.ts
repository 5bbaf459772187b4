import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MAX_CONTRACT_QUANTITY, MAX_UNIT_PRICE_CENTS } from '../../src/shared/schemas/bid-item';
import { MAX_LINE_AMOUNT_CENTS, MAX_LINES_SUMMED, MAX_OVERRUN } from '../../src/shared/schemas/money-limits';
import { makeWorld, sampleBidItem } from '../setup/factories';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

// Money that cannot overflow: every quantity and unit price the schemas accept gives an amount that is an exact
// integer of cents (ECMA-262 section 6.1.6.1: integers are exact up to Number.MAX_SAFE_INTEGER = 2^53 - 1), and
// whatever they refuse is a 400 naming the field, never a 500. Expected amounts are computed here with BigInt from
// the decimal text of the quantity, rounded half away from zero once (common practice for pay estimates).

let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
let gc: Awaited<ReturnType<typeof signedInAgent>>;
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
  gc = await signedInAgent(t.app, w.people.general_contractor.email);
});
afterAll(() => t.close());

/** quantity x price in cents, exactly: the quantity as its shortest decimal text (at most 4 decimals here). */
function exactAmount(quantity: number, priceCents: number): bigint {
  const [whole, frac = ''] = String(quantity).split('.');
  const scale = 10n ** BigInt(frac.length);
  const product = BigInt(`${whole}${frac}`) * BigInt(priceCents);
  const q = product / scale;
  return (product % scale) * 2n >= scale ? q + 1n : q;
}

let n = 0;
const create = (contractQuantity: number, unitPriceCents: number) =>
  gc
    .post(`/api/projects/${w.home.id}/bid-items`)
    .send(sampleBidItem({ itemNumber: `M-${++n}`, contractQuantity, unitPriceCents }));

describe('quantities and prices are bounded so every amount is an exact integer of cents', () => {
  it('derives the line limit from Number.MAX_SAFE_INTEGER: the most lines summed, each overrun the most, stay exact', () => {
    expect(MAX_LINE_AMOUNT_CENTS * MAX_LINES_SUMMED * MAX_OVERRUN).toBeLessThanOrEqual(Number.MAX_SAFE_INTEGER);
    expect(Number.isSafeInteger(MAX_LINE_AMOUNT_CENTS * MAX_LINES_SUMMED * MAX_OVERRUN)).toBe(true);
  });

  it('refuses 1e9 x $10,000,000.00 (it used to end in a 500) with 400 naming the quantity', async () => {
    const res = await create(MAX_CONTRACT_QUANTITY, MAX_UNIT_PRICE_CENTS);
    expect(res.status).toBe(400);
    expect(res.body.error.details).toEqual([
      { path: 'contractQuantity', message: expect.stringContaining('largest line amount') },
    ]);
  });

  it('over the whole range of both fields: 201 with the exact amount, or 400 naming the field; never a 500 (fast-check)', async () => {
    const quantity = fc.oneof(
      fc.integer({ min: 0, max: MAX_CONTRACT_QUANTITY * 10_000 }).map((q) => q / 10_000),
      fc.constantFrom(0, 1, 0.0001, 999_999.9999, MAX_CONTRACT_QUANTITY, MAX_LINE_AMOUNT_CENTS / MAX_UNIT_PRICE_CENTS),
    );
    const price = fc.oneof(
      fc.integer({ min: 0, max: MAX_UNIT_PRICE_CENTS }),
      fc.constantFrom(0, 1, 99, MAX_UNIT_PRICE_CENTS),
    );
    await fc.assert(
      fc.asyncProperty(quantity, price, async (q, p) => {
        const res = await create(q, p);
        expect([201, 400], JSON.stringify(res.body)).toContain(res.status);
        if (res.status === 400) {
          expect(res.body.error.details[0].path).toBe('contractQuantity');
          expect(q * p).toBeGreaterThan(MAX_LINE_AMOUNT_CENTS);
          return;
        }
        const item = res.body.bidItem ?? res.body;
        // Quantities are stored to 4 decimals (numeric(16,4)); the amount is priced from the stored quantity.
        expect(item.contractQuantity).toBeCloseTo(q, 4);
        expect(Number.isSafeInteger(item.contractAmountCents)).toBe(true);
        expect(BigInt(item.contractAmountCents)).toBe(exactAmount(item.contractQuantity, p));
      }),
      { numRuns: 60, seed: 16 },
    );
    const list = await gc.get(`/api/projects/${w.home.id}/bid-items`);
    expect(list.status).toBe(200);
  });

  it('refuses an edit that would take a line past the limit, naming the field edited', async () => {
    const made = await create(1, MAX_UNIT_PRICE_CENTS);
    expect(made.status).toBe(201);
    const id = made.body.bidItem?.id ?? made.body.id;
    const res = await gc.patch(`/api/bid-items/${id}`).send({ contractQuantity: MAX_CONTRACT_QUANTITY });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].path).toBe('contractQuantity');
  });
});
