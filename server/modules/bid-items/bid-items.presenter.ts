import { lineAmountCents } from '../../../src/shared/domain/money';
import type { BidItemView } from '../../../src/shared/schemas/bid-item';
import type { bidItems } from '../../db/schema';

export type BidItemRow = typeof bidItems.$inferSelect;

export function presentBidItem(row: BidItemRow): BidItemView {
  return {
    id: row.id,
    projectId: row.projectId,
    itemNumber: row.itemNumber,
    description: row.description,
    payUnit: row.payUnit,
    basis: row.basis,
    unitPriceCents: row.unitPriceCents,
    contractQuantity: row.contractQuantity,
    isMajor: row.isMajor,
    method: row.method,
    contractAmountCents: lineAmountCents(row.contractQuantity, row.unitPriceCents),
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}
