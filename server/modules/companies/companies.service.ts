import type { CompanyView } from '../../../src/shared/schemas/project';
import type { Db } from '../../db/client';
import type { Actor } from '../../lib/actor';
import { canCreateProject } from '../../../src/shared/policies/projects';
import { presentCompany } from '../projects/projects.presenter';
import { listedCompanies } from './companies.repository';

/**
 * Companies listed to a person: their own and their jobs' parties; a general contractor's people, who set up
 * jobs, also see the subcontractor and owner companies a new job can name (names and kinds only, never people).
 */
export async function listCompanies(db: Db, actor: Actor): Promise<CompanyView[]> {
  const rows = await listedCompanies(db, {
    userId: actor.userId,
    companyId: actor.companyId,
    adminCompanyId: actor.isAdmin ? actor.companyId : null,
    setsUpProjects: canCreateProject(actor),
  });
  return rows.map(presentCompany);
}
