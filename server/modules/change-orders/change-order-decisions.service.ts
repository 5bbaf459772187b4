import type { BidItemInput } from '../../../src/shared/schemas/bid-item';
import type { ProjectRole } from '../../../src/shared/constants';
import type { ChangeOrderView } from '../../../src/shared/schemas/change-order';
import type { Db, Executor } from '../../db/client';
import { bidItems } from '../../db/schema';
import type { Actor } from '../../lib/actor';
import { conflict, forbidden } from '../../lib/app-error';
import { recordAudit } from '../audit/audit.repository';
import { enqueueEmail } from '../notifications/outbox';
import type { ProjectRow } from '../projects/projects.repository';
import { changeOrderApprovedMail, changeOrderRejectedMail } from './change-order-emails';
import { checkChangeOrderItems } from './change-order-checks';
import { loadContract, type LoadedContract } from './contract-quantities.repository';
import { decisionSides, isFullyApproved, type ApprovalSide } from '../../../src/shared/policies/change-orders';
import * as repo from './change-orders.repository';
import { loadChangeOrder, presentContext, viewOf, type ChangeOrderContext } from './change-orders.service';
import { seatAddresses } from '../members/members.repository';

const stale = () =>
  conflict(
    'CHANGE_ORDER_DECIDED',
    'This change order was decided by someone else meanwhile; reload it to see its status.',
  );

async function loadForDecision(db: Db, actor: Actor, id: string) {
  const loaded = await loadChangeOrder(db, actor, id);
  const sides = decisionSides(loaded.roles, loaded.project.ownerApprovesChangeOrders);
  if (sides.length === 0) {
    throw forbidden(
      loaded.project.ownerApprovesChangeOrders
        ? 'Only the general contractor or the owner decides change orders on this project.'
        : 'Only the general contractor decides change orders on this project.',
    );
  }
  if (loaded.row.status !== 'proposed') throw stale();
  return { ...loaded, sides };
}

/**
 * Who hears of a decision: the proposer's side and the subcontractor, and the general contractor's side too when the
 * owner's decision settled it (the general contractor keeps the contract). Never the person who decided.
 */
async function decisionAddresses(
  tx: Executor,
  project: ProjectRow,
  row: repo.ChangeOrderRow,
  side: ApprovalSide,
  actorUserId: string,
) {
  const seats = new Set<ProjectRole>(['subcontractor']);
  const proposerSeat = await repo.seatOf(tx, project.id, row.proposedByUserId);
  if (proposerSeat) seats.add(proposerSeat);
  if (side === 'owner') seats.add('general_contractor');
  return seatAddresses(tx, project, [...seats], actorUserId);
}

/**
 * Applies an approved change order: creates the items it adds. Quantity and price changes are not written to the
 * bid items, which keep their original figures; the current contract is derived from the approved change orders
 * (loadContract). Returns what changed, for the audit event.
 */
async function applyChanges(tx: Executor, changeOrderId: string, projectId: string, contract: LoadedContract) {
  const items = await repo.itemsOf(tx, [changeOrderId]);
  const applied: unknown[] = [];
  for (const item of items) {
    if (item.kind === 'add_item') {
      const input = item.newItem as BidItemInput;
      const [created] = await tx
        .insert(bidItems)
        .values({ ...input, projectId, addedByChangeOrderId: changeOrderId })
        .returning();
      await repo.setItemBidItem(tx, item.id, created!.id);
      applied.push({ kind: item.kind, bidItemId: created!.id, itemNumber: input.itemNumber });
    } else if (item.kind === 'change_price' && item.bidItemId && item.newUnitPriceCents !== null) {
      applied.push({
        kind: item.kind,
        bidItemId: item.bidItemId,
        from: contract.byId.get(item.bidItemId)?.unitPriceCents,
        to: item.newUnitPriceCents,
      });
    } else {
      applied.push({ kind: item.kind, bidItemId: item.bidItemId, quantityDelta: item.quantityDelta });
    }
  }
  return applied;
}

/**
 * Records the approval of the actor's side (general contractor, or owner where the project requires it). The
 * change order is approved, and applied, once every required side has approved. A stale decision gets 409.
 */
export async function approveChangeOrder(
  { db, appUrl }: ChangeOrderContext,
  actor: Actor,
  id: string,
  note: string,
): Promise<ChangeOrderView> {
  const { row, project, sides, roles } = await loadForDecision(db, actor, id);
  const side: ApprovalSide | undefined = sides.find((s) => (s === 'gc' ? !row.gcApprovedAt : !row.ownerApprovedAt));
  if (!side) throw conflict('CHANGE_ORDER_ALREADY_APPROVED', 'Your side has already approved this change order.');
  const now = new Date();
  const mark =
    side === 'gc'
      ? { gcApprovedByUserId: actor.userId, gcApprovedAt: now }
      : { ownerApprovedByUserId: actor.userId, ownerApprovedAt: now };
  return db.transaction(async (tx) => {
    const marked = await repo.updateIfProposed(tx, id, mark, side);
    if (!marked) throw stale();
    let after = marked;
    let applied: unknown[] = [];
    const complete = isFullyApproved(marked, project.ownerApprovesChangeOrders);
    if (complete) {
      const ctx = await presentContext(tx, project, [], roles);
      const items = (await repo.itemsOf(tx, [id])).map((i) => ({ ...i, newItem: i.newItem as BidItemInput | null }));
      checkChangeOrderItems(items, ctx.bidItems, ctx.quantities);
      const contractBefore = await loadContract(tx, project.id);
      after = (await repo.updateIfProposed(tx, id, { status: 'approved', decidedAt: now, decisionNote: note }))!;
      applied = await applyChanges(tx, id, project.id, contractBefore);
    }
    await recordAudit(tx, {
      projectId: project.id,
      actorUserId: actor.userId,
      objectType: 'change_order',
      objectId: id,
      action: complete ? 'change_order.approved' : `change_order.${side}_approved`,
      before: { status: row.status },
      after: { status: after.status, side, note, ...(complete ? { applied } : {}) },
    });
    const view = await viewOf(tx, project, after, roles);
    if (complete) {
      await enqueueEmail(
        tx,
        changeOrderApprovedMail(
          { appUrl, project, actorName: actor.name },
          await decisionAddresses(tx, project, row, side, actor.userId),
          view,
        ),
      );
    }
    return view;
  });
}

/** Rejects with a note; either deciding side may reject while the change order is proposed. */
export async function rejectChangeOrder(
  { db, appUrl }: ChangeOrderContext,
  actor: Actor,
  id: string,
  note: string,
): Promise<ChangeOrderView> {
  const { row, project, sides, roles } = await loadForDecision(db, actor, id);
  return db.transaction(async (tx) => {
    const after = await repo.updateIfProposed(tx, id, {
      status: 'rejected',
      decidedAt: new Date(),
      decisionNote: note,
    });
    if (!after) throw stale();
    await recordAudit(tx, {
      projectId: project.id,
      actorUserId: actor.userId,
      objectType: 'change_order',
      objectId: id,
      action: 'change_order.rejected',
      before: { status: row.status },
      after: { status: after.status, side: sides[0], note },
    });
    const view = await viewOf(tx, project, after, roles);
    await enqueueEmail(
      tx,
      changeOrderRejectedMail(
        { appUrl, project, actorName: actor.name },
        await decisionAddresses(tx, project, row, sides[0]!, actor.userId),
        view,
      ),
    );
    return view;
  });
}
