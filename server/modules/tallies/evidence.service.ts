import type { Db } from '../../db/client';
import type { Storage } from '../../integrations/storage/storage';
import type { Actor } from '../../lib/actor';
import { AppError, notFound } from '../../lib/app-error';
import { isUuid, loadProjectAccess } from '../projects/project-access';
import type { CheckedFile } from './evidence-files';
import { DEFAULT_PROJECT_QUOTA_BYTES } from '../../lib/upload';
import { canAddEvidence, canWriteTallies } from '../../../src/shared/policies/tallies';
import * as repo from './tallies.repository';
import { audit } from './tallies.service';
import { assertEvidenceRoom, auditedFiles, recordEvidence, withStoredFiles } from './evidence-store';
import { loadTallyAccess, payAppVisible } from './tally-access';

/**
 * Adds files to a tally later (evidence-store.ts: stored first, recorded in one transaction with the quota check
 * and the audit event; a failure removes the stored files).
 */
export async function addEvidence(
  db: Db,
  storage: Storage,
  actor: Actor,
  tallyId: string,
  files: CheckedFile[],
  quotaBytes = DEFAULT_PROJECT_QUOTA_BYTES,
) {
  const { row } = await loadTallyAccess(db, actor, tallyId, canWriteTallies);
  const payAppStatus = await repo.payAppStatusOf(db, row.tally.payAppId);
  if (!canAddEvidence(row.tally.status, payAppStatus)) {
    throw new AppError(
      409,
      'TALLY_NOT_DRAFT',
      `Evidence can be added to a draft tally, or to a billed one while its pay application is back with the subcontractor; this one is ${row.tally.status}.`,
    );
  }
  const existing = (await repo.evidenceCounts(db, [tallyId])).get(tallyId) ?? 0;
  assertEvidenceRoom(existing, files.length);
  return withStoredFiles(storage, files, (stored) =>
    db.transaction(async (tx) => {
      const views = await recordEvidence(tx, actor, row.tally.projectId, tallyId, stored, quotaBytes);
      await audit(tx, actor, row.tally.projectId, tallyId, 'tally.evidence_added', undefined, {
        files: auditedFiles(views),
      });
      return views;
    }),
  );
}

async function loadEvidence(db: Db, actor: Actor, evidenceId: string, write: boolean) {
  const found = isUuid(evidenceId) ? await repo.findEvidence(db, evidenceId) : undefined;
  if (!found) throw notFound('The file');
  const { roles } = await loadProjectAccess(db, actor, found.projectId, write ? canWriteTallies : undefined).catch(
    (err: unknown) => {
      throw err instanceof AppError && err.status === 404 ? notFound('The file') : err;
    },
  );
  if (!(await payAppVisible(db, roles, found.payAppId))) throw notFound('The file');
  return found;
}

export async function downloadEvidence(db: Db, storage: Storage, actor: Actor, evidenceId: string) {
  const { evidence } = await loadEvidence(db, actor, evidenceId, false);
  return { evidence, bytes: await storage.get(evidence.storageKey) };
}

export async function removeEvidence(db: Db, storage: Storage, actor: Actor, evidenceId: string) {
  const found = await loadEvidence(db, actor, evidenceId, true);
  if (found.tallyStatus !== 'draft')
    throw new AppError(409, 'TALLY_NOT_DRAFT', 'Evidence can be removed only while its tally is a draft.');
  await db.transaction(async (tx) => {
    await repo.deleteEvidence(tx, evidenceId);
    await audit(
      tx,
      actor,
      found.projectId,
      found.evidence.tallyId,
      'tally.evidence_removed',
      { id: evidenceId, fileName: found.evidence.fileName, sha256: found.evidence.sha256 },
      undefined,
    );
  });
  await storage.remove(found.evidence.storageKey).catch(() => undefined);
}
