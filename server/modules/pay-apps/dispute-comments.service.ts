import type { Db } from '../../db/client';
import { disputeComments } from '../../db/schema';
import type { Actor } from '../../lib/actor';
import { AppError, forbidden, notFound } from '../../lib/app-error';
import { recordAudit } from '../audit/audit.repository';
import { isUuid, loadProjectAccess } from '../projects/project-access';
import { canComment, canSeePayApp } from '../../../src/shared/policies/pay-apps';
import { findDispute } from './pay-apps.repository';

/** A comment on a dispute thread, by either contractor on the project. */
export async function commentOnDispute(db: Db, actor: Actor, disputeId: string, body: string) {
  const found = isUuid(disputeId) ? await findDispute(db, disputeId) : undefined;
  if (!found) throw notFound('The dispute');
  const { roles } = await loadProjectAccess(db, actor, found.projectId).catch((err: unknown) => {
    throw err instanceof AppError && err.status === 404 ? notFound('The dispute') : err;
  });
  if (!canSeePayApp(roles, found.status)) throw notFound('The dispute');
  if (!canComment(roles)) throw forbidden('Dispute threads are between the subcontractor and the general contractor.');
  return db.transaction(async (tx) => {
    const [row] = await tx.insert(disputeComments).values({ disputeId, authorUserId: actor.userId, body }).returning();
    await recordAudit(tx, {
      projectId: found.projectId,
      actorUserId: actor.userId,
      objectType: 'dispute',
      objectId: disputeId,
      action: 'dispute.commented',
      after: { commentId: row!.id, body },
    });
    return { id: row!.id, author: actor.name, body: row!.body, createdAt: row!.createdAt.toISOString() };
  });
}
