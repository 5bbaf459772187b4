import type { ContractItemResult } from '../../../src/shared/domain/contract';
import { lineAmountCents } from '../../../src/shared/domain/money';
import type { BidItemView } from '../../../src/shared/schemas/bid-item';
import type { bidItems } from '../../db/schema';

export type BidItemRow = typeof bidItems.$inferSelect;

/**
 * A bid item with its original and current contract figures. Without `current` (an item with no approved
 * change order yet, as on create), the row's figures are both.
 */
export function presentBidItem(row: BidItemRow, current?: ContractItemResult): BidItemView {
  const originalQuantity = current?.originalQuantity ?? (row.addedByChangeOrderId ? 0 : row.contractQuantity);
  const contractQuantity = current?.contractQuantity ?? row.contractQuantity;
  const unitPriceCents = current?.unitPriceCents ?? row.unitPriceCents;
  return {
    id: row.id,
    projectId: row.projectId,
    itemNumber: row.itemNumber,
    description: row.description,
    payUnit: row.payUnit,
    basis: row.basis,
    unitPriceCents,
    contractQuantity,
    originalQuantity,
    originalUnitPriceCents: current?.originalUnitPriceCents ?? row.unitPriceCents,
    changeOrderNumbers: current?.changeOrderNumbers ?? [],
    isMajor: row.isMajor,
    method: row.method,
    originalAmountCents: current?.originalAmountCents ?? lineAmountCents(originalQuantity, row.unitPriceCents),
    contractAmountCents: current?.contractAmountCents ?? lineAmountCents(contractQuantity, unitPriceCents),
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}
