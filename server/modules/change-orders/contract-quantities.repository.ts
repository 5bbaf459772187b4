import { and, asc, eq } from 'drizzle-orm';
import {
  currentContract,
  type ContractChangeInput,
  type ContractItemInput,
  type ContractItemResult,
  type ContractResult,
} from '../../../src/shared/domain/contract';
import type { ContractQuantityView } from '../../../src/shared/schemas/change-order';
import type { Executor } from '../../db/client';
import { bidItems, changeOrderItems, changeOrders } from '../../db/schema';

export type LoadedContract = ContractResult & {
  byId: Map<string, ContractItemResult>;
  /** What currentContract was given, for computations over the same contract (change order values). */
  inputs: { items: ContractItemInput[]; changes: ContractChangeInput[] };
};

/**
 * The project's contract as it stands (src/shared/domain/contract.ts): bid items hold their original quantity
 * and price; approved change orders apply in the order they were approved. An item added by a change order has
 * no original quantity: its whole quantity is that change order's change. Every module reads the contract here
 * rather than from bid_items.
 */
export async function loadContract(db: Executor, projectId: string): Promise<LoadedContract> {
  const items = await db
    .select({
      id: bidItems.id,
      quantity: bidItems.contractQuantity,
      price: bidItems.unitPriceCents,
      addedBy: bidItems.addedByChangeOrderId,
    })
    .from(bidItems)
    .where(eq(bidItems.projectId, projectId))
    .orderBy(asc(bidItems.itemNumber));
  const rows = await db
    .select({
      number: changeOrders.number,
      changeOrderId: changeOrders.id,
      kind: changeOrderItems.kind,
      bidItemId: changeOrderItems.bidItemId,
      delta: changeOrderItems.quantityDelta,
      price: changeOrderItems.newUnitPriceCents,
    })
    .from(changeOrderItems)
    .innerJoin(changeOrders, eq(changeOrders.id, changeOrderItems.changeOrderId))
    .where(and(eq(changeOrders.projectId, projectId), eq(changeOrders.status, 'approved')))
    .orderBy(
      asc(changeOrders.decidedAt),
      asc(changeOrders.number),
      asc(changeOrderItems.createdAt),
      asc(changeOrderItems.id),
    );
  const added = new Map(items.filter((i) => i.addedBy).map((i) => [i.id, i]));
  const changes: ContractChangeInput[] = rows.flatMap((r): ContractChangeInput[] => {
    if (!r.bidItemId) return [];
    if (r.kind === 'add_item') {
      const item = added.get(r.bidItemId);
      return item
        ? [
            {
              changeOrderNumber: r.number,
              kind: 'change_quantity',
              bidItemId: r.bidItemId,
              quantityDelta: item.quantity,
            },
          ]
        : [];
    }
    if (r.kind === 'change_quantity' && r.delta !== null)
      return [{ changeOrderNumber: r.number, kind: r.kind, bidItemId: r.bidItemId, quantityDelta: r.delta }];
    if (r.kind === 'change_price' && r.price !== null)
      return [{ changeOrderNumber: r.number, kind: r.kind, bidItemId: r.bidItemId, newUnitPriceCents: r.price }];
    return [];
  });
  const itemInputs = items.map((i) => ({
    id: i.id,
    originalQuantity: i.addedBy ? 0 : i.quantity,
    originalUnitPriceCents: i.price,
  }));
  const result = currentContract(itemInputs, changes);
  return {
    ...result,
    byId: new Map(result.items.map((i) => [i.bidItemId, i])),
    inputs: { items: itemInputs, changes },
  };
}

/** Original, approved change and current contract quantity of each bid item (see loadContract). */
export async function contractQuantities(db: Executor, projectId: string): Promise<Map<string, ContractQuantityView>> {
  return quantitiesOf(await loadContract(db, projectId));
}

export function quantitiesOf(contract: LoadedContract): Map<string, ContractQuantityView> {
  return new Map(
    contract.items.map((i) => [
      i.bidItemId,
      {
        bidItemId: i.bidItemId,
        originalQuantity: i.originalQuantity,
        approvedChangeQuantity: i.approvedChangeQuantity,
        currentContractQuantity: i.contractQuantity,
      },
    ]),
  );
}
