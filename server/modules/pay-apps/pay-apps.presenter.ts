import type { DisputeView, PayAppLineView, PayAppSummary } from '../../../src/shared/schemas/pay-app';
import type { disputesOf, LineRow, PayAppRow } from './pay-apps.repository';

export function presentSummary(row: PayAppRow, certifiedBy: string | null = null): PayAppSummary {
  return {
    id: row.id,
    projectId: row.projectId,
    number: row.number,
    revision: row.revision,
    status: row.status,
    periodStart: row.periodStart,
    periodEnd: row.periodEnd,
    isFinal: row.isFinal,
    retainageBps: row.retainageBps,
    earnedToDateCents: row.earnedToDateCents,
    thisPeriodCents: row.thisPeriodCents,
    retainageCents: row.retainageCents,
    previousCertifiedCents: row.previousCertifiedCents,
    currentDueCents: row.currentDueCents,
    paidCents: row.paidCents,
    submittedAt: row.submittedAt?.toISOString() ?? null,
    certifiedAt: row.certifiedAt?.toISOString() ?? null,
    certifiedBy,
    createdAt: row.createdAt.toISOString(),
  };
}

export function presentLine(l: LineRow): PayAppLineView {
  return {
    id: l.id,
    bidItemId: l.bidItemId,
    itemNumber: l.itemNumber,
    description: l.description,
    payUnit: l.payUnit,
    unitPriceCents: l.unitPriceCents,
    contractQuantity: l.contractQuantity,
    previousQuantity: l.previousQuantity,
    thisPeriodQuantity: l.thisPeriodQuantity,
    toDateQuantity: l.toDateQuantity,
    previousAmountCents: l.previousAmountCents,
    thisPeriodAmountCents: l.thisPeriodAmountCents,
    amountToDateCents: l.amountToDateCents,
    retainageCents: l.retainageCents,
    reviewStatus: l.reviewStatus,
  };
}

export function presentDisputes({ rows, comments, resolvers }: Awaited<ReturnType<typeof disputesOf>>): DisputeView[] {
  return rows.map(({ d, openedBy }) => ({
    id: d.id,
    lineId: d.lineId,
    revision: d.revision,
    reason: d.reason,
    counterQuantity: d.counterQuantity,
    status: d.status,
    resolution: d.resolution,
    resolutionNote: d.resolutionNote,
    openedBy,
    resolvedBy: d.resolvedByUserId ? (resolvers.get(d.resolvedByUserId) ?? null) : null,
    createdAt: d.createdAt.toISOString(),
    resolvedAt: d.resolvedAt?.toISOString() ?? null,
    comments: comments.filter((c) => c.c.disputeId === d.id).map((c) => ({ id: c.c.id, author: c.author, body: c.c.body, createdAt: c.c.createdAt.toISOString() })),
  }));
}
