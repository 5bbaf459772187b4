import type { AccessRole } from '../../../src/shared/constants';
import { tallyCan, type TallyCan } from '../../../src/shared/policies/tallies';
import type {
  EvidenceKind,
  EvidenceView,
  TallyResult,
  TallySummaryView,
  TallyRevisionView,
  TallyView,
} from '../../../src/shared/schemas/tally';
import type { EvidenceRow, RevisionRow, TallyJoined, TallySummaryRow } from './tallies.repository';

export function presentTally(row: TallyJoined, evidenceCount: number, can: TallyCan): TallyView {
  const { tally } = row;
  return {
    id: tally.id,
    projectId: tally.projectId,
    bidItem: row.bidItem,
    measuredOn: tally.measuredOn,
    title: tally.title,
    method: tally.method,
    inputs: (tally.inputs as Record<string, unknown> | null) ?? null,
    result: (tally.result as TallyResult | null) ?? null,
    quantity: tally.quantity,
    manualBasis: tally.manualBasis,
    sanityReason: tally.sanityReason,
    status: tally.status,
    payAppId: tally.payAppId,
    author: { id: tally.authorUserId, name: row.authorName },
    evidenceCount,
    createdAt: tally.createdAt.toISOString(),
    updatedAt: tally.updatedAt.toISOString(),
    can,
  };
}

/** A tally in a list, with what the reader may do with it (`can`, from the tally policy and its application). */
export function presentTallySummary(
  row: TallySummaryRow,
  evidenceCount: number,
  roles: AccessRole[],
): TallySummaryView {
  const { tally } = row;
  return {
    id: tally.id,
    projectId: tally.projectId,
    bidItem: row.bidItem,
    measuredOn: tally.measuredOn,
    title: tally.title,
    method: tally.method,
    quantity: tally.quantity,
    status: tally.status,
    payAppId: tally.payAppId,
    author: { id: tally.authorUserId, name: row.authorName },
    evidenceCount,
    createdAt: tally.createdAt.toISOString(),
    updatedAt: tally.updatedAt.toISOString(),
    can: tallyCan(roles, { status: tally.status, payAppStatus: row.payAppStatus }),
  };
}

export function presentEvidence(row: EvidenceRow, uploadedBy: string): EvidenceView {
  return {
    id: row.id,
    tallyId: row.tallyId,
    fileName: row.fileName,
    contentType: row.contentType,
    kind: row.kind as EvidenceKind,
    sizeBytes: row.sizeBytes,
    sha256: row.sha256,
    uploadedBy,
    createdAt: row.createdAt.toISOString(),
    downloadUrl: `/api/evidence/${row.id}/download`,
  };
}

export function presentRevision(row: RevisionRow, replacedBy: string): TallyRevisionView {
  return {
    revision: row.revision,
    savedAt: row.savedAt.toISOString(),
    replacedAt: row.createdAt.toISOString(),
    replacedBy,
    measuredOn: row.measuredOn,
    title: row.title,
    method: row.method,
    bidItemId: row.bidItemId,
    quantity: row.quantity,
    inputs: (row.inputs as Record<string, unknown> | null) ?? null,
    trail: (row.result as TallyResult | null)?.trail ?? [],
  };
}
