import { and, eq } from 'drizzle-orm';
import { addDecimals } from '../../../src/shared/domain/rounding';
import type { ContractQuantityView } from '../../../src/shared/schemas/change-order';
import type { Executor } from '../../db/client';
import { bidItems, changeOrderItems, changeOrders } from '../../db/schema';

/**
 * Contract quantity of each bid item of a project = original + approved changes, in the item's pay unit.
 * An item added by a change order has no original quantity: its whole quantity is an approved change.
 * For other modules (pay applications, variance): call this rather than reading bid_items.contract_quantity.
 */
export async function contractQuantities(db: Executor, projectId: string): Promise<Map<string, ContractQuantityView>> {
  const [items, deltas] = await Promise.all([
    db
      .select({ id: bidItems.id, quantity: bidItems.contractQuantity, addedBy: bidItems.addedByChangeOrderId })
      .from(bidItems)
      .where(eq(bidItems.projectId, projectId)),
    db
      .select({ bidItemId: changeOrderItems.bidItemId, delta: changeOrderItems.quantityDelta })
      .from(changeOrderItems)
      .innerJoin(changeOrders, eq(changeOrders.id, changeOrderItems.changeOrderId))
      .where(
        and(
          eq(changeOrders.projectId, projectId),
          eq(changeOrders.status, 'approved'),
          eq(changeOrderItems.kind, 'change_quantity'),
        ),
      ),
  ]);
  const result = new Map<string, ContractQuantityView>();
  for (const item of items) {
    const original = item.addedBy ? 0 : item.quantity;
    const added = item.addedBy ? item.quantity : 0;
    result.set(item.id, { bidItemId: item.id, originalQuantity: original, approvedChangeQuantity: added, currentContractQuantity: item.quantity });
  }
  for (const { bidItemId, delta } of deltas) {
    const entry = bidItemId ? result.get(bidItemId) : undefined;
    if (!entry || delta === null) continue;
    entry.approvedChangeQuantity = addDecimals(entry.approvedChangeQuantity, delta);
    entry.currentContractQuantity = addDecimals(entry.originalQuantity, entry.approvedChangeQuantity);
  }
  return result;
}

/** The current contract quantity of one bid item (see contractQuantities). */
export async function currentContractQuantity(db: Executor, projectId: string, bidItemId: string): Promise<number | undefined> {
  return (await contractQuantities(db, projectId)).get(bidItemId)?.currentContractQuantity;
}
