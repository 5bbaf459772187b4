import type { AccessRole } from '../../../src/shared/constants';
import type {
  ChangeOrderView,
  ContractQuantityView,
  CreateChangeOrderInput,
} from '../../../src/shared/schemas/change-order';
import type { AppContext } from '../../app-context';
import type { Db, Executor } from '../../db/client';
import type { Actor } from '../../lib/actor';
import { AppError, notFound } from '../../lib/app-error';
import { listObjectAudit, listProjectAudit } from '../audit/audit-query.repository';
import { recordAudit } from '../audit/audit.repository';
import { enqueueEmail } from '../notifications/outbox';
import { listBidItems } from '../bid-items/bid-items.repository';
import { isUuid, loadProjectAccess, type ProjectAccess } from '../projects/project-access';
import type { ProjectRow } from '../projects/projects.repository';
import { checkChangeOrderItems } from './change-order-checks';
import { changeOrderProposedMail } from './change-order-emails';
import { presentChangeOrder, type PresentContext } from './change-orders.presenter';
import { canProposeChangeOrder, decisionSides } from '../../../src/shared/policies/change-orders';
import * as repo from './change-orders.repository';
import { contractQuantities, loadContract, quantitiesOf } from './contract-quantities.repository';
import { seatAddresses } from '../members/members.repository';

export async function presentContext(
  db: Executor,
  project: ProjectRow,
  userIds: string[],
  roles: AccessRole[],
): Promise<PresentContext> {
  const [items, contract, names] = await Promise.all([
    listBidItems(db, project.id),
    loadContract(db, project.id),
    repo.userNames(db, userIds),
  ]);
  return {
    bidItems: new Map(items.map((i) => [i.id, i])),
    quantities: quantitiesOf(contract),
    prices: new Map(contract.items.map((i) => [i.bidItemId, i.unitPriceCents])),
    names,
    ownerApprovalRequired: project.ownerApprovesChangeOrders,
    roles,
  };
}

const peopleOf = (rows: repo.ChangeOrderRow[]) =>
  rows.flatMap((r) => [r.proposedByUserId, r.gcApprovedByUserId ?? '', r.ownerApprovedByUserId ?? '']).filter(Boolean);

export async function viewOf(
  db: Executor,
  project: ProjectRow,
  row: repo.ChangeOrderRow,
  roles: AccessRole[],
): Promise<ChangeOrderView> {
  const [items, history, ctx] = await Promise.all([
    repo.itemsOf(db, [row.id]),
    listObjectAudit(db, project.id, 'change_order', row.id),
    presentContext(db, project, peopleOf([row]), roles),
  ]);
  return presentChangeOrder(row, items, history, ctx);
}

export async function listChangeOrders(db: Db, actor: Actor, projectId: string): Promise<ChangeOrderView[]> {
  const { project, roles } = await loadProjectAccess(db, actor, projectId);
  const rows = await repo.listChangeOrders(db, projectId);
  const [items, history, ctx] = await Promise.all([
    repo.itemsOf(
      db,
      rows.map((r) => r.id),
    ),
    listProjectAudit(db, projectId, { objectType: 'change_order', limit: 10_000, offset: 0 }),
    presentContext(db, project, peopleOf(rows), roles),
  ]);
  return rows.map((row) =>
    presentChangeOrder(
      row,
      items.filter((i) => i.changeOrderId === row.id),
      history.rows.filter((h) => h.objectId === row.id),
      ctx,
    ),
  );
}

/** Loads a change order with the actor's access to its project: 404 when either is out of reach. */
export async function loadChangeOrder(
  db: Executor,
  actor: Actor,
  id: string,
): Promise<{ row: repo.ChangeOrderRow } & ProjectAccess> {
  const row = isUuid(id) ? await repo.findChangeOrder(db, id) : undefined;
  if (!row) throw notFound('The change order');
  const access = await loadProjectAccess(db, actor, row.projectId).catch((err: unknown) => {
    throw err instanceof AppError && err.status === 404 ? notFound('The change order') : err;
  });
  return { row, ...access };
}

export async function getChangeOrder(db: Db, actor: Actor, id: string): Promise<ChangeOrderView> {
  const { row, project, roles } = await loadChangeOrder(db, actor, id);
  return viewOf(db, project, row, roles);
}

/**
 * What a change order's hand-offs need: the database, and the app's address for the link in their e-mails (queued
 * in the same transaction; the outbox sends them once the answer is out).
 */
export type ChangeOrderContext = Pick<AppContext, 'db' | 'appUrl'>;

/** The seats that decide change orders on a project: the general contractor's, and the owner's where it approves too. */
export const decidingSeats = (project: ProjectRow) =>
  decisionSides(['general_contractor', 'owner'], project.ownerApprovesChangeOrders).map((side) =>
    side === 'gc' ? ('general_contractor' as const) : ('owner' as const),
  );

/**
 * Either contractor proposes; the change order gets the project's next number, and those who decide it get an
 * e-mail (never the proposer).
 */
export async function proposeChangeOrder(
  { db, appUrl }: ChangeOrderContext,
  actor: Actor,
  projectId: string,
  input: CreateChangeOrderInput,
  action = 'change_order.proposed',
): Promise<ChangeOrderView> {
  const { project, roles } = await loadProjectAccess(db, actor, projectId, canProposeChangeOrder);
  return db.transaction(async (tx) => {
    const ctx = await presentContext(tx, project, [], roles);
    checkChangeOrderItems(input.items, ctx.bidItems, ctx.quantities);
    const row = await repo.insertChangeOrder(tx, projectId, actor.userId, input);
    await recordAudit(tx, {
      projectId,
      actorUserId: actor.userId,
      objectType: 'change_order',
      objectId: row.id,
      action,
      after: {
        number: row.number,
        title: row.title,
        reason: row.reason,
        status: row.status,
        items: input.items,
        note: row.reason,
      },
    });
    const view = await viewOf(tx, project, row, roles);
    await enqueueEmail(
      tx,
      changeOrderProposedMail(
        { appUrl, project, actorName: actor.name },
        await seatAddresses(tx, project, decidingSeats(project), actor.userId),
        view,
      ),
    );
    return view;
  });
}

/** Original, approved change and current contract quantity of every bid item; any member reads them. */
export async function listContractQuantities(db: Db, actor: Actor, projectId: string): Promise<ContractQuantityView[]> {
  await loadProjectAccess(db, actor, projectId);
  return [...(await contractQuantities(db, projectId)).values()];
}
