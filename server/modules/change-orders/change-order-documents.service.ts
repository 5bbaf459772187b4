import { MAX_DOCUMENTS_PER_CHANGE_ORDER } from '../../../src/shared/constants';
import type { ChangeOrderDocumentView } from '../../../src/shared/schemas/change-order';
import type { EvidenceKind } from '../../../src/shared/schemas/tally';
import type { Db } from '../../db/client';
import type { Storage } from '../../integrations/storage/storage';
import type { Actor } from '../../lib/actor';
import { AppError, forbidden, notFound } from '../../lib/app-error';
import { recordAudit } from '../audit/audit.repository';
import { isUuid, loadProjectAccess } from '../projects/project-access';
import { sizeOf, storeCheckedFiles, type CheckedFile } from '../tallies/evidence-files';
import { lockedProjectStoredBytes } from '../tallies/tallies.repository';
import { assertProjectQuota, DEFAULT_PROJECT_QUOTA_BYTES } from '../../lib/upload';
import * as docs from './change-order-documents.repository';
import { canAttachChangeOrderDocument, documentsOpen } from '../../../src/shared/policies/change-orders';
import * as repo from './change-orders.repository';
import { loadChangeOrder } from './change-orders.service';

const frozen = (status: string) =>
  new AppError(
    409,
    'CHANGE_ORDER_DOCUMENTS_FROZEN',
    `Documents are attached while a change order is proposed; this one is ${status}, so its documents stay as they were when it was decided.`,
  );

export function presentDocument(row: docs.ChangeOrderDocumentRow, uploadedBy: string): ChangeOrderDocumentView {
  return {
    id: row.id,
    changeOrderId: row.changeOrderId,
    fileName: row.fileName,
    contentType: row.contentType,
    kind: row.kind as EvidenceKind,
    sizeBytes: row.sizeBytes,
    sha256: row.sha256,
    uploadedBy,
    createdAt: row.createdAt.toISOString(),
    downloadUrl: `/api/change-order-documents/${row.id}/download`,
  };
}

/** Anyone who sees the change order sees its documents. */
export async function listChangeOrderDocuments(db: Db, actor: Actor, id: string): Promise<ChangeOrderDocumentView[]> {
  const { row } = await loadChangeOrder(db, actor, id);
  const rows = await docs.listDocuments(db, row.id);
  const names = await repo.userNames(
    db,
    rows.map((r) => r.uploadedByUserId),
  );
  return rows.map((r) => presentDocument(r, names.get(r.uploadedByUserId) ?? ''));
}

/**
 * Stores the files (already checked like tally evidence), then records them in one transaction with one audit
 * event; the change order row is locked and must still be proposed. If the transaction fails the bytes are removed.
 */
export async function attachChangeOrderDocuments(
  db: Db,
  storage: Storage,
  actor: Actor,
  id: string,
  files: CheckedFile[],
  quotaBytes = DEFAULT_PROJECT_QUOTA_BYTES,
): Promise<ChangeOrderDocumentView[]> {
  const { row, roles, project } = await loadChangeOrder(db, actor, id);
  if (!canAttachChangeOrderDocument(project.ownerApprovesChangeOrders)(roles)) {
    throw forbidden('Your role on this project cannot attach documents to change orders.');
  }
  if (!documentsOpen(row.status)) throw frozen(row.status);
  const existing = await docs.countDocuments(db, row.id);
  if (existing + files.length > MAX_DOCUMENTS_PER_CHANGE_ORDER) {
    const message = `A change order holds at most ${MAX_DOCUMENTS_PER_CHANGE_ORDER} documents; it has ${existing} and this upload adds ${files.length}.`;
    throw new AppError(400, 'DOCUMENT_LIMIT', message, [{ path: 'files', message }]);
  }
  const stored = await storeCheckedFiles(storage, files, 'change-order');
  try {
    return await db.transaction(async (tx) => {
      // Touching the row locks it against a decision running at the same time, and proves it is still proposed.
      const locked = await repo.updateIfProposed(tx, row.id, { updatedAt: new Date() });
      if (!locked) throw frozen((await repo.findChangeOrder(tx, row.id))?.status ?? 'decided');
      const used = await lockedProjectStoredBytes(tx, row.projectId);
      assertProjectQuota(
        used,
        files.reduce((n, f) => n + sizeOf(f), 0),
        quotaBytes,
      );
      const rows = await docs.insertDocuments(
        tx,
        stored.map(({ f, key, sha256 }) => ({
          changeOrderId: row.id,
          fileName: f.fileName,
          contentType: f.contentType,
          kind: f.kind,
          sizeBytes: sizeOf(f),
          sha256,
          storageKey: key,
          uploadedByUserId: actor.userId,
        })),
      );
      const views = rows.map((r) => presentDocument(r, actor.name));
      await recordAudit(tx, {
        projectId: row.projectId,
        actorUserId: actor.userId,
        objectType: 'change_order',
        objectId: row.id,
        action: 'change_order.documents_attached',
        after: {
          files: views.map((v) => ({ id: v.id, fileName: v.fileName, sizeBytes: v.sizeBytes, sha256: v.sha256 })),
        },
      });
      return views;
    });
  } catch (err) {
    await Promise.all(stored.map((s) => storage.remove(s.key).catch(() => undefined)));
    throw err;
  }
}

export async function downloadChangeOrderDocument(db: Db, storage: Storage, actor: Actor, documentId: string) {
  const found = isUuid(documentId) ? await docs.findDocument(db, documentId) : undefined;
  if (!found) throw notFound('The document');
  await loadProjectAccess(db, actor, found.projectId).catch((err: unknown) => {
    throw err instanceof AppError && err.status === 404 ? notFound('The document') : err;
  });
  return { document: found.document, bytes: await storage.get(found.document.storageKey) };
}
