import type { ProjectRole } from '../../../src/shared/constants';
import { sumCents } from '../../../src/shared/domain/money';
import {
  PROJECT_DEFAULTS,
  type CreateProjectInput,
  type ProjectSummaryView,
  type ProjectView,
  type UpdateProjectInput,
} from '../../../src/shared/schemas/project';
import type { Db, Executor } from '../../db/client';
import { projectMembers, projects } from '../../db/schema';
import type { Actor } from '../../lib/actor';
import { forbidden, validationFailed } from '../../lib/app-error';
import { recordAudit } from '../audit/audit.repository';
import { contractLockedSince } from '../bid-items/bid-items.repository';
import { loadContract } from '../change-orders/contract-quantities.repository';
import { eq } from 'drizzle-orm';
import { loadProjectAccess } from './project-access';
import { accessRoles, canCreateProject, canManageContract } from '../../../src/shared/policies/projects';
import {
  presentCompany,
  presentProject,
  presentProjectSummary,
  presentSettings,
  type ProjectTotals,
} from './projects.presenter';
import * as repo from './projects.repository';

/** Original, approved changes and current contract sum of each project (the shared contract function). */
async function totalsFor(db: Executor, projectIds: string[]): Promise<Map<string, ProjectTotals>> {
  const totals = new Map<string, ProjectTotals>();
  // Sequential on purpose: inside a transaction the queries share one connection.
  for (const id of projectIds) {
    const contract = await loadContract(db, id);
    const lockedSince = await contractLockedSince(db, id);
    totals.set(id, {
      originalContractSumCents: contract.originalContractSumCents,
      approvedChangesCents: contract.approvedChangesCents,
      contractSumCents: contract.contractSumCents,
      contractLocked: lockedSince !== null,
      bidItemCount: contract.items.length,
    });
  }
  return totals;
}

export async function listProjects(db: Db, actor: Actor): Promise<ProjectSummaryView[]> {
  const rows = await repo.listVisibleProjects(db, actor.userId, actor.isAdmin ? actor.companyId : null);
  const ids = rows.map((r) => r.id);
  const [roleRows, totals] = await Promise.all([repo.rolesByProject(db, actor.userId, ids), totalsFor(db, ids)]);
  return rows.map((row) => {
    const mine = roleRows.filter((r) => r.projectId === row.id).map((r) => r.role);
    return presentProjectSummary(row, accessRoles(actor, row, mine), totals.get(row.id)!);
  });
}

export async function getProject(db: Db, actor: Actor, projectId: string): Promise<ProjectView> {
  const { project, roles } = await loadProjectAccess(db, actor, projectId);
  return viewOf(db, project, roles);
}

async function viewOf(db: Executor, project: repo.ProjectRow, roles: ProjectView['myRoles']): Promise<ProjectView> {
  const companyIds = [project.subcontractorCompanyId, project.generalContractorCompanyId, project.ownerCompanyId];
  // Sequential on purpose: inside a transaction the queries share one connection.
  const companyRows = await repo.findCompanies(db, companyIds);
  const members = await repo.listMembers(db, project.id);
  const totals = await totalsFor(db, [project.id]);
  const certified = await repo.certifiedPayApps(db, project.id);
  const money = {
    earnedToDateCents: certified[0]?.earnedToDateCents ?? 0,
    retainageHeldCents: certified[0]?.retainageCents ?? 0,
    paidToDateCents: sumCents(certified.map((a) => a.paidCents)),
  };
  const company = (id: string) => presentCompany(companyRows.find((c) => c.id === id)!);
  return presentProject(
    project,
    roles,
    totals.get(project.id)!,
    {
      subcontractor: company(project.subcontractorCompanyId),
      generalContractor: company(project.generalContractorCompanyId),
      owner: company(project.ownerCompanyId),
    },
    members,
    money,
  );
}

/** A general contractor sets up a project with a subcontractor and an owner; the creator joins as its GC. */
export async function createProject(db: Db, actor: Actor, input: CreateProjectInput): Promise<ProjectView> {
  if (!canCreateProject(actor) || !actor.companyId) {
    throw forbidden('Only people of a general contractor company can set up a project.');
  }
  const gcCompanyId = actor.companyId;
  const parties = await repo.findCompanies(db, [input.subcontractorCompanyId, input.ownerCompanyId]);
  const problems = [];
  if (parties.find((c) => c.id === input.subcontractorCompanyId)?.kind !== 'subcontractor') {
    problems.push({ path: 'subcontractorCompanyId', message: 'Choose a subcontractor company.' });
  }
  if (parties.find((c) => c.id === input.ownerCompanyId)?.kind !== 'owner') {
    problems.push({ path: 'ownerCompanyId', message: 'Choose an owner company.' });
  }
  if (problems.length > 0) throw validationFailed(problems);
  const { name, subcontractorCompanyId, ownerCompanyId, ...settings } = input;
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(projects)
      .values({
        ...PROJECT_DEFAULTS,
        ...settings,
        name,
        subcontractorCompanyId,
        ownerCompanyId,
        generalContractorCompanyId: gcCompanyId,
      })
      .returning();
    const project = row!;
    const role: ProjectRole = 'general_contractor';
    await tx.insert(projectMembers).values({ projectId: project.id, userId: actor.userId, role });
    await recordAudit(tx, {
      projectId: project.id,
      actorUserId: actor.userId,
      objectType: 'project',
      objectId: project.id,
      action: 'project.created',
      after: { name, ...presentSettings(project) },
    });
    return viewOf(tx, project, accessRoles(actor, project, [role]));
  });
}

export async function updateProject(db: Db, actor: Actor, projectId: string, input: UpdateProjectInput) {
  const { project: before, roles } = await loadProjectAccess(db, actor, projectId, canManageContract);
  return db.transaction(async (tx) => {
    const [after] = await tx.update(projects).set(input).where(eq(projects.id, projectId)).returning();
    await recordAudit(tx, {
      projectId,
      actorUserId: actor.userId,
      objectType: 'project',
      objectId: projectId,
      action: 'project.updated',
      before: { name: before.name, ...presentSettings(before) },
      after: { name: after!.name, ...presentSettings(after!) },
    });
    return viewOf(tx, after!, roles);
  });
}
