import { parseBidScheduleCsv } from '../../../src/shared/bid-schedule-csv';
import { lineAmountCents, sumCents } from '../../../src/shared/domain/money';
import {
  CONTRACT_FIELDS,
  CORRECTABLE_FIELDS,
  type BidItemInput,
  type BidItemView,
  type ContractLockView,
  type UpdateBidItemInput,
} from '../../../src/shared/schemas/bid-item';
import type { Db, Executor } from '../../db/client';
import { lineAmountProblem } from '../../../src/shared/schemas/money-limits';
import type { Actor } from '../../lib/actor';
import { AppError, notFound, validationFailed } from '../../lib/app-error';
import { recordAudit } from '../audit/audit.repository';
import { loadContract } from '../change-orders/contract-quantities.repository';
import { isUuid, loadProjectAccess } from '../projects/project-access';
import { canManageContract } from '../../../src/shared/policies/projects';
import { presentBidItem } from './bid-items.presenter';
import * as repo from './bid-items.repository';
import { talliesNotBilledReason } from '../../../src/shared/domain/provisions/tally-pay';
import type { ProfileSettings } from '../../../src/shared/schemas/provisions/profile';

/** The bid schedule: each item's original beside its current figures, the contract sums and the lock. */
export async function listBidItems(db: Db, actor: Actor, projectId: string) {
  await loadProjectAccess(db, actor, projectId);
  const [rows, contract, since, profiles] = await Promise.all([
    repo.listBidItems(db, projectId),
    loadContract(db, projectId),
    repo.contractLockedSince(db, projectId),
    repo.profilesOf(db, projectId),
  ]);
  const notBilled = new Map(
    profiles.map((p) => [p.bidItemId, talliesNotBilledReason(p.profile, (p.settings ?? {}) as ProfileSettings)]),
  );
  const paidAs = new Map(profiles.map((p) => [p.bidItemId, p.profile]));
  const lock: ContractLockView = { locked: since !== null, sincePayAppNumber: since };
  const { originalContractSumCents, approvedChangesCents, contractSumCents } = contract;
  return {
    bidItems: rows.map((r) => ({
      ...presentBidItem(r, contract.byId.get(r.id)),
      talliesNotBilled: notBilled.get(r.id) ?? null,
      paidAs: paidAs.get(r.id) ?? null,
    })),
    totals: { originalContractSumCents, approvedChangesCents, contractSumCents },
    lock,
  };
}

const FIELD_LABELS: Record<(typeof CONTRACT_FIELDS)[number], string> = {
  itemNumber: 'item number',
  payUnit: 'pay unit',
  basis: 'measurement basis',
  unitPriceCents: 'unit price',
  contractQuantity: 'contract quantity',
};

/** 409 CONTRACT_LOCKED: once a pay application was submitted, the contract changes by change order only. */
function contractLocked(since: number, fields: string[]) {
  const names = fields.map((f) => FIELD_LABELS[f as keyof typeof FIELD_LABELS] ?? f);
  const what = fields.length === 0 ? 'The bid schedule' : `The ${names.join(', ')}`;
  return new AppError(
    409,
    'CONTRACT_LOCKED',
    `${what} cannot be edited: the contract is locked since pay application ${since} was submitted. Propose a change order instead.`,
    fields.map((f) => ({
      path: f,
      message: `The ${FIELD_LABELS[f as keyof typeof FIELD_LABELS] ?? f} changes only through an approved change order.`,
    })),
  );
}

async function refuseWhenLocked(db: Executor, projectId: string) {
  const since = await repo.contractLockedSince(db, projectId);
  if (since !== null) throw contractLocked(since, []);
}

async function refuseTakenNumbers(tx: Executor, projectId: string, numbers: string[], path: (i: number) => string) {
  const taken = new Set(await repo.existingItemNumbers(tx, projectId, numbers));
  const details = numbers.flatMap((n, i) =>
    taken.has(n) ? [{ path: path(i), message: `Item number ${n} is already on this bid schedule.` }] : [],
  );
  if (details.length > 0) throw new AppError(409, 'ITEM_NUMBER_TAKEN', 'An item number is already in use.', details);
}

export async function createBidItem(
  db: Db,
  actor: Actor,
  projectId: string,
  input: BidItemInput,
): Promise<BidItemView> {
  await loadProjectAccess(db, actor, projectId, canManageContract);
  return db.transaction(async (tx) => {
    await refuseWhenLocked(tx, projectId);
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
  if (errors.length > 0)
    throw validationFailed(errors, `The file has ${errors.length} problem(s); nothing was imported.`);
  return db.transaction(async (tx) => {
    await refuseWhenLocked(tx, projectId);
    await refuseTakenNumbers(
      tx,
      projectId,
      items.map((i) => i.itemNumber),
      (i) => `line ${i + 2}.item_number`,
    );
    const rows = (await repo.insertBidItems(tx, projectId, items)).map((r) => presentBidItem(r));
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

/**
 * Edits a bid item. While the contract is being set up any field changes. Once it is locked, a contract field
 * that would change answers 409 CONTRACT_LOCKED naming it, and the description, major-item flag and
 * measurement method are corrected with a reason (audit event `bid_item.corrected`).
 */
export async function updateBidItem(db: Db, actor: Actor, bidItemId: string, input: UpdateBidItemInput) {
  const before = await loadForChange(db, actor, bidItemId);
  const { reason, ...changes } = input;
  const tooLarge = lineAmountProblem(
    changes.contractQuantity ?? before.contractQuantity,
    changes.unitPriceCents ?? before.unitPriceCents,
  );
  if (tooLarge)
    throw validationFailed([
      { path: changes.contractQuantity !== undefined ? 'contractQuantity' : 'unitPriceCents', message: tooLarge },
    ]);
  return db.transaction(async (tx) => {
    const since = await repo.contractLockedSince(tx, before.projectId);
    const contract = await loadContract(tx, before.projectId);
    const current = presentBidItem(before, contract.byId.get(bidItemId));
    if (since !== null) {
      const touched = CONTRACT_FIELDS.filter((f) => changes[f] !== undefined && changes[f] !== current[f]);
      if (touched.length > 0) throw contractLocked(since, touched);
      const corrected = CORRECTABLE_FIELDS.filter((f) => changes[f] !== undefined && changes[f] !== before[f]);
      if (corrected.length > 0 && !reason) {
        throw validationFailed([
          { path: 'reason', message: `The contract is locked; say why the ${corrected.join(', ')} is corrected.` },
        ]);
      }
      const set = Object.fromEntries(corrected.map((f) => [f, changes[f]]));
      const row = corrected.length > 0 ? await repo.updateBidItem(tx, bidItemId, set) : before;
      const view = presentBidItem(row, contract.byId.get(bidItemId));
      if (corrected.length > 0) {
        await audit(
          tx,
          actor,
          before.projectId,
          bidItemId,
          'bid_item.corrected',
          Object.fromEntries(corrected.map((f) => [f, before[f]])),
          { ...Object.fromEntries(corrected.map((f) => [f, row[f]])), itemNumber: row.itemNumber, reason },
        );
      }
      return view;
    }
    if (changes.itemNumber && changes.itemNumber !== before.itemNumber) {
      await refuseTakenNumbers(tx, before.projectId, [changes.itemNumber], () => 'itemNumber');
    }
    const row = await repo.updateBidItem(tx, bidItemId, changes);
    const after = await loadContract(tx, before.projectId);
    const view = presentBidItem(row, after.byId.get(bidItemId));
    await audit(
      tx,
      actor,
      before.projectId,
      bidItemId,
      'bid_item.updated',
      current,
      reason ? { ...view, reason } : view,
    );
    return view;
  });
}

export async function deleteBidItem(db: Db, actor: Actor, bidItemId: string): Promise<void> {
  const before = await loadForChange(db, actor, bidItemId);
  await db.transaction(async (tx) => {
    await refuseWhenLocked(tx, before.projectId);
    // Quantities measured or billed against an item keep it: the contract changes through a change order instead.
    const used = await repo.referencesTo(tx, bidItemId);
    const uses = [
      used.tallies ? `${used.tallies} tall${used.tallies === 1 ? 'y' : 'ies'}` : '',
      used.payAppLines ? `${used.payAppLines} pay application line${used.payAppLines === 1 ? '' : 's'}` : '',
      used.changeOrderItems
        ? `${used.changeOrderItems} change order item${used.changeOrderItems === 1 ? '' : 's'}`
        : '',
    ].filter(Boolean);
    if (uses.length > 0) {
      throw new AppError(
        409,
        'BID_ITEM_IN_USE',
        `Bid item ${before.itemNumber} cannot be deleted: ${uses.join(', ')} refer to it. Change its quantity through a change order instead.`,
      );
    }
    await repo.deleteBidItem(tx, bidItemId);
    await audit(tx, actor, before.projectId, bidItemId, 'bid_item.deleted', presentBidItem(before), undefined);
  });
}

function audit(
  tx: Executor,
  actor: Actor,
  projectId: string,
  objectId: string,
  action: string,
  before: unknown,
  after: unknown,
) {
  return recordAudit(tx, {
    projectId,
    actorUserId: actor.userId,
    objectType: 'bid_item',
    objectId,
    action,
    before,
    after,
  });
}
