import {
  createTallySchema,
  type CreateTallyInput,
  type TallyListQuery,
  type TallySummaryView,
  type UpdateTallyInput,
} from '../../../src/shared/schemas/tally';
import type { Db, Executor } from '../../db/client';
import type { Actor } from '../../lib/actor';
import type { ComputePool } from '../../lib/compute/compute-pool';
import { AppError, validationFailed } from '../../lib/app-error';
import { pageOf } from '../../lib/paging';
import type { Page } from '../../../src/shared/schemas/paging';
import { sanityConcerns } from '../../../src/shared/domain/tally-sanity';
import { recordAudit } from '../audit/audit.repository';
import { findBidItem } from '../bid-items/bid-items.repository';
import { loadContract } from '../change-orders/contract-quantities.repository';
import { loadProjectAccess } from '../projects/project-access';
import type { ProjectRow } from '../projects/projects.repository';
import { listEvidence } from './tallies.repository';
import { canWriteTallies, isEditableTally, tallyCan } from '../../../src/shared/policies/tallies';
import { presentEvidence, presentRevision, presentTally, presentTallySummary } from './tallies.presenter';
import * as repo from './tallies.repository';
import { computeTally } from './tally-quantity';
import type { Storage } from '../../integrations/storage/storage';
import type { CheckedFile } from './evidence-files';
import { assertEvidenceRoom, auditedFiles, recordEvidence, withStoredFiles } from './evidence-store';
import { surfaceAgainstBaseline } from '../surface-baselines/measure-against';
import { loadTallyAccess, tallyNotDraft } from './tally-access';
import { PAY_APP_STATUSES } from '../../../src/shared/constants';
import { canSeePayApp } from '../../../src/shared/policies/pay-apps';

/**
 * One page of the project's tallies as summaries (no inputs, no engine result). The owner's side does not see
 * tallies billed on an application it cannot see yet (filtered in the query, so pages stay full and walk every row).
 */
export async function listTallies(
  db: Db,
  actor: Actor,
  projectId: string,
  query: TallyListQuery,
): Promise<Page<TallySummaryView>> {
  const { roles } = await loadProjectAccess(db, actor, projectId);
  const visible = PAY_APP_STATUSES.filter((s) => canSeePayApp(roles, s));
  const billedOn = visible.length === PAY_APP_STATUSES.length ? 'any' : visible;
  const rows = await repo.listTallySummaries(db, projectId, query, billedOn);
  const counts = await repo.evidenceCounts(
    db,
    rows.map((r) => r.tally.id),
  );
  return pageOf(
    rows,
    query.limit,
    (r) => ({ at: r.pageKey, id: r.tally.id }),
    (r) => presentTallySummary(r, counts.get(r.tally.id) ?? 0, roles),
  );
}

export async function getTally(db: Db, actor: Actor, tallyId: string) {
  const { row, roles } = await loadTallyAccess(db, actor, tallyId);
  const evidence = (await listEvidence(db, tallyId)).map((e) => presentEvidence(e.evidence, e.uploadedBy));
  const revisions = (await repo.listRevisions(db, tallyId)).map((r) => presentRevision(r.revision, r.replacedBy));
  const payAppStatus = await repo.payAppStatusOf(db, row.tally.payAppId);
  const can = tallyCan(roles, { status: row.tally.status, payAppStatus });
  return { tally: presentTally(row, evidence.length, can), evidence, revisions };
}

async function itemOnProject(db: Executor, project: ProjectRow, bidItemId: string) {
  const item = await findBidItem(db, bidItemId);
  if (!item || item.projectId !== project.id) {
    throw validationFailed([{ path: 'bidItemId', message: 'No such bid item on this project' }]);
  }
  return item;
}

/**
 * A quantity past the sanity limits (src/shared/domain/tally-sanity.ts) is saved only with a written reason;
 * without one the answer is 400 SANITY_REASON_REQUIRED on the field `sanityReason`, and nothing is saved.
 */
async function sanityReasonFor(
  db: Executor,
  item: { id: string; projectId: string; contractQuantity: number; payUnit: string },
  quantity: number,
  tallyId: string | null,
  reason: string | null | undefined,
) {
  // The current contract quantity (original + approved change orders, src/shared/domain/contract.ts), never the
  // bid item's original column: an item grown by a change order is judged against what the contract now says.
  const contract = await loadContract(db, item.projectId);
  const concerns = sanityConcerns({
    quantity,
    contractQuantity: contract.byId.get(item.id)?.contractQuantity ?? item.contractQuantity,
    talliedElsewhere: await repo.talliedQuantity(db, item.id, tallyId),
    payUnit: item.payUnit,
  });
  if (concerns.length === 0) return null;
  if (!reason || reason.length < 10) {
    const message = `${concerns.join('; ')}. Check the inputs; if the quantity is right, say why (at least 10 characters).`;
    throw new AppError(400, 'SANITY_REASON_REQUIRED', message, [{ path: 'sanityReason', message }]);
  }
  return reason;
}

/** The stored columns for a tally: the server's own computation, never a number sent by the client. */
async function computedColumns(
  db: Executor,
  project: ProjectRow,
  input: CreateTallyInput,
  compute?: ComputePool,
  tallyId: string | null = null,
) {
  const item = await itemOnProject(db, project, input.bidItemId);
  // Surface tallies measure against the project's locked original ground (surface-baselines/measure-against.ts).
  const baseline = input.method === 'surface' ? await surfaceAgainstBaseline(db, project.id, input.inputs) : null;
  const measured = baseline ? { ...input, inputs: baseline.engineInputs } : input;
  const computed = await computeTally(measured, item, project, compute);
  const result = baseline ? { ...computed, trail: [baseline.trail, ...computed.trail] } : computed;
  input = baseline ? { ...measured, inputs: { ...baseline.engineInputs, ...baseline.kept } } : input;
  const sanityReason = await sanityReasonFor(db, item, result.quantity, tallyId, input.sanityReason);
  return {
    sanityReason,
    bidItemId: item.id,
    measuredOn: input.measuredOn,
    title: input.title,
    method: input.method,
    inputs:
      input.method === 'manual'
        ? null
        : {
            ...(input.inputs ?? {}),
            ...(input.component ? { component: input.component } : {}),
            ...(input.measuredBasis ? { measuredBasis: input.measuredBasis } : {}),
            ...(input.density ? { density: input.density } : {}),
          },
    result,
    quantity: result.quantity,
    manualBasis: input.method === 'manual' ? (input.manualBasis ?? null) : null,
  };
}

/** Files saved with a tally in the same request (the worksheet's files), checked already (evidence-files.ts). */
export type TallyFiles = { storage: Storage; files: CheckedFile[]; quotaBytes: number };

/**
 * Creates a tally, with the worksheet's files as its evidence when they came in the same request: the files are
 * stored first, then the tally, its evidence rows and one audit event are one transaction; if anything fails
 * (a refused file, the quota, the sanity reason) nothing is saved and the stored files are removed.
 */
export async function createTally(
  db: Db,
  actor: Actor,
  projectId: string,
  input: CreateTallyInput,
  compute?: ComputePool,
  attach?: TallyFiles,
) {
  const { project } = await loadProjectAccess(db, actor, projectId, canWriteTallies);
  const columns = await computedColumns(db, project, input, compute);
  const files = attach?.files ?? [];
  assertEvidenceRoom(0, files.length);
  const id = await withStoredFiles(attach?.storage as Storage, files, (stored) =>
    db.transaction(async (tx) => {
      const row = await repo.insertTally(tx, { ...columns, projectId, authorUserId: actor.userId });
      const views = await recordEvidence(tx, actor, projectId, row.id, stored, attach?.quotaBytes ?? 0);
      await audit(tx, actor, projectId, row.id, 'tally.created', undefined, {
        ...columns,
        result: undefined,
        ...(views.length ? { files: auditedFiles(views) } : {}),
      });
      return row.id;
    }),
  );
  return (await getTally(db, actor, id)).tally;
}

/** Worksheet fields stored in inputs that are tally options rather than engine inputs. */
function splitInputs(inputs: Record<string, unknown> | null) {
  if (!inputs) return { inputs: null };
  const { component, measuredBasis, density, ...rest } = inputs as {
    component?: 'cut' | 'fill';
    measuredBasis?: 'bank' | 'loose' | 'compacted';
    density?: number;
  };
  return { inputs: rest as Record<string, unknown>, component, measuredBasis, density };
}

export async function updateTally(
  db: Db,
  actor: Actor,
  tallyId: string,
  patch: UpdateTallyInput,
  compute?: ComputePool,
  attach?: TallyFiles,
) {
  const { row, project } = await loadTallyAccess(db, actor, tallyId, canWriteTallies);
  if (!isEditableTally(row.tally.status)) throw tallyNotDraft(row.tally.status);
  const files = attach?.files ?? [];
  if (files.length) assertEvidenceRoom((await repo.evidenceCounts(db, [tallyId])).get(tallyId) ?? 0, files.length);
  const t = row.tally;
  const merged = {
    bidItemId: t.bidItemId,
    measuredOn: t.measuredOn,
    title: t.title,
    method: t.method,
    ...splitInputs(t.inputs as Record<string, unknown> | null),
    quantity: t.method === 'manual' ? t.quantity : null,
    manualBasis: t.manualBasis,
    ...patch,
  };
  // The merged draft is checked as a whole (a manual tally still needs its basis); zod errors answer 400.
  const columns = await computedColumns(db, project, createTallySchema.parse(merged), compute, tallyId);
  await withStoredFiles(attach?.storage as Storage, files, (stored) =>
    db.transaction(async (tx) => {
      // The state being replaced is kept as a revision (same transaction: no edit without its history).
      await repo.insertRevision(tx, t, actor.userId);
      const updated = await repo.updateTallyIf(tx, tallyId, 'draft', columns);
      if (!updated) throw tallyNotDraft('no longer a draft');
      const views = await recordEvidence(tx, actor, t.projectId, tallyId, stored, attach?.quotaBytes ?? 0);
      await audit(
        tx,
        actor,
        t.projectId,
        tallyId,
        'tally.updated',
        { quantity: t.quantity, measuredOn: t.measuredOn, method: t.method },
        {
          quantity: updated.quantity,
          measuredOn: updated.measuredOn,
          method: updated.method,
          ...(views.length ? { files: auditedFiles(views) } : {}),
        },
      );
    }),
  );
  return (await getTally(db, actor, tallyId)).tally;
}

export async function markReady(db: Db, actor: Actor, tallyId: string) {
  const { row } = await loadTallyAccess(db, actor, tallyId, canWriteTallies);
  if (row.tally.status !== 'draft') throw tallyNotDraft(row.tally.status);
  await db.transaction(async (tx) => {
    const updated = await repo.updateTallyIf(tx, tallyId, 'draft', { status: 'ready' });
    if (!updated) throw tallyNotDraft('no longer a draft');
    await audit(
      tx,
      actor,
      row.tally.projectId,
      tallyId,
      'tally.ready',
      { status: 'draft' },
      { status: 'ready', quantity: updated.quantity },
    );
  });
  return (await getTally(db, actor, tallyId)).tally;
}

export async function deleteTally(db: Db, actor: Actor, tallyId: string, removeFile: (key: string) => Promise<void>) {
  const { row, roles } = await loadTallyAccess(db, actor, tallyId, canWriteTallies);
  if (row.tally.status !== 'draft') throw tallyNotDraft(row.tally.status);
  const files = await listEvidence(db, tallyId);
  const can = tallyCan(roles, { status: row.tally.status, payAppStatus: null });
  await db.transaction(async (tx) => {
    if (!(await repo.deleteTallyIfDraft(tx, tallyId))) throw tallyNotDraft('no longer a draft');
    await audit(
      tx,
      actor,
      row.tally.projectId,
      tallyId,
      'tally.deleted',
      presentTally(row, files.length, can),
      undefined,
    );
  });
  await Promise.all(files.map((f) => removeFile(f.evidence.storageKey).catch(() => undefined)));
}

export function audit(
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
    objectType: 'tally',
    objectId,
    action,
    before,
    after,
  });
}
