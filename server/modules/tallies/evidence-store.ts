import { MAX_EVIDENCE_FILES_PER_TALLY } from '../../../src/shared/constants';
import type { EvidenceView } from '../../../src/shared/schemas/tally';
import type { Executor } from '../../db/client';
import type { Storage } from '../../integrations/storage/storage';
import type { Actor } from '../../lib/actor';
import { AppError } from '../../lib/app-error';
import { assertProjectQuota } from '../../lib/upload';
import { sizeOf, storeCheckedFiles, type CheckedFile } from './evidence-files';
import { presentEvidence } from './tallies.presenter';
import * as repo from './tallies.repository';

export type StoredEvidence = Awaited<ReturnType<typeof storeCheckedFiles>>;

/** 400 EVIDENCE_LIMIT when the files would take a tally past MAX_EVIDENCE_FILES_PER_TALLY. */
export function assertEvidenceRoom(existing: number, adding: number) {
  if (existing + adding <= MAX_EVIDENCE_FILES_PER_TALLY) return;
  const message = `A tally holds at most ${MAX_EVIDENCE_FILES_PER_TALLY} files; it has ${existing} and this upload adds ${adding}.`;
  throw new AppError(400, 'EVIDENCE_LIMIT', message, [{ path: 'files', message }]);
}

/**
 * Stores the checked files, then runs `work` (the caller's one transaction, which records them); if anything
 * fails the stored files are removed again: no row without its file, no file without its row.
 */
export async function withStoredFiles<T>(
  storage: Storage,
  files: CheckedFile[],
  work: (stored: StoredEvidence) => Promise<T>,
): Promise<T> {
  const stored = files.length > 0 ? await storeCheckedFiles(storage, files, 'evidence') : [];
  try {
    return await work(stored);
  } catch (err) {
    await Promise.all(stored.map((s) => storage.remove(s.key).catch(() => undefined)));
    throw err;
  }
}

/**
 * Records stored files as a tally's evidence inside the caller's transaction. The project row is locked first, so
 * two uploads at once cannot both fit under the storage quota by counting apart.
 */
export async function recordEvidence(
  tx: Executor,
  actor: Actor,
  projectId: string,
  tallyId: string,
  stored: StoredEvidence,
  quotaBytes: number,
): Promise<EvidenceView[]> {
  if (stored.length === 0) return [];
  const used = await repo.lockedProjectStoredBytes(tx, projectId);
  assertProjectQuota(
    used,
    stored.reduce((n, s) => n + sizeOf(s.f), 0),
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
  return rows.map((r) => presentEvidence(r, actor.name));
}

/** How the audit event names files: id, name, size and hash. */
export const auditedFiles = (views: EvidenceView[]) =>
  views.map((v) => ({ id: v.id, fileName: v.fileName, sizeBytes: v.sizeBytes, sha256: v.sha256 }));
