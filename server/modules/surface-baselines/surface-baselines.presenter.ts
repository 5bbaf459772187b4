import type { SurfaceBaselineView } from '../../../src/shared/schemas/surface-baseline';
import type { AccessRole } from '../../../src/shared/constants';
import { baselineCan } from '../../../src/shared/policies/surface-baselines';
import type { BaselineSummaryRow } from './surface-baselines.repository';

const accepted = (by: string | null, at: Date | null, names: Map<string, string>) =>
  by && at ? { name: names.get(by) ?? '', at: at.toISOString() } : null;

export function presentBaseline(
  row: BaselineSummaryRow,
  names: Map<string, string>,
  roles: AccessRole[],
): SurfaceBaselineView {
  return {
    id: row.id,
    projectId: row.projectId,
    area: row.area,
    status: row.status,
    fileName: row.fileName,
    sizeBytes: row.sizeBytes,
    sha256: row.sha256,
    surfaceName: row.surfaceName,
    pointCount: row.pointCount,
    linearUnit: row.linearUnit,
    elevationUnit: row.elevationUnit,
    unitsFrom: row.unitsFrom === 'recorder' ? 'recorder' : 'file',
    pointOrder: row.pointOrder === 'PNEZD' || row.pointOrder === 'PENZD' ? row.pointOrder : null,
    replacesId: row.replacesId,
    recordedBy: names.get(row.recordedByUserId) ?? '',
    recordedAt: row.createdAt.toISOString(),
    subcontractorAccepted: accepted(row.subAcceptedByUserId, row.subAcceptedAt, names),
    generalContractorAccepted: accepted(row.gcAcceptedByUserId, row.gcAcceptedAt, names),
    lockedAt: row.lockedAt?.toISOString() ?? null,
    replacedAt: row.replacedAt?.toISOString() ?? null,
    downloadUrl: `/api/surface-baselines/${row.id}/download`,
    can: baselineCan(roles, {
      status: row.status,
      subAccepted: row.subAcceptedAt !== null,
      gcAccepted: row.gcAcceptedAt !== null,
    }),
  };
}

/** Ids of the people a row names. */
export const peopleOf = (r: BaselineSummaryRow) => [r.recordedByUserId, r.subAcceptedByUserId, r.gcAcceptedByUserId];
