import type { CreateInvitationInput, InvitationView } from '../../../src/shared/schemas/invitation';
import type { AppContext } from '../../app-context';
import type { Db } from '../../db/client';
import { invitations } from '../../db/schema';
import type { Actor } from '../../lib/actor';
import { AppError, conflict, notFound } from '../../lib/app-error';
import { recordAudit } from '../audit/audit.repository';
import { enqueueEmail } from '../notifications/outbox';
import { isUuid, loadProjectAccess } from '../projects/project-access';
import { canManagePeople } from '../projects/projects.policy';
import { eq } from 'drizzle-orm';
import { invitationMail } from './invitation-email';
import { newInvitationToken } from './invitation-token';
import { presentInvitation } from './invitations.presenter';
import * as repo from './invitations.repository';

export async function listInvitations(db: Db, actor: Actor, projectId: string): Promise<InvitationView[]> {
  await loadProjectAccess(db, actor, projectId, canManagePeople);
  return (await repo.listInvitations(db, projectId)).map((r) => presentInvitation(r.invitation, r.invitedBy));
}

/**
 * A company admin of a party company or the general contractor invites someone by e-mail with a role. The mail
 * is queued in the same transaction and sent after commit.
 */
export async function createInvitation(ctx: AppContext, actor: Actor, projectId: string, input: CreateInvitationInput) {
  const { db } = ctx;
  const { project } = await loadProjectAccess(db, actor, projectId, canManagePeople);
  const existing = await repo.findUserByEmail(db, input.email);
  if (existing && (await repo.hasRole(db, projectId, existing.id, input.role))) {
    throw conflict('ALREADY_MEMBER', `${input.email} already holds this role on this job.`);
  }
  if (await repo.pendingFor(db, projectId, input.email, input.role)) {
    throw conflict('INVITATION_PENDING', `${input.email} already has an open invitation for this role; revoke it to send a new one.`);
  }
  const { token, tokenHash, expiresAt } = newInvitationToken();
  const view = await db.transaction(async (tx) => {
    const [row] = await tx
      .insert(invitations)
      .values({ projectId, email: input.email, role: input.role, tokenHash, invitedByUserId: actor.userId, expiresAt })
      .returning();
    const acceptUrl = `${ctx.appUrl}/invitations/${token}`;
    await enqueueEmail(tx, invitationMail({ projectId, projectName: project.name, role: input.role, email: input.email, inviterName: actor.name, acceptUrl, expiresAt }));
    const presented = presentInvitation(row!, actor.name);
    await recordAudit(tx, {
      projectId,
      actorUserId: actor.userId,
      objectType: 'invitation',
      objectId: row!.id,
      action: 'invitation.sent',
      after: { email: presented.email, role: presented.role, expiresAt: presented.expiresAt },
    });
    return presented;
  });
  await ctx.outbox.flush();
  return view;
}

/** Revokes an open invitation: the row goes (its link stops working); the trail keeps the record. */
export async function revokeInvitation(db: Db, actor: Actor, id: string): Promise<void> {
  const row = isUuid(id) ? await repo.findInvitation(db, id) : undefined;
  if (!row) throw notFound('The invitation');
  await loadProjectAccess(db, actor, row.projectId, canManagePeople).catch((err: unknown) => {
    throw err instanceof AppError && err.status === 404 ? notFound('The invitation') : err;
  });
  if (row.acceptedAt) throw conflict('INVITATION_USED', 'This invitation was already accepted; remove the person instead.');
  await db.transaction(async (tx) => {
    await tx.delete(invitations).where(eq(invitations.id, id));
    await recordAudit(tx, {
      projectId: row.projectId,
      actorUserId: actor.userId,
      objectType: 'invitation',
      objectId: id,
      action: 'invitation.revoked',
      before: { email: row.email, role: row.role, expiresAt: row.expiresAt.toISOString() },
    });
  });
}
