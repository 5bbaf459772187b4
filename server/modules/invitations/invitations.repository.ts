import { and, desc, eq, gt, isNull, sql } from 'drizzle-orm';
import type { ProjectRole } from '../../../src/shared/constants';
import type { Executor } from '../../db/client';
import { companyMembers, invitations, projectMembers, projects, user } from '../../db/schema';

export type InvitationRow = typeof invitations.$inferSelect;

export async function listInvitations(db: Executor, projectId: string) {
  return db
    .select({ invitation: invitations, invitedBy: user.name })
    .from(invitations)
    .innerJoin(user, eq(user.id, invitations.invitedByUserId))
    .where(eq(invitations.projectId, projectId))
    .orderBy(desc(invitations.createdAt));
}

export async function findInvitation(db: Executor, id: string) {
  const [row] = await db.select().from(invitations).where(eq(invitations.id, id)).limit(1);
  return row;
}

export async function findByTokenHash(db: Executor, tokenHash: string) {
  const [row] = await db
    .select({ invitation: invitations, projectName: projects.name, project: projects, invitedBy: user.name })
    .from(invitations)
    .innerJoin(projects, eq(projects.id, invitations.projectId))
    .innerJoin(user, eq(user.id, invitations.invitedByUserId))
    .where(eq(invitations.tokenHash, tokenHash))
    .limit(1);
  return row;
}

export async function pendingFor(db: Executor, projectId: string, email: string, role: ProjectRole) {
  const [row] = await db
    .select({ id: invitations.id })
    .from(invitations)
    .where(
      and(
        eq(invitations.projectId, projectId),
        sql`lower(${invitations.email}) = ${email.toLowerCase()}`,
        eq(invitations.role, role),
        isNull(invitations.acceptedAt),
        gt(invitations.expiresAt, new Date()),
      ),
    )
    .limit(1);
  return row;
}

export async function findUserByEmail(db: Executor, email: string) {
  const [row] = await db.select().from(user).where(sql`lower(${user.email}) = ${email.toLowerCase()}`).limit(1);
  return row;
}

export async function hasRole(db: Executor, projectId: string, userId: string, role: ProjectRole) {
  const [row] = await db
    .select({ id: projectMembers.id })
    .from(projectMembers)
    .where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.userId, userId), eq(projectMembers.role, role)))
    .limit(1);
  return Boolean(row);
}

export async function companyOf(db: Executor, userId: string) {
  const [row] = await db.select().from(companyMembers).where(eq(companyMembers.userId, userId)).limit(1);
  return row;
}

/** Marks accepted only if nobody accepted it first; undefined means the token was already used. */
export async function markAccepted(db: Executor, id: string) {
  const [row] = await db
    .update(invitations)
    .set({ acceptedAt: new Date() })
    .where(and(eq(invitations.id, id), isNull(invitations.acceptedAt)))
    .returning();
  return row;
}
