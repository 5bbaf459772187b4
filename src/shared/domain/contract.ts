import { lineAmountCents, subtractCents, sumCents, type Cents } from './money';
import { addDecimals } from './rounding';

/** A bid item as set up in the contract (its original quantity and price, in its pay unit). */
export interface ContractItemInput {
  id: string;
  /** The quantity on the original bid schedule; 0 for an item a change order added. */
  originalQuantity: number;
  /** The unit price on the original bid schedule; for an added item, the price the change order gave it. */
  originalUnitPriceCents: Cents;
}

/** One change of an approved change order. Add-item changes arrive as `change_quantity` of an item from 0. */
export type ContractChangeInput =
  | { changeOrderNumber: number; kind: 'change_quantity'; bidItemId: string; quantityDelta: number }
  | { changeOrderNumber: number; kind: 'change_price'; bidItemId: string; newUnitPriceCents: Cents };

export interface ContractItemResult {
  bidItemId: string;
  originalQuantity: number;
  originalUnitPriceCents: Cents;
  /** Sum of approved quantity changes, in the pay unit. */
  approvedChangeQuantity: number;
  /** Current contract quantity = original + approved changes. */
  contractQuantity: number;
  /** Current unit price: the original, or the last approved price change. */
  unitPriceCents: Cents;
  /** Approved change orders that touched the item, ascending and once each. */
  changeOrderNumbers: number[];
  /** Original quantity x original price, rounded once. */
  originalAmountCents: Cents;
  /** Current quantity x current price, rounded once. */
  contractAmountCents: Cents;
}

export interface ContractResult {
  items: ContractItemResult[];
  /** Sum of the items' original amounts. */
  originalContractSumCents: Cents;
  /** Current contract sum - original contract sum. */
  approvedChangesCents: Cents;
  /** Sum of the items' current amounts. */
  contractSumCents: Cents;
}

/**
 * The contract as it stands: each item's current quantity and unit price from its original plus the changes of
 * approved change orders applied in the order given (the order of approval), and the contract sums. Pure; every
 * view of the contract (bid schedule, overview, quantity watch, pay applications, exports) reads this.
 * Amounts are quantity x unit price rounded to the cent once per item; sums are sums of the items.
 */
export function currentContract(
  items: readonly ContractItemInput[],
  approvedChanges: readonly ContractChangeInput[],
): ContractResult {
  const state = new Map(
    items.map((item) => [
      item.id,
      { ...item, approvedChangeQuantity: 0, unitPriceCents: item.originalUnitPriceCents, numbers: new Set<number>() },
    ]),
  );
  for (const change of approvedChanges) {
    const entry = state.get(change.bidItemId);
    if (!entry) continue;
    entry.numbers.add(change.changeOrderNumber);
    if (change.kind === 'change_quantity')
      entry.approvedChangeQuantity = addDecimals(entry.approvedChangeQuantity, change.quantityDelta);
    else entry.unitPriceCents = change.newUnitPriceCents;
  }
  const results: ContractItemResult[] = items.map((item) => {
    const s = state.get(item.id)!;
    const contractQuantity = addDecimals(s.originalQuantity, s.approvedChangeQuantity);
    return {
      bidItemId: item.id,
      originalQuantity: s.originalQuantity,
      originalUnitPriceCents: s.originalUnitPriceCents,
      approvedChangeQuantity: s.approvedChangeQuantity,
      contractQuantity,
      unitPriceCents: s.unitPriceCents,
      changeOrderNumbers: [...s.numbers].sort((a, b) => a - b),
      originalAmountCents: lineAmountCents(s.originalQuantity, s.originalUnitPriceCents),
      contractAmountCents: lineAmountCents(contractQuantity, s.unitPriceCents),
    };
  });
  const originalContractSumCents = sumCents(results.map((r) => r.originalAmountCents));
  const contractSumCents = sumCents(results.map((r) => r.contractAmountCents));
  return {
    items: results,
    originalContractSumCents,
    approvedChangesCents: subtractCents(contractSumCents, originalContractSumCents),
    contractSumCents,
  };
}
