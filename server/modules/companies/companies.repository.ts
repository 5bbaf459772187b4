import { asc, eq, inArray, or } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { companies, projectMembers, projects } from '../../db/schema';

/**
 * The companies a person may see listed: their own, the parties of the projects they hold a seat on, and, for
 * someone who sets up projects, the companies of the kinds a project names (subcontractors and owners).
 */
export async function listedCompanies(
  db: Executor,
  opts: { userId: string; companyId: string | null; adminCompanyId: string | null; setsUpProjects: boolean },
) {
  const seatedOn = db
    .select({ id: projectMembers.projectId })
    .from(projectMembers)
    .where(eq(projectMembers.userId, opts.userId));
  const visible = [inArray(projects.id, seatedOn)];
  if (opts.adminCompanyId) {
    visible.push(
      eq(projects.subcontractorCompanyId, opts.adminCompanyId),
      eq(projects.generalContractorCompanyId, opts.adminCompanyId),
      eq(projects.ownerCompanyId, opts.adminCompanyId),
    );
  }
  const partyOf = (
    column:
      | typeof projects.subcontractorCompanyId
      | typeof projects.generalContractorCompanyId
      | typeof projects.ownerCompanyId,
  ) =>
    db
      .select({ id: column })
      .from(projects)
      .where(or(...visible));
  const conditions = [
    inArray(companies.id, partyOf(projects.subcontractorCompanyId)),
    inArray(companies.id, partyOf(projects.generalContractorCompanyId)),
    inArray(companies.id, partyOf(projects.ownerCompanyId)),
  ];
  if (opts.companyId) conditions.push(eq(companies.id, opts.companyId));
  if (opts.setsUpProjects) conditions.push(inArray(companies.kind, ['subcontractor', 'owner']));
  return db
    .select()
    .from(companies)
    .where(or(...conditions))
    .orderBy(asc(companies.name));
}
