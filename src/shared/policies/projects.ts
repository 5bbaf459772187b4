import {
  ADMIN_ROLE_OF,
  ADMIN_ROLES,
  type AccessRole,
  type AdminRole,
  type CompanyKind,
  type ProjectRole,
} from '../constants';
import { canProposeChangeOrder } from './change-orders';
import { canKeepFieldRecords, canRecordAdjustment, canSetMeasurementProfile, canSignDailySheet } from './field-records';
import { canIssueWaiver } from './lien-waivers';
import { canCreatePayApp, canSeePayApp } from './pay-apps';
import { canPay } from './payments';
import { canWriteTallies } from './tallies';

/** The parts of the signed-in person these rules look at (the server's Actor has them). */
type Person = { companyId: string | null; companyKind: CompanyKind | null; isAdmin: boolean };

/** The parts of a project its access rules look at. */
export type ProjectParties = {
  subcontractorCompanyId: string;
  generalContractorCompanyId: string;
  ownerCompanyId: string;
};

/** The company whose people hold a party seat of the project. */
export function seatCompanyId(project: ProjectParties, role: ProjectRole): string {
  if (role === 'subcontractor') return project.subcontractorCompanyId;
  if (role === 'general_contractor') return project.generalContractorCompanyId;
  return project.ownerCompanyId;
}

/** The seat a company fills on a project, or null when the company is not one of its three parties. */
export function seatOfCompany(project: ProjectParties, companyId: string | null): ProjectRole | null {
  if (!companyId) return null;
  if (companyId === project.subcontractorCompanyId) return 'subcontractor';
  if (companyId === project.generalContractorCompanyId) return 'general_contractor';
  if (companyId === project.ownerCompanyId) return 'owner';
  return null;
}

/**
 * Effective roles of an actor on a project. A seat counts only while the person belongs to the company that fills
 * it (someone who left the company keeps no power through an old row), and the admin of a party company gets that
 * company's admin role: it manages its own company's people, never another company's, and never the contract
 * unless it is the general contractor's.
 */
export function accessRoles(actor: Person, project: ProjectParties, memberRoles: ProjectRole[]): AccessRole[] {
  const seat = seatOfCompany(project, actor.companyId);
  const roles: AccessRole[] = [...new Set(memberRoles)].filter((r) => r === seat);
  if (seat && actor.isAdmin) roles.push(ADMIN_ROLE_OF[seat]);
  return roles;
}

export const isAdminRole = (role: AccessRole): role is AdminRole => (ADMIN_ROLES as readonly string[]).includes(role);

export const canReadProject = (roles: AccessRole[]) => roles.length > 0;

/** Contract settings (prices, retainage, approval rules) and the bid schedule belong to the general contractor's side. */
export const canManageContract = (roles: AccessRole[]) =>
  roles.includes('general_contractor') || roles.includes('general_contractor_admin');

/** People are managed by their own company's admin: each party admin invites and removes its company's people. */
export const canManagePeople = (roles: AccessRole[]) => roles.some(isAdminRole);

/** The seat whose people an admin manages (its company's), or null for someone who is no admin here. */
export function managedSeat(roles: AccessRole[]): ProjectRole | null {
  const admin = roles.find(isAdminRole);
  return admin ? (admin.replace(/_admin$/, '') as ProjectRole) : null;
}

/** Projects are set up by a general contractor's people (or its admin). */
export const canCreateProject = (actor: Pick<Person, 'companyKind'>) => actor.companyKind === 'general_contractor';

/** What the signed-in person may start outside any project; GET /api/session attaches it. */
export type PersonCan = { createProject: boolean };

export const personCan = (actor: Pick<Person, 'companyKind'>): PersonCan => ({
  createProject: canCreateProject(actor),
});

/** What the person may start on the project; the project's presenter attaches it, screens read it. */
export type ProjectCan = {
  /** Contract settings and the bid schedule (the general contractor's side). */
  manageContract: boolean;
  createTally: boolean;
  createPayApp: boolean;
  /** Sees applications before certification (the contractors' sides); the owner's side sees certified ones. */
  seeDraftPayApps: boolean;
  pay: boolean;
  issueWaiver: boolean;
  /** Propose a change order (and forecast quantities, which end in one). */
  proposeChangeOrder: boolean;
  /** Choose how each item is measured and paid, and its stages (the contract's side). */
  setMeasurementProfile: boolean;
  /** Keep field records: trucks, tickets, sources, stored materials. */
  keepFieldRecords: boolean;
  /** Sign a force account daily sheet for one's own side. */
  signDailySheet: boolean;
  /** Record deductions and adjustments (the payer's side of the contract). */
  recordAdjustment: boolean;
  /** Invite and remove people of one's own company on this project. */
  managePeople: boolean;
};

export function projectCan(roles: AccessRole[]): ProjectCan {
  return {
    manageContract: canManageContract(roles),
    createTally: canWriteTallies(roles),
    createPayApp: canCreatePayApp(roles),
    seeDraftPayApps: canSeePayApp(roles, 'draft'),
    pay: canPay(roles),
    issueWaiver: canIssueWaiver(roles),
    proposeChangeOrder: canProposeChangeOrder(roles),
    setMeasurementProfile: canSetMeasurementProfile(roles),
    keepFieldRecords: canKeepFieldRecords(roles),
    signDailySheet: canSignDailySheet(roles),
    recordAdjustment: canRecordAdjustment(roles),
    managePeople: canManagePeople(roles),
  };
}
