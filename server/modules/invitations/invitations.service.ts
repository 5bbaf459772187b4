import type { ProjectRole } from '../../../src/shared/constants';
import type { CreateInvitationInput, InvitationView } from '../../../src/shared/schemas/invitation';
import type { AppContext } from '../../app-context';
import type { Db } from '../../db/client';
import { invitations } from '../../db/schema';
import type { Actor } from '../../lib/actor';
import { AppError, conflict, notFound } from '../../lib/app-error';
import { recordAudit } from '../audit/audit.repository';
import { enqueueEmail } from '../notifications/outbox';
import { isUuid, loadProjectAccess } from '../projects/project-access';
import { canManagePeople, managedSeat } from '../../../src/shared/policies/projects';
import { memberRoles } from '../projects/projects.repository';
import { SEAT_NAMES } from './seat-rules';
import { eq } from 'drizzle-orm';
import { invitationMail } from './invitation-email';
import { newInvitationToken } from './invitation-token';
import { presentInvitation } from './invitations.presenter';
import * as repo from './invitations.repository';

/** A party company's admin sees the invitations to its own company's seat. */
export async function listInvitations(db: Db, actor: Actor, projectId: string): Promise<InvitationView[]> {
  const { roles } = await loadProjectAccess(db, actor, projectId, canManagePeople);
  const seat = managedSeat(roles)!;
  return (await repo.listInvitations(db, projectId))
    .filter((r) => r.invitation.role === seat)
    .map((r) => presentInvitation(r.invitation, r.invitedBy));
}

const otherSeat = (actor: Actor, seat: ProjectRole, role: ProjectRole) =>
  new AppError(
    403,
    'SEAT_OF_ANOTHER_COMPANY',
    `As an admin of ${actor.companyName ?? 'your company'} you manage the ${SEAT_NAMES[seat]} seat of this job; the ${SEAT_NAMES[role]} seat is filled by its own company's admin.`,
  );

/**
 * A party company's admin invites someone by e-mail to its own company's seat (the subcontractor's admin to the
 * subcontractor seat, and so on). The company of an existing account is checked when the invitation is accepted,
 * so this answer never tells an admin which company another address belongs to. The mail is queued in the same
 * transaction and sent after commit.
 */
export async function createInvitation(ctx: AppContext, actor: Actor, projectId: string, input: CreateInvitationInput) {
  const { db } = ctx;
  const { project, roles } = await loadProjectAccess(db, actor, projectId, canManagePeople);
  const seat = managedSeat(roles)!;
  if (input.role !== seat) throw otherSeat(actor, seat, input.role);
  const existing = await repo.findUserByEmail(db, input.email);
  const seats = existing ? await memberRoles(db, projectId, existing.id) : [];
  if (seats.length > 0) {
    throw conflict(
      'ALREADY_HOLDS_SEAT',
      `${input.email} already holds the ${SEAT_NAMES[seats[0]!]} seat of this job; one person holds one role on a job.`,
    );
  }
  if (await repo.pendingFor(db, projectId, input.email, input.role)) {
    throw conflict(
      'INVITATION_PENDING',
      `${input.email} already has an open invitation for this role; revoke it to send a new one.`,
    );
  }
  const { token, tokenHash, expiresAt } = newInvitationToken();
  const view = await db.transaction(async (tx) => {
    const [row] = await tx
      .insert(invitations)
      .values({ projectId, email: input.email, role: input.role, tokenHash, invitedByUserId: actor.userId, expiresAt })
      .returning();
    const acceptUrl = `${ctx.appUrl}/invitations/${token}`;
    await enqueueEmail(
      tx,
      invitationMail({
        projectId,
        projectName: project.name,
        role: input.role,
        email: input.email,
        inviterName: actor.name,
        acceptUrl,
        expiresAt,
      }),
    );
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
  void ctx.outbox.flush(); // after commit, off the answer: a slow mail server never delays it
  return view;
}

/** Revokes an open invitation: the row goes (its link stops working); the trail keeps the record. */
export async function revokeInvitation(db: Db, actor: Actor, id: string): Promise<void> {
  const row = isUuid(id) ? await repo.findInvitation(db, id) : undefined;
  if (!row) throw notFound('The invitation');
  const { roles } = await loadProjectAccess(db, actor, row.projectId, canManagePeople).catch((err: unknown) => {
    throw err instanceof AppError && err.status === 404 ? notFound('The invitation') : err;
  });
  const seat = managedSeat(roles)!;
  if (row.role !== seat) throw otherSeat(actor, seat, row.role);
  if (row.acceptedAt)
    throw conflict('INVITATION_USED', 'This invitation was already accepted; remove the person instead.');
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
