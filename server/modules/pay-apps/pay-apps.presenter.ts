import { HOLD_REASON_LABELS, type TicketHold } from '../../../src/shared/domain/provisions/ticket-pay';
import type { PayAppForceAccountView, TicketHoldView } from '../../../src/shared/schemas/pay-app';
import type { ForceAccountLineRow } from './pay-app-records.repository';
import type { DisputeView, PayAppDetail, PayAppLineView, PayAppSummary } from '../../../src/shared/schemas/pay-app';
import type { PayAppDetailRow, PayAppRow } from './pay-apps.repository';

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
    adjustmentsCents: row.adjustmentsCents,
    currentDueCents: row.currentDueCents,
    paidCents: row.paidCents,
    submittedAt: row.submittedAt?.toISOString() ?? null,
    certifiedAt: row.certifiedAt?.toISOString() ?? null,
    certifiedBy,
    createdAt: row.createdAt.toISOString(),
  };
}

export function presentLine(l: PayAppDetailRow['lines'][number]): PayAppLineView {
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
    storedMaterialsCents: l.storedMaterialsCents,
    paidFrom: l.paidFrom,
    reviewStatus: l.reviewStatus,
  };
}

export function presentHistory(h: PayAppDetailRow['history'][number]): PayAppDetail['history'][number] {
  return {
    id: h.id,
    fromStatus: h.fromStatus,
    toStatus: h.toStatus,
    revision: h.revision,
    note: h.note,
    actor: h.actor?.name ?? null,
    createdAt: h.createdAt.toISOString(),
  };
}

export function presentDispute(d: PayAppDetailRow['disputes'][number]): DisputeView {
  return {
    id: d.id,
    lineId: d.lineId,
    revision: d.revision,
    reason: d.reason,
    counterQuantity: d.counterQuantity,
    status: d.status,
    resolution: d.resolution,
    resolutionNote: d.resolutionNote,
    openedBy: d.openedBy.name,
    resolvedBy: d.resolvedBy?.name ?? null,
    createdAt: d.createdAt.toISOString(),
    resolvedAt: d.resolvedAt?.toISOString() ?? null,
    comments: d.comments.map((c) => ({
      id: c.id,
      author: c.author.name,
      body: c.body,
      createdAt: c.createdAt.toISOString(),
    })),
  };
}

export function presentTally(t: PayAppDetailRow['tallies'][number]): PayAppDetail['tallies'][number] {
  return { id: t.id, bidItemId: t.bidItemId, measuredOn: t.measuredOn, title: t.title, quantity: t.quantity };
}

export function presentForceAccountLine(l: ForceAccountLineRow): PayAppForceAccountView {
  return {
    id: l.id,
    changeOrderId: l.changeOrderId,
    changeOrderNumber: l.changeOrderNumber,
    title: l.title,
    days: l.days,
    previousAmountCents: l.previousAmountCents,
    thisPeriodAmountCents: l.thisPeriodAmountCents,
    amountToDateCents: l.amountToDateCents,
    retainageCents: l.retainageCents,
  };
}

/** Held tickets with their item's number and each reason in words (HOLD_REASON_LABELS). */
export function presentHolds(holds: TicketHold[], itemNumber: Map<string, string>): TicketHoldView[] {
  return holds.map((h) => ({
    kind: h.kind,
    ticketId: h.ticketId,
    label: h.label,
    date: h.date,
    bidItemId: h.bidItemId,
    itemNumber: itemNumber.get(h.bidItemId) ?? '',
    reasons: h.reasons.map((r) => HOLD_REASON_LABELS[r]),
  }));
}
