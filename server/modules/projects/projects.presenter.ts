import { managedSeat, projectCan } from '../../../src/shared/policies/projects';
import type { AccessRole } from '../../../src/shared/constants';
import type {
  CompanyView,
  ProjectMemberView,
  ProjectSettings,
  ProjectSummaryView,
  ProjectView,
} from '../../../src/shared/schemas/project';
import type { ProjectRow } from './projects.repository';

export type ProjectTotals = {
  originalContractSumCents: number;
  approvedChangesCents: number;
  contractSumCents: number;
  contractLocked: boolean;
  bidItemCount: number;
};

export function presentProjectSummary(
  row: ProjectRow,
  myRoles: AccessRole[],
  totals: ProjectTotals,
): ProjectSummaryView {
  return {
    id: row.id,
    name: row.name,
    location: row.location,
    contractNumber: row.contractNumber,
    units: row.units,
    myRoles,
    can: projectCan(myRoles),
    managedSeat: managedSeat(myRoles),
    ...totals,
  };
}

export function presentSettings(row: ProjectRow): ProjectSettings {
  return {
    location: row.location,
    contractNumber: row.contractNumber,
    state: row.state,
    units: row.units,
    retainageBps: row.retainageBps,
    retainageReducedBps: row.retainageReducedBps,
    retainageReductionAtBps: row.retainageReductionAtBps,
    variationPreset: row.variationPreset,
    bandOverBps: row.bandOverBps,
    bandUnderBps: row.bandUnderBps,
    majorItemThresholdBps: row.majorItemThresholdBps,
    paymentTermsDays: row.paymentTermsDays,
    allowPartialPayments: row.allowPartialPayments,
    processingFeeBearer: row.processingFeeBearer,
    ownerApprovesChangeOrders: row.ownerApprovesChangeOrders,
    swellPercent: row.swellPercent,
    shrinkagePercent: row.shrinkagePercent,
  };
}

export function presentProject(
  row: ProjectRow,
  myRoles: AccessRole[],
  totals: ProjectTotals,
  companies: ProjectView['companies'],
  members: ProjectMemberView[],
  money: ProjectView['money'],
): ProjectView {
  return {
    ...presentProjectSummary(row, myRoles, totals),
    ...presentSettings(row),
    companies,
    members,
    money,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

export const presentCompany = (c: { id: string; name: string; kind: CompanyView['kind'] }): CompanyView => ({
  id: c.id,
  name: c.name,
  kind: c.kind,
});
