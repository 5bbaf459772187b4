import { and, count, eq, inArray, or } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { companyMembers, projectMembers, projects, session, user } from '../../db/schema';

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

/** The seats a person holds on projects where this company fills that seat (the seats held through the company). */
export async function seatsThroughCompany(db: Executor, companyId: string, userId: string) {
  return db
    .select({ id: projectMembers.id, projectId: projectMembers.projectId, role: projectMembers.role })
    .from(projectMembers)
    .innerJoin(projects, eq(projects.id, projectMembers.projectId))
    .where(
      and(
        eq(projectMembers.userId, userId),
        or(
          and(eq(projectMembers.role, 'subcontractor'), eq(projects.subcontractorCompanyId, companyId)),
          and(eq(projectMembers.role, 'general_contractor'), eq(projects.generalContractorCompanyId, companyId)),
          and(eq(projectMembers.role, 'owner'), eq(projects.ownerCompanyId, companyId)),
        ),
      ),
    );
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
