import type { CompanyMemberView, CompanyPageView } from '../../../src/shared/schemas/project';
import type { Db } from '../../db/client';
import type { Actor } from '../../lib/actor';
import { AppError, conflict, notFound } from '../../lib/app-error';
import { recordAudit } from '../audit/audit.repository';
import { SEAT_NAMES } from '../invitations/seat-rules';
import { isUuid, loadProjectAccess } from '../projects/project-access';
import { canManagePeople, managedSeat } from '../../../src/shared/policies/projects';
import * as repo from './members.repository';

/**
 * A party company's admin removes one of its seat's people from a project: the seat goes and the person's
 * sessions end, in one transaction with its audit event. Another company's seat is not this admin's to empty.
 */
export async function removeFromProject(db: Db, actor: Actor, projectId: string, userId: string): Promise<void> {
  const { roles } = await loadProjectAccess(db, actor, projectId, canManagePeople);
  const found = await repo.findSeat(db, projectId, userId);
  if (!found) throw notFound('The person on this job');
  const seat = managedSeat(roles)!;
  if (found.role !== seat) {
    throw new AppError(
      403,
      'SEAT_OF_ANOTHER_COMPANY',
      `${found.name} holds the ${SEAT_NAMES[found.role]} seat; only that company's admin removes its people.`,
    );
  }
  await db.transaction(async (tx) => {
    await repo.deleteSeats(tx, [found.id]);
    const sessions = await repo.endSessions(tx, userId);
    await recordAudit(tx, {
      projectId,
      actorUserId: actor.userId,
      objectType: 'project_member',
      objectId: userId,
      action: 'member.removed',
      before: { name: found.name, email: found.email, role: found.role },
      after: { sessionsEnded: sessions },
    });
  });
}

/** The admin's own company: 404 for anyone outside it (never reveal another company), 403 for a member who is no admin. */
function checkCompanyAdmin(actor: Actor, companyId: string) {
  if (!isUuid(companyId) || actor.companyId !== companyId) throw notFound('The company');
  if (!actor.isAdmin) throw new AppError(403, 'FORBIDDEN', 'Only an admin of the company manages its people.');
}

/** The company page: its people with the seats they hold through it, and the invitations still open. */
export async function companyPage(db: Db, actor: Actor, companyId: string): Promise<CompanyPageView> {
  checkCompanyAdmin(actor, companyId);
  const [company, members, seats, open] = await Promise.all([
    repo.findCompany(db, companyId),
    repo.listCompanyMembers(db, companyId),
    repo.companySeats(db, companyId),
    repo.openInvitations(db, companyId),
  ]);
  if (!company) throw notFound('The company');
  const now = Date.now();
  return {
    company,
    people: members.map((m) => ({
      ...m,
      seats: seats
        .filter((s) => s.userId === m.userId)
        .map(({ projectId, projectName, role }) => ({ projectId, projectName, role })),
    })),
    invitations: open.map((i) => ({
      ...i,
      sentAt: i.sentAt.toISOString(),
      expiresAt: i.expiresAt.toISOString(),
      expired: i.expiresAt.getTime() <= now,
    })),
  };
}

export async function listCompanyMembers(db: Db, actor: Actor, companyId: string): Promise<CompanyMemberView[]> {
  checkCompanyAdmin(actor, companyId);
  return repo.listCompanyMembers(db, companyId);
}

/**
 * A company admin removes a person from the company: the person's seats held through the company go with it
 * (each project's trail records its removal), and every session of the person ends. The last admin stays.
 */
export async function removeFromCompany(db: Db, actor: Actor, companyId: string, userId: string): Promise<void> {
  checkCompanyAdmin(actor, companyId);
  const member = await repo.findCompanyMember(db, companyId, userId);
  if (!member) throw notFound('The person in this company');
  if (member.isAdmin && (await repo.adminCount(db, companyId)) <= 1) {
    throw conflict(
      'LAST_COMPANY_ADMIN',
      `${member.name} is the company's only admin; make someone else an admin first.`,
    );
  }
  await db.transaction(async (tx) => {
    const seats = await repo.seatsThroughCompany(tx, companyId, userId);
    await repo.deleteSeats(
      tx,
      seats.map((s) => s.id),
    );
    await repo.deleteCompanyMember(tx, userId);
    const sessions = await repo.endSessions(tx, userId);
    const before = { name: member.name, email: member.email, isAdmin: member.isAdmin };
    for (const s of seats) {
      await recordAudit(tx, {
        projectId: s.projectId,
        actorUserId: actor.userId,
        objectType: 'project_member',
        objectId: userId,
        action: 'member.removed',
        before: { ...before, role: s.role },
        after: { reason: 'removed from the company' },
      });
    }
    await recordAudit(tx, {
      projectId: null,
      actorUserId: actor.userId,
      objectType: 'company_member',
      objectId: userId,
      action: 'company_member.removed',
      before: { ...before, companyId, seats: seats.map((s) => ({ projectId: s.projectId, role: s.role })) },
      after: { sessionsEnded: sessions },
    });
  });
}
