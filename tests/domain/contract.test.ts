import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { currentContract, type ContractChangeInput, type ContractItemInput } from '../../src/shared/domain/contract';
import { lineAmountCents, sumCents } from '../../src/shared/domain/money';
import { payApplication, type PayAppResult } from '../../src/shared/domain/pay-app';
import { addDecimals } from '../../src/shared/domain/rounding';

// Contract quantity = original + approved changes, in the order approved; the last approved unit price holds
// (common practice for unit-price contracts; product brief, "Objects: change order").
describe('currentContract: worked example (hand-checked)', () => {
  const items: ContractItemInput[] = [
    { id: 'a', originalQuantity: 3200, originalUnitPriceCents: 975 },
    { id: 'b', originalQuantity: 1, originalUnitPriceCents: 4_250_000 },
    { id: 'c', originalQuantity: 0, originalUnitPriceCents: 185_000 },
  ];
  it('adds approved quantity changes, takes the last price, and sums original, change and current', () => {
    const changes: ContractChangeInput[] = [
      { changeOrderNumber: 1, kind: 'change_quantity', bidItemId: 'a', quantityDelta: 1600 },
      { changeOrderNumber: 2, kind: 'change_price', bidItemId: 'a', newUnitPriceCents: 1010 },
      { changeOrderNumber: 2, kind: 'change_quantity', bidItemId: 'c', quantityDelta: 9 },
      { changeOrderNumber: 3, kind: 'change_quantity', bidItemId: 'a', quantityDelta: -0.5 },
    ];
    const r = currentContract(items, changes);
    expect(r.items[0]).toMatchObject({
      originalQuantity: 3200,
      contractQuantity: 4799.5,
      unitPriceCents: 1010,
      changeOrderNumbers: [1, 2, 3],
    });
    // 3,200 x $9.75 = $31,200.00 original; 4,799.5 x $10.10 = $48,474.95 current
    expect(r.items[0]!.originalAmountCents).toBe(3_120_000);
    expect(r.items[0]!.contractAmountCents).toBe(4_847_495);
    // 9 DAY x $1,850.00 = $16,650.00 added
    expect(r.items[2]).toMatchObject({
      originalAmountCents: 0,
      contractAmountCents: 1_665_000,
      changeOrderNumbers: [2],
    });
    expect(r.originalContractSumCents).toBe(3_120_000 + 4_250_000);
    expect(r.contractSumCents).toBe(4_847_495 + 4_250_000 + 1_665_000);
    expect(r.approvedChangesCents).toBe(r.contractSumCents - r.originalContractSumCents);
  });
  it('ignores changes to items it does not know', () => {
    const r = currentContract(items, [
      { changeOrderNumber: 1, kind: 'change_price', bidItemId: 'zz', newUnitPriceCents: 1 },
    ]);
    expect(r.contractSumCents).toBe(r.originalContractSumCents);
  });
});

describe('a price change applies to quantities paid after it (pay-app.ts)', () => {
  it('keeps the previous amount as certified and prices this period at the new price', () => {
    // 400 CY certified at $7.25 = $2,900.00; price now $8.00; 100 CY more = $800.00; to date $3,700.00.
    const r = payApplication({
      retainagePercent: 10,
      previousCertifiedCents: 261_000,
      lines: [
        {
          unitPriceCents: 800,
          contractQuantity: 1600,
          previousQuantity: 400,
          thisPeriodQuantity: 100,
          previousAmountCents: 290_000,
        },
      ],
    });
    expect(r.lines[0]).toMatchObject({
      previousAmountCents: 290_000,
      thisPeriodAmountCents: 80_000,
      amountToDateCents: 370_000,
      retainageCents: 37_000,
    });
  });
  it('takes a correction back at the average price it was paid at', () => {
    // 400 CY paid $2,900.00 ($7.25 each); price now $8.00; -100 CY takes back $725.00.
    const r = payApplication({
      retainagePercent: 0,
      previousCertifiedCents: 290_000,
      lines: [
        {
          unitPriceCents: 800,
          contractQuantity: 1600,
          previousQuantity: 400,
          thisPeriodQuantity: -100,
          previousAmountCents: 290_000,
        },
      ],
    });
    expect(r.lines[0]).toMatchObject({ amountToDateCents: 217_500, thisPeriodAmountCents: -72_500 });
  });
});

// Property: random change orders (quantity and price, approved or rejected) and pay periods.
const ITEMS = 3;
const changeArb = fc.record({
  item: fc.nat(ITEMS - 1),
  kind: fc.constantFrom('change_quantity' as const, 'change_price' as const),
  delta: fc.integer({ min: -500, max: 2000 }).map((n) => n / 4),
  price: fc.integer({ min: 1, max: 500_000 }),
  approved: fc.boolean(),
});
const periodArb = fc.array(
  fc.integer({ min: 0, max: 4000 }).map((n) => n / 8),
  { minLength: ITEMS, maxLength: ITEMS },
);
const stepArb = fc.oneof(
  fc.record({ co: fc.array(changeArb, { minLength: 1, maxLength: 3 }) }),
  fc.record({ period: periodArb }),
);

describe('contract and pay applications: property (fast-check)', () => {
  it('current = original + approved changes; totals equal their lines; certified figures never change', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.record({
            quantity: fc.integer({ min: 0, max: 40_000 }).map((n) => n / 4),
            price: fc.integer({ min: 1, max: 500_000 }),
          }),
          { minLength: ITEMS, maxLength: ITEMS },
        ),
        fc.array(stepArb, { maxLength: 12 }),
        fc.integer({ min: 0, max: 10 }),
        (originals, steps, retainage) => {
          const items = originals.map((o, i) => ({
            id: `i${i}`,
            originalQuantity: o.quantity,
            originalUnitPriceCents: o.price,
          }));
          const approved: ContractChangeInput[] = [];
          const certified: { result: PayAppResult; frozen: string }[] = [];
          let number = 0;
          for (const step of steps) {
            if ('co' in step) {
              number += 1;
              const proposed = step.co.map((c): ContractChangeInput =>
                c.kind === 'change_quantity'
                  ? { changeOrderNumber: number, kind: c.kind, bidItemId: `i${c.item}`, quantityDelta: c.delta }
                  : { changeOrderNumber: number, kind: c.kind, bidItemId: `i${c.item}`, newUnitPriceCents: c.price },
              );
              // Like the server's check: a change order that would take a quantity below zero is refused.
              const after = currentContract(items, [...approved, ...proposed]);
              if (step.co[0]!.approved && after.items.every((i) => i.contractQuantity >= 0)) approved.push(...proposed);
            } else {
              const contract = currentContract(items, approved);
              const last = certified.at(-1)?.result;
              const result = payApplication({
                retainagePercent: retainage,
                previousCertifiedCents: sumCents(certified.map((c) => c.result.currentDueCents)),
                lines: contract.items.map((c, i) => ({
                  unitPriceCents: c.unitPriceCents,
                  contractQuantity: c.contractQuantity,
                  previousQuantity: last?.lines[i]!.toDateQuantity ?? 0,
                  thisPeriodQuantity: step.period[i]!,
                  previousAmountCents: last?.lines[i]!.amountToDateCents,
                })),
              });
              // Totals are the sums of their lines.
              expect(result.earnedToDateCents).toBe(sumCents(result.lines.map((l) => l.amountToDateCents)));
              expect(result.thisPeriodCents).toBe(sumCents(result.lines.map((l) => l.thisPeriodAmountCents)));
              expect(result.retainageCents).toBe(sumCents(result.lines.map((l) => l.retainageCents)));
              expect(result.contractAmountCents).toBe(contract.contractSumCents);
              // The previous column is the last certified application's, untouched by later change orders.
              result.lines.forEach((l, i) => {
                expect(l.previousAmountCents).toBe(last?.lines[i]!.amountToDateCents ?? 0);
                expect(l.amountToDateCents).toBe(l.previousAmountCents + l.thisPeriodAmountCents);
              });
              certified.push({ result, frozen: JSON.stringify(result) });
            }
          }
          // current = original + approved changes, in order; the price is the last approved one.
          const contract = currentContract(items, approved);
          contract.items.forEach((c, i) => {
            const mine = approved.filter((a) => a.bidItemId === `i${i}`);
            const deltas = mine.flatMap((a) => (a.kind === 'change_quantity' ? [a.quantityDelta] : []));
            const prices = mine.flatMap((a) => (a.kind === 'change_price' ? [a.newUnitPriceCents] : []));
            expect(c.contractQuantity).toBe(deltas.reduce((s, d) => addDecimals(s, d), originals[i]!.quantity));
            expect(c.unitPriceCents).toBe(prices.at(-1) ?? originals[i]!.price);
            expect(c.contractAmountCents).toBe(lineAmountCents(c.contractQuantity, c.unitPriceCents));
          });
          expect(contract.contractSumCents).toBe(sumCents(contract.items.map((c) => c.contractAmountCents)));
          expect(contract.approvedChangesCents).toBe(contract.contractSumCents - contract.originalContractSumCents);
          // A certified application's figures never change afterwards.
          for (const c of certified) expect(JSON.stringify(c.result)).toBe(c.frozen);
          // Paid amounts telescope: the latest amount to date is the sum of every period's amount.
          const lastResult = certified.at(-1)?.result;
          if (lastResult)
            expect(lastResult.earnedToDateCents).toBe(sumCents(certified.map((c) => c.result.thisPeriodCents)));
        },
      ),
      { numRuns: 300 },
    );
  });
});
