import type { AccessRole, ProjectRole } from '../../../src/shared/constants';
import type { Actor } from '../../lib/actor';

/** The parts of a project its access rules look at. */
export type ProjectParties = {
  subcontractorCompanyId: string;
  generalContractorCompanyId: string;
  ownerCompanyId: string;
};

/**
 * Effective roles of an actor on a project: the roles the person was given on it, plus `admin` when the person
 * administers one of the project's three companies.
 */
export function accessRoles(actor: Actor, project: ProjectParties, memberRoles: ProjectRole[]): AccessRole[] {
  const roles: AccessRole[] = [...new Set(memberRoles)];
  const parties = [project.subcontractorCompanyId, project.generalContractorCompanyId, project.ownerCompanyId];
  if (actor.isAdmin && actor.companyId && parties.includes(actor.companyId)) roles.push('admin');
  return roles;
}

export const canReadProject = (roles: AccessRole[]) => roles.length > 0;

/** Contract settings and the bid schedule belong to the general contractor's side. */
export const canManageContract = (roles: AccessRole[]) => roles.includes('general_contractor') || roles.includes('admin');

export const canManagePeople = canManageContract;

/** Projects are set up by a general contractor's people (or its admin). */
export const canCreateProject = (actor: Actor) => actor.companyKind === 'general_contractor';
