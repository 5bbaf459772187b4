import type { AccessRole } from '../../../src/shared/constants';
import { changeOrderCan } from '../../../src/shared/policies/change-orders';
import { lineAmountCents, sumCents } from '../../../src/shared/domain/money';
import type { BidItemInput } from '../../../src/shared/schemas/bid-item';
import type {
  ChangeOrderHistoryEntry,
  ChangeOrderItemView,
  ChangeOrderView,
  ContractQuantityView,
} from '../../../src/shared/schemas/change-order';
import type { BidItemRow } from '../bid-items/bid-items.presenter';
import type { AuditRow } from '../audit/audit-query.repository';
import type { ChangeOrderItemRow, ChangeOrderRow } from './change-orders.repository';

export type PresentContext = {
  bidItems: Map<string, BidItemRow>;
  quantities: Map<string, ContractQuantityView>;
  /** Current unit price of each bid item (original, or the last approved price change). */
  prices: Map<string, number>;
  names: Map<string, string>;
  ownerApprovalRequired: boolean;
  /** The reader's roles on the project: what it may do with each change order (`can`) follows from them. */
  roles: AccessRole[];
};

function presentItem(row: ChangeOrderItemRow, ctx: PresentContext): ChangeOrderItemView {
  const newItem = (row.newItem as BidItemInput | null) ?? null;
  const bidItem = row.bidItemId ? ctx.bidItems.get(row.bidItemId) : undefined;
  const quantity = row.bidItemId ? (ctx.quantities.get(row.bidItemId)?.currentContractQuantity ?? 0) : 0;
  const unitPriceCents = (row.bidItemId ? ctx.prices.get(row.bidItemId) : undefined) ?? newItem?.unitPriceCents ?? 0;
  let amountDeltaCents = 0;
  if (row.kind === 'add_item' && newItem)
    amountDeltaCents = lineAmountCents(newItem.contractQuantity, newItem.unitPriceCents);
  if (row.kind === 'change_quantity' && row.quantityDelta !== null)
    amountDeltaCents = lineAmountCents(row.quantityDelta, unitPriceCents);
  if (row.kind === 'change_price' && row.newUnitPriceCents !== null) {
    amountDeltaCents = sumCents([
      lineAmountCents(quantity, row.newUnitPriceCents),
      -lineAmountCents(quantity, unitPriceCents),
    ]);
  }
  return {
    id: row.id,
    kind: row.kind,
    bidItemId: row.bidItemId,
    itemNumber: bidItem?.itemNumber ?? newItem?.itemNumber ?? '',
    description: bidItem?.description ?? newItem?.description ?? '',
    payUnit: bidItem?.payUnit ?? newItem?.payUnit ?? 'EA',
    quantityDelta: row.quantityDelta,
    unitPriceCents,
    newUnitPriceCents: row.newUnitPriceCents,
    newItem,
    amountDeltaCents,
  };
}

export function presentHistory(rows: AuditRow[]): ChangeOrderHistoryEntry[] {
  return rows
    .map((r) => ({
      action: r.action,
      actor: r.actorUserId ? { userId: r.actorUserId, name: r.actorName ?? 'Former user' } : null,
      at: r.createdAt.toISOString(),
      note: String((r.after as { note?: unknown } | null)?.note ?? ''),
    }))
    .reverse();
}

const approval = (userId: string | null, at: Date | null, names: Map<string, string>) =>
  userId && at ? { by: { userId, name: names.get(userId) ?? 'Former user' }, at: at.toISOString() } : null;

export function presentChangeOrder(
  row: ChangeOrderRow,
  items: ChangeOrderItemRow[],
  history: AuditRow[],
  ctx: PresentContext,
): ChangeOrderView {
  const itemViews = items.map((i) => presentItem(i, ctx));
  return {
    id: row.id,
    projectId: row.projectId,
    number: row.number,
    title: row.title,
    reason: row.reason,
    status: row.status,
    proposedBy: { userId: row.proposedByUserId, name: ctx.names.get(row.proposedByUserId) ?? 'Former user' },
    ownerApprovalRequired: ctx.ownerApprovalRequired,
    gcApproval: approval(row.gcApprovedByUserId, row.gcApprovedAt, ctx.names),
    ownerApproval: approval(row.ownerApprovedByUserId, row.ownerApprovedAt, ctx.names),
    decidedAt: row.decidedAt?.toISOString() ?? null,
    decisionNote: row.decisionNote,
    amountDeltaCents: sumCents(itemViews.map((i) => i.amountDeltaCents)),
    items: itemViews,
    history: presentHistory(history),
    createdAt: row.createdAt.toISOString(),
    can: changeOrderCan(ctx.roles, row, ctx.ownerApprovalRequired),
  };
}
