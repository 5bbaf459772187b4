import { and, eq, inArray, isNull, ne, sql } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { changeOrders, invitations, lienWaivers, payApps, payments, user } from '../../db/schema';

/**
 * Pay applications of these projects that are not paid in full, each with the time it entered its status (the
 * latest history row to that status; its creation for a draft never moved) and its open disputes.
 */
export async function unfinishedPayApps(db: Executor, projectIds: string[]) {
  if (projectIds.length === 0) return [];
  // Written out with table names: Drizzle leaves columns unqualified inside a selected expression.
  const enteredAt = sql<Date | string | null>`(select max(h.created_at) from pay_app_status_history h
    where h.pay_app_id = "pay_apps"."id" and h.to_status = "pay_apps"."status")`;
  const openDisputes = sql<number>`(select count(*)::int from disputes d where d.pay_app_id = "pay_apps"."id" and d.status = 'open')`;
  return db
    .select({
      id: payApps.id,
      projectId: payApps.projectId,
      number: payApps.number,
      revision: payApps.revision,
      status: payApps.status,
      periodStart: payApps.periodStart,
      periodEnd: payApps.periodEnd,
      isFinal: payApps.isFinal,
      currentDueCents: payApps.currentDueCents,
      paidCents: payApps.paidCents,
      certifiedAt: payApps.certifiedAt,
      submittedAt: payApps.submittedAt,
      createdAt: payApps.createdAt,
      enteredAt,
      openDisputes,
    })
    .from(payApps)
    .where(and(inArray(payApps.projectId, projectIds), ne(payApps.status, 'paid')))
    .orderBy(payApps.number);
}

/** Recently paid applications too: an unconditional waiver may still be owed on them. */
export async function paymentsOf(db: Executor, payAppIds: string[]) {
  if (payAppIds.length === 0) return [];
  return db
    .select({
      id: payments.id,
      payAppId: payments.payAppId,
      amountCents: payments.amountCents,
      status: payments.status,
      settledAt: payments.settledAt,
      createdAt: payments.createdAt,
    })
    .from(payments)
    .where(inArray(payments.payAppId, payAppIds))
    .orderBy(payments.createdAt);
}

export async function waiversOf(db: Executor, payAppIds: string[]) {
  if (payAppIds.length === 0) return [];
  return db
    .select({ payAppId: lienWaivers.payAppId, kind: lienWaivers.kind, paymentId: lienWaivers.paymentId })
    .from(lienWaivers)
    .where(inArray(lienWaivers.payAppId, payAppIds));
}

/** Paid applications with a settled payment whose unconditional waiver may not be issued yet. */
export async function paidPayApps(db: Executor, projectIds: string[]) {
  if (projectIds.length === 0) return [];
  const settledWithoutWaiver = sql<boolean>`exists (select 1 from ${payments} where ${payments.payAppId} = ${payApps.id}
    and ${payments.status} = 'succeeded' and not exists (select 1 from ${lienWaivers}
    where ${lienWaivers.paymentId} = ${payments.id} and ${lienWaivers.kind} in ('unconditional_progress', 'unconditional_final')))`;
  return db
    .select({
      id: payApps.id,
      projectId: payApps.projectId,
      number: payApps.number,
      status: payApps.status,
      isFinal: payApps.isFinal,
      currentDueCents: payApps.currentDueCents,
      paidCents: payApps.paidCents,
      certifiedAt: payApps.certifiedAt,
    })
    .from(payApps)
    .where(and(inArray(payApps.projectId, projectIds), eq(payApps.status, 'paid'), settledWithoutWaiver));
}

export async function proposedChangeOrders(db: Executor, projectIds: string[]) {
  if (projectIds.length === 0) return [];
  return db
    .select({
      id: changeOrders.id,
      projectId: changeOrders.projectId,
      number: changeOrders.number,
      title: changeOrders.title,
      gcApprovedAt: changeOrders.gcApprovedAt,
      ownerApprovedAt: changeOrders.ownerApprovedAt,
      createdAt: changeOrders.createdAt,
      proposedBy: user.name,
    })
    .from(changeOrders)
    .innerJoin(user, eq(user.id, changeOrders.proposedByUserId))
    .where(and(inArray(changeOrders.projectId, projectIds), eq(changeOrders.status, 'proposed')))
    .orderBy(changeOrders.number);
}

export async function unacceptedInvitations(db: Executor, projectIds: string[]) {
  if (projectIds.length === 0) return [];
  return db
    .select({
      id: invitations.id,
      projectId: invitations.projectId,
      email: invitations.email,
      role: invitations.role,
      expiresAt: invitations.expiresAt,
      createdAt: invitations.createdAt,
    })
    .from(invitations)
    .where(and(inArray(invitations.projectId, projectIds), isNull(invitations.acceptedAt)))
    .orderBy(invitations.createdAt);
}
