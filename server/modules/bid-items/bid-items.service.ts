import { parseBidScheduleCsv } from '../../../src/shared/bid-schedule-csv';
import { lineAmountCents, sumCents } from '../../../src/shared/domain/money';
import type { BidItemInput, BidItemView, UpdateBidItemInput } from '../../../src/shared/schemas/bid-item';
import type { Db, Executor } from '../../db/client';
import type { Actor } from '../../lib/actor';
import { AppError, notFound, validationFailed } from '../../lib/app-error';
import { recordAudit } from '../audit/audit.repository';
import { isUuid, loadProjectAccess } from '../projects/project-access';
import { canManageContract } from '../projects/projects.policy';
import { presentBidItem } from './bid-items.presenter';
import * as repo from './bid-items.repository';

export async function listBidItems(db: Db, actor: Actor, projectId: string) {
  await loadProjectAccess(db, actor, projectId);
  const items = (await repo.listBidItems(db, projectId)).map(presentBidItem);
  return { bidItems: items, totals: { contractSumCents: sumCents(items.map((i) => i.contractAmountCents)) } };
}

async function refuseTakenNumbers(tx: Executor, projectId: string, numbers: string[], path: (i: number) => string) {
  const taken = new Set(await repo.existingItemNumbers(tx, projectId, numbers));
  const details = numbers.flatMap((n, i) =>
    taken.has(n) ? [{ path: path(i), message: `Item number ${n} is already on this bid schedule.` }] : [],
  );
  if (details.length > 0) throw new AppError(409, 'ITEM_NUMBER_TAKEN', 'An item number is already in use.', details);
}

export async function createBidItem(db: Db, actor: Actor, projectId: string, input: BidItemInput): Promise<BidItemView> {
  await loadProjectAccess(db, actor, projectId, canManageContract);
  return db.transaction(async (tx) => {
    await refuseTakenNumbers(tx, projectId, [input.itemNumber], () => 'itemNumber');
    const [row] = await repo.insertBidItems(tx, projectId, [input]);
    const view = presentBidItem(row!);
    await audit(tx, actor, projectId, view.id, 'bid_item.created', undefined, view);
    return view;
  });
}

/** Saves every row of a bid schedule CSV, or none: each bad row and field is reported with its line. */
export async function importBidItems(db: Db, actor: Actor, projectId: string, csvText: string) {
  await loadProjectAccess(db, actor, projectId, canManageContract);
  const { items, errors } = parseBidScheduleCsv(csvText);
  if (errors.length > 0) throw validationFailed(errors, `The file has ${errors.length} problem(s); nothing was imported.`);
  return db.transaction(async (tx) => {
    await refuseTakenNumbers(tx, projectId, items.map((i) => i.itemNumber), (i) => `line ${i + 2}.item_number`);
    const rows = (await repo.insertBidItems(tx, projectId, items)).map(presentBidItem);
    await audit(tx, actor, projectId, projectId, 'bid_item.imported', undefined, {
      count: rows.length,
      itemNumbers: rows.map((r) => r.itemNumber),
      contractSumCents: sumCents(rows.map((r) => lineAmountCents(r.contractQuantity, r.unitPriceCents))),
    });
    return { imported: rows.length, bidItems: rows };
  });
}

async function loadForChange(db: Db, actor: Actor, bidItemId: string) {
  const row = isUuid(bidItemId) ? await repo.findBidItem(db, bidItemId) : undefined;
  if (!row) throw notFound('The bid item');
  await loadProjectAccess(db, actor, row.projectId, canManageContract).catch((err: unknown) => {
    throw err instanceof AppError && err.status === 404 ? notFound('The bid item') : err;
  });
  return row;
}

export async function updateBidItem(db: Db, actor: Actor, bidItemId: string, input: UpdateBidItemInput) {
  const before = await loadForChange(db, actor, bidItemId);
  return db.transaction(async (tx) => {
    if (input.itemNumber && input.itemNumber !== before.itemNumber) {
      await refuseTakenNumbers(tx, before.projectId, [input.itemNumber], () => 'itemNumber');
    }
    const view = presentBidItem(await repo.updateBidItem(tx, bidItemId, input));
    await audit(tx, actor, before.projectId, bidItemId, 'bid_item.updated', presentBidItem(before), view);
    return view;
  });
}

export async function deleteBidItem(db: Db, actor: Actor, bidItemId: string): Promise<void> {
  const before = await loadForChange(db, actor, bidItemId);
  await db.transaction(async (tx) => {
    // Quantities measured or billed against an item keep it: the contract changes through a change order instead.
    const used = await repo.referencesTo(tx, bidItemId);
    const uses = [
      used.tallies ? `${used.tallies} tall${used.tallies === 1 ? 'y' : 'ies'}` : '',
      used.payAppLines ? `${used.payAppLines} pay application line${used.payAppLines === 1 ? '' : 's'}` : '',
      used.changeOrderItems ? `${used.changeOrderItems} change order item${used.changeOrderItems === 1 ? '' : 's'}` : '',
    ].filter(Boolean);
    if (uses.length > 0) {
      throw new AppError(409, 'BID_ITEM_IN_USE', `Bid item ${before.itemNumber} cannot be deleted: ${uses.join(', ')} refer to it. Change its quantity through a change order instead.`);
    }
    await repo.deleteBidItem(tx, bidItemId);
    await audit(tx, actor, before.projectId, bidItemId, 'bid_item.deleted', presentBidItem(before), undefined);
  });
}

function audit(tx: Executor, actor: Actor, projectId: string, objectId: string, action: string, before: unknown, after: unknown) {
  return recordAudit(tx, { projectId, actorUserId: actor.userId, objectType: 'bid_item', objectId, action, before, after });
}
