import { and, desc, eq, inArray, or } from 'drizzle-orm';
import type { ProjectRole } from '../../../src/shared/constants';
import type { Executor } from '../../db/client';
import { FROZEN_STATUSES } from '../../../src/shared/domain/pay-app-status';
import { companies, companyMembers, payApps, projectMembers, projects, user } from '../../db/schema';

export type ProjectRow = typeof projects.$inferSelect;

export async function findProject(db: Executor, projectId: string): Promise<ProjectRow | undefined> {
  const [row] = await db.select().from(projects).where(eq(projects.id, projectId)).limit(1);
  return row;
}

export async function memberRoles(db: Executor, projectId: string, userId: string): Promise<ProjectRole[]> {
  const rows = await db
    .select({ role: projectMembers.role })
    .from(projectMembers)
    .where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.userId, userId)));
  return rows.map((r) => r.role);
}

/** Projects a person is on, or whose companies the person administers. */
export async function listVisibleProjects(db: Executor, userId: string, adminCompanyId: string | null) {
  const memberOf = db
    .select({ id: projectMembers.projectId })
    .from(projectMembers)
    .where(eq(projectMembers.userId, userId));
  const conditions = [inArray(projects.id, memberOf)];
  if (adminCompanyId) {
    conditions.push(
      eq(projects.subcontractorCompanyId, adminCompanyId),
      eq(projects.generalContractorCompanyId, adminCompanyId),
      eq(projects.ownerCompanyId, adminCompanyId),
    );
  }
  return db
    .select()
    .from(projects)
    .where(or(...conditions))
    .orderBy(projects.name);
}

export async function rolesByProject(db: Executor, userId: string, projectIds: string[]) {
  if (projectIds.length === 0) return [];
  return db
    .select({ projectId: projectMembers.projectId, role: projectMembers.role })
    .from(projectMembers)
    .where(and(eq(projectMembers.userId, userId), inArray(projectMembers.projectId, projectIds)));
}

export async function findCompanies(db: Executor, ids: string[]) {
  if (ids.length === 0) return [];
  return db.select().from(companies).where(inArray(companies.id, ids));
}

export async function listMembers(db: Executor, projectId: string) {
  return db
    .select({
      userId: user.id,
      name: user.name,
      email: user.email,
      role: projectMembers.role,
      companyId: companies.id,
      companyName: companies.name,
    })
    .from(projectMembers)
    .innerJoin(user, eq(user.id, projectMembers.userId))
    .leftJoin(companyMembers, eq(companyMembers.userId, user.id))
    .leftJoin(companies, eq(companies.id, companyMembers.companyId))
    .where(eq(projectMembers.projectId, projectId))
    .orderBy(projectMembers.role, user.name);
}

/** Certified (frozen) pay applications of a project, newest first: their earned, retainage and paid cents. */
export async function certifiedPayApps(db: Executor, projectId: string) {
  return db
    .select({
      number: payApps.number,
      earnedToDateCents: payApps.earnedToDateCents,
      retainageCents: payApps.retainageCents,
      paidCents: payApps.paidCents,
    })
    .from(payApps)
    .where(and(eq(payApps.projectId, projectId), inArray(payApps.status, [...FROZEN_STATUSES])))
    .orderBy(desc(payApps.number));
}
