import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { changeOrderSummary, type ApprovedChangeOrderInput } from '../../src/shared/domain/change-order-summary';
import { currentContract, type ContractChangeInput, type ContractItemInput } from '../../src/shared/domain/contract';

// A pay application's change order summary (issue 11, item 3): approved change orders to date with their net
// amount and the part approved since the previous application. Amounts are contract sum steps of currentContract,
// so the lines add up to current - original (reporting change orders to date on each application is common practice; figures below
// are worked by hand).
const items: ContractItemInput[] = [
  { id: 'a', originalQuantity: 3200, originalUnitPriceCents: 975 },
  { id: 'c', originalQuantity: 0, originalUnitPriceCents: 185_000 },
];
const cos: ApprovedChangeOrderInput[] = [
  {
    number: 1,
    title: 'North pad grows',
    approvedAt: '2026-09-10T15:00:00.000Z',
    changes: [{ changeOrderNumber: 1, kind: 'change_quantity', bidItemId: 'a', quantityDelta: 1600 }],
  },
  {
    number: 2,
    title: 'Price and culverts',
    approvedAt: '2026-10-20T15:00:00.000Z',
    changes: [
      { changeOrderNumber: 2, kind: 'change_price', bidItemId: 'a', newUnitPriceCents: 1010 },
      { changeOrderNumber: 2, kind: 'change_quantity', bidItemId: 'c', quantityDelta: 2 },
    ],
  },
  {
    number: 3,
    title: 'Less trimming',
    approvedAt: '2026-11-05T15:00:00.000Z',
    changes: [{ changeOrderNumber: 3, kind: 'change_quantity', bidItemId: 'a', quantityDelta: -100 }],
  },
];

describe('changeOrderSummary: worked example (hand-checked)', () => {
  it('prices each change order as the step it gave the contract sum, in the order approved', () => {
    const s = changeOrderSummary(items, cos, null, null);
    // Original: 3,200 x $9.75 = $31,200.00.
    // CO 1: 4,800 x $9.75 = $46,800.00, step +$15,600.00.
    // CO 2: 4,800 x $10.10 = $48,480.00 plus 2 x $1,850.00 = $3,700.00 -> $52,180.00, step +$5,380.00.
    // CO 3: 4,700 x $10.10 = $47,470.00 + $3,700.00 = $51,170.00, step -$1,010.00.
    expect(s.lines.map((l) => [l.number, l.amountCents])).toEqual([
      [1, 1_560_000],
      [2, 538_000],
      [3, -101_000],
    ]);
    expect(s).toMatchObject({ approvedCount: 3, netChangeCents: 1_997_000, sinceLastCents: 1_997_000 });
  });

  it('keeps a certified cut-off: later approvals do not count; "since last" starts after the previous cut-off', () => {
    const s = changeOrderSummary(items, cos, '2026-10-31T23:00:00.000Z', '2026-09-30T23:00:00.000Z');
    expect(s.lines.map((l) => l.number)).toEqual([1, 2]);
    expect(s).toMatchObject({ approvedCount: 2, netChangeCents: 2_098_000, sinceLastCents: 538_000 });
  });

  it('is empty before any approval', () => {
    expect(changeOrderSummary(items, cos, '2026-01-01T00:00:00.000Z', null)).toEqual({
      approvedCount: 0,
      netChangeCents: 0,
      sinceLastCents: 0,
      lines: [],
    });
  });
});

describe('changeOrderSummary: properties', () => {
  const ITEMS = 3;
  const base: ContractItemInput[] = Array.from({ length: ITEMS }, (_, i) => ({
    id: `i${i}`,
    originalQuantity: 100 * (i + 1),
    originalUnitPriceCents: 1234 + i,
  }));
  const change = (n: number) =>
    fc.oneof(
      fc
        .record({ item: fc.nat(ITEMS - 1), delta: fc.integer({ min: -50, max: 400 }).map((d) => d / 4) })
        .map(({ item, delta }): ContractChangeInput => ({
          changeOrderNumber: n,
          kind: 'change_quantity',
          bidItemId: `i${item}`,
          quantityDelta: delta,
        })),
      fc
        .record({ item: fc.nat(ITEMS - 1), price: fc.integer({ min: 1, max: 90_000 }) })
        .map(({ item, price }): ContractChangeInput => ({
          changeOrderNumber: n,
          kind: 'change_price',
          bidItemId: `i${item}`,
          newUnitPriceCents: price,
        })),
    );
  const orders = fc
    .array(fc.array(fc.nat(4), { minLength: 1, maxLength: 3 }), { maxLength: 8 })
    .chain((shape) =>
      fc.tuple(...shape.map((c, i) => fc.array(change(i + 1), { minLength: c.length, maxLength: c.length }))),
    )
    .map((changesPerOrder) =>
      changesPerOrder.map((changes, i): ApprovedChangeOrderInput => ({
        number: i + 1,
        title: `CO ${i + 1}`,
        approvedAt: new Date(Date.UTC(2026, 0, 1 + i * 7)).toISOString(),
        changes,
      })),
    );

  it('lines sum to the net change, which is the contract of record at the cut-off minus the original', () => {
    fc.assert(
      fc.property(orders, fc.nat(70), (list, days) => {
        const asOf = new Date(Date.UTC(2026, 0, 1 + days)).toISOString();
        const s = changeOrderSummary(base, list, asOf, null);
        const upTo = list.filter((co) => co.approvedAt <= asOf).flatMap((co) => co.changes);
        expect(s.netChangeCents).toBe(currentContract(base, upTo).approvedChangesCents);
        expect(s.lines.reduce((sum, l) => sum + l.amountCents, 0)).toBe(s.netChangeCents);
      }),
    );
  });

  it('a certified cut-off never moves when more change orders are approved after it', () => {
    fc.assert(
      fc.property(orders, orders, fc.nat(70), (list, later, days) => {
        const asOf = new Date(Date.UTC(2026, 0, 1 + days)).toISOString();
        const before = changeOrderSummary(base, list, asOf, null);
        const afterwards = later.map((co, i) => ({
          ...co,
          number: list.length + i + 1,
          approvedAt: new Date(Date.UTC(2026, 3, 1 + i)).toISOString(),
        }));
        expect(changeOrderSummary(base, [...list, ...afterwards], asOf, null)).toEqual(before);
      }),
    );
  });
});
