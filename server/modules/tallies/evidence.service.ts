import { MAX_EVIDENCE_FILES_PER_TALLY } from '../../../src/shared/constants';
import type { Db } from '../../db/client';
import type { Storage } from '../../integrations/storage/storage';
import type { Actor } from '../../lib/actor';
import { AppError, notFound } from '../../lib/app-error';
import { isUuid, loadProjectAccess } from '../projects/project-access';
import { sizeOf, storeCheckedFiles, type CheckedFile } from './evidence-files';
import { assertProjectQuota, DEFAULT_PROJECT_QUOTA_BYTES } from '../../lib/upload';
import { canAddEvidence, canWriteTallies } from '../../../src/shared/policies/tallies';
import { presentEvidence } from './tallies.presenter';
import * as repo from './tallies.repository';
import { audit } from './tallies.service';
import { loadTallyAccess, payAppVisible } from './tally-access';

/**
 * Stores the files, then records them in one transaction that also checks the project's storage quota; if anything
 * fails the stored files are removed again (no row without its file, no file without its row).
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
  if (existing + files.length > MAX_EVIDENCE_FILES_PER_TALLY) {
    const message = `A tally holds at most ${MAX_EVIDENCE_FILES_PER_TALLY} files; it has ${existing} and this upload adds ${files.length}.`;
    throw new AppError(400, 'EVIDENCE_LIMIT', message, [{ path: 'files', message }]);
  }
  const stored = await storeCheckedFiles(storage, files, 'evidence');
  try {
    return await db.transaction(async (tx) => {
      // The project row is locked, so two uploads at once cannot both fit under the quota by counting apart.
      const used = await repo.lockedProjectStoredBytes(tx, row.tally.projectId);
      assertProjectQuota(
        used,
        files.reduce((n, f) => n + sizeOf(f), 0),
        quotaBytes,
      );
      const rows = await repo.insertEvidence(
        tx,
        stored.map(({ f, key, sha256 }) => ({
          tallyId,
          fileName: f.fileName,
          contentType: f.contentType,
          kind: f.kind,
          sizeBytes: sizeOf(f),
          sha256,
          storageKey: key,
          uploadedByUserId: actor.userId,
        })),
      );
      const views = rows.map((r) => presentEvidence(r, actor.name));
      await audit(tx, actor, row.tally.projectId, tallyId, 'tally.evidence_added', undefined, {
        files: views.map((v) => ({ id: v.id, fileName: v.fileName, sizeBytes: v.sizeBytes, sha256: v.sha256 })),
      });
      return views;
    });
  } catch (err) {
    await Promise.all(stored.map((s) => storage.remove(s.key).catch(() => undefined)));
    throw err;
  }
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
