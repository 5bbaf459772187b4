import { and, asc, count, eq, inArray, isNull, ne, or, type SQL } from 'drizzle-orm';
import type { ProjectRole } from '../../../src/shared/constants';
import { seatCompanyId, type ProjectParties } from '../../../src/shared/policies/projects';
import type { Executor } from '../../db/client';
import { companies, companyMembers, invitations, projectMembers, projects, session, user } from '../../db/schema';

/** The seat a person holds on a project, with the person's name and e-mail. */
export async function findSeat(db: Executor, projectId: string, userId: string) {
  const [row] = await db
    .select({ id: projectMembers.id, role: projectMembers.role, name: user.name, email: user.email })
    .from(projectMembers)
    .innerJoin(user, eq(user.id, projectMembers.userId))
    .where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.userId, userId)))
    .limit(1);
  return row;
}

/** A person's membership of a company, with the person's name and e-mail. */
export async function findCompanyMember(db: Executor, companyId: string, userId: string) {
  const [row] = await db
    .select({ isAdmin: companyMembers.isAdmin, name: user.name, email: user.email })
    .from(companyMembers)
    .innerJoin(user, eq(user.id, companyMembers.userId))
    .where(and(eq(companyMembers.companyId, companyId), eq(companyMembers.userId, userId)))
    .limit(1);
  return row;
}

export async function listCompanyMembers(db: Executor, companyId: string) {
  return db
    .select({ userId: user.id, name: user.name, email: user.email, isAdmin: companyMembers.isAdmin })
    .from(companyMembers)
    .innerJoin(user, eq(user.id, companyMembers.userId))
    .where(eq(companyMembers.companyId, companyId))
    .orderBy(user.name);
}

export async function adminCount(db: Executor, companyId: string): Promise<number> {
  const [row] = await db
    .select({ n: count() })
    .from(companyMembers)
    .where(and(eq(companyMembers.companyId, companyId), eq(companyMembers.isAdmin, true)));
  return row!.n;
}

/** A role on a project whose seat this company fills (the project names it for that party). */
function seatOfCompany(role: AnyRoleColumn, companyId: string): SQL {
  return or(
    and(eq(role, 'subcontractor'), eq(projects.subcontractorCompanyId, companyId)),
    and(eq(role, 'general_contractor'), eq(projects.generalContractorCompanyId, companyId)),
    and(eq(role, 'owner'), eq(projects.ownerCompanyId, companyId)),
  )!;
}
type AnyRoleColumn = typeof projectMembers.role | typeof invitations.role;

/** The seats a person holds on projects where this company fills that seat (the seats held through the company). */
export async function seatsThroughCompany(db: Executor, companyId: string, userId: string) {
  return db
    .select({ id: projectMembers.id, projectId: projectMembers.projectId, role: projectMembers.role })
    .from(projectMembers)
    .innerJoin(projects, eq(projects.id, projectMembers.projectId))
    .where(and(eq(projectMembers.userId, userId), seatOfCompany(projectMembers.role, companyId)));
}

export async function findCompany(db: Executor, companyId: string) {
  const [row] = await db
    .select({ id: companies.id, name: companies.name, kind: companies.kind })
    .from(companies)
    .where(eq(companies.id, companyId))
    .limit(1);
  return row;
}

/** Every seat the company's people hold through it, with the job's name, for the company page. */
export async function companySeats(db: Executor, companyId: string) {
  return db
    .select({
      userId: projectMembers.userId,
      projectId: projects.id,
      projectName: projects.name,
      role: projectMembers.role,
    })
    .from(projectMembers)
    .innerJoin(projects, eq(projects.id, projectMembers.projectId))
    .innerJoin(companyMembers, eq(companyMembers.userId, projectMembers.userId))
    .where(and(eq(companyMembers.companyId, companyId), seatOfCompany(projectMembers.role, companyId)))
    .orderBy(asc(projects.name));
}

/** Invitations to this company's seats not yet accepted (expired ones too: the page says so). */
export async function openInvitations(db: Executor, companyId: string) {
  return db
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      projectId: projects.id,
      projectName: projects.name,
      invitedBy: user.name,
      sentAt: invitations.createdAt,
      expiresAt: invitations.expiresAt,
    })
    .from(invitations)
    .innerJoin(projects, eq(projects.id, invitations.projectId))
    .innerJoin(user, eq(user.id, invitations.invitedByUserId))
    .where(and(isNull(invitations.acceptedAt), seatOfCompany(invitations.role, companyId)))
    .orderBy(asc(invitations.expiresAt));
}

export async function deleteSeats(db: Executor, ids: string[]) {
  if (ids.length > 0) await db.delete(projectMembers).where(inArray(projectMembers.id, ids));
}

export async function deleteCompanyMember(db: Executor, userId: string) {
  await db.delete(companyMembers).where(eq(companyMembers.userId, userId));
}

/** Signs the person out everywhere: every session row goes, so the next request with any of them is 401. */
export async function endSessions(db: Executor, userId: string): Promise<number> {
  return (await db.delete(session).where(eq(session.userId, userId)).returning({ id: session.id })).length;
}

/**
 * E-mail addresses of the people holding one of `roles` on the project while they belong to the seat's company
 * (as access counts them: someone who left the company gets no more mail through an old seat), except `exceptUserId`.
 * Every project mail (pay applications, disputes, payments, waivers, change orders) finds its readers here.
 */
export async function seatAddresses(
  db: Executor,
  project: ProjectParties & { id: string },
  roles: ProjectRole[],
  exceptUserId = '',
): Promise<string[]> {
  if (roles.length === 0) return [];
  const rows = await db
    .selectDistinct({ email: user.email })
    .from(projectMembers)
    .innerJoin(user, eq(user.id, projectMembers.userId))
    .innerJoin(companyMembers, eq(companyMembers.userId, projectMembers.userId))
    .where(
      and(
        eq(projectMembers.projectId, project.id),
        ne(projectMembers.userId, exceptUserId),
        or(
          ...roles.map((role) =>
            and(eq(projectMembers.role, role), eq(companyMembers.companyId, seatCompanyId(project, role))),
          ),
        ),
      ),
    );
  return rows.map((r) => r.email).sort();
}
