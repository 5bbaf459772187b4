import type { LienWaiverView } from '../../../src/shared/schemas/payment';
import type { LienWaiverRow } from './lien-waivers.repository';

export function presentWaiver(row: LienWaiverRow, payAppNumber: number): LienWaiverView {
  return {
    id: row.id,
    projectId: row.projectId,
    payAppId: row.payAppId,
    payAppNumber,
    paymentId: row.paymentId,
    kind: row.kind,
    amountCents: row.amountCents,
    throughDate: row.throughDate,
    signedName: row.signedName,
    signedByUserId: row.signedByUserId,
    signedAt: row.signedAt.toISOString(),
    downloadUrl: `/api/lien-waivers/${row.id}/pdf`,
    exceptions: row.exceptions,
  };
}
