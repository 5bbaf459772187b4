import { and, asc, count, eq, inArray, isNotNull, isNull, lte } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import {
  bidItemProfiles,
  changeOrderItems,
  changeOrders,
  forceAccountSheets,
  materialSources,
  payAppForceAccountLines,
  scaleTickets,
  trucks,
  truckTickets,
} from '../../db/schema';

export type ForceAccountLineRow = typeof payAppForceAccountLines.$inferSelect;

/** Load tickets of `itemIds` delivered up to `periodEnd` and not yet paid on any application. */
export function unpaidTruckTickets(tx: Executor, projectId: string, itemIds: string[], periodEnd: string) {
  if (itemIds.length === 0) return Promise.resolve([]);
  return tx
    .select({
      id: truckTickets.id,
      truckLabel: truckTickets.truckLabel,
      date: truckTickets.deliveredOn,
      bidItemId: truckTickets.bidItemId,
      loadVolumeCy: truckTickets.loadVolumeCy,
    })
    .from(truckTickets)
    .where(
      and(
        eq(truckTickets.projectId, projectId),
        inArray(truckTickets.bidItemId, itemIds),
        lte(truckTickets.deliveredOn, periodEnd),
        isNull(truckTickets.payAppId),
      ),
    )
    .orderBy(asc(truckTickets.deliveredOn), asc(truckTickets.createdAt));
}

/** Scale tickets of `itemIds` weighed up to `periodEnd` and not yet paid on any application. */
export function unpaidScaleTickets(tx: Executor, projectId: string, itemIds: string[], periodEnd: string) {
  if (itemIds.length === 0) return Promise.resolve([]);
  return tx
    .select({
      id: scaleTickets.id,
      ticketNumber: scaleTickets.ticketNumber,
      date: scaleTickets.weighedOn,
      bidItemId: scaleTickets.bidItemId,
      sourceId: scaleTickets.sourceId,
      netTons: scaleTickets.netTons,
      moisturePercent: scaleTickets.moisturePercent,
    })
    .from(scaleTickets)
    .where(
      and(
        eq(scaleTickets.projectId, projectId),
        inArray(scaleTickets.bidItemId, itemIds),
        lte(scaleTickets.weighedOn, periodEnd),
        isNull(scaleTickets.payAppId),
      ),
    )
    .orderBy(asc(scaleTickets.weighedOn), asc(scaleTickets.ticketNumber));
}

export function projectTrucks(tx: Executor, projectId: string) {
  return tx
    .select({ label: trucks.label, bedVolumeCy: trucks.bedVolumeCy })
    .from(trucks)
    .where(eq(trucks.projectId, projectId));
}

export function projectSources(tx: Executor, projectId: string) {
  return tx
    .select({
      id: materialSources.id,
      factorUsed: materialSources.factorUsed,
      statedMoisturePercent: materialSources.statedMoisturePercent,
    })
    .from(materialSources)
    .where(eq(materialSources.projectId, projectId));
}

/** Marks tickets paid on `payAppId`; answers how many were still unpaid (a count short of the list: a race). */
export async function markTicketsPaid(tx: Executor, payAppId: string, truckIds: string[], scaleIds: string[]) {
  let marked = 0;
  if (truckIds.length > 0) {
    const rows = await tx
      .update(truckTickets)
      .set({ payAppId })
      .where(and(inArray(truckTickets.id, truckIds), isNull(truckTickets.payAppId)))
      .returning({ id: truckTickets.id });
    marked += rows.length;
  }
  if (scaleIds.length > 0) {
    const rows = await tx
      .update(scaleTickets)
      .set({ payAppId })
      .where(and(inArray(scaleTickets.id, scaleIds), isNull(scaleTickets.payAppId)))
      .returning({ id: scaleTickets.id });
    marked += rows.length;
  }
  return marked;
}

/** Daily sheets signed by both sides, worked up to `periodEnd`, not yet paid. */
export function unpaidSignedSheets(tx: Executor, projectId: string, periodEnd: string) {
  return tx
    .select({
      id: forceAccountSheets.id,
      changeOrderId: forceAccountSheets.changeOrderId,
      totalCents: forceAccountSheets.totalCents,
    })
    .from(forceAccountSheets)
    .where(
      and(
        eq(forceAccountSheets.projectId, projectId),
        lte(forceAccountSheets.workedOn, periodEnd),
        isNull(forceAccountSheets.payAppId),
        isNotNull(forceAccountSheets.contractorSignedAt),
        isNotNull(forceAccountSheets.gcSignedAt),
      ),
    )
    .orderBy(asc(forceAccountSheets.workedOn));
}

export async function markSheetsPaid(tx: Executor, payAppId: string, ids: string[]) {
  if (ids.length === 0) return 0;
  const rows = await tx
    .update(forceAccountSheets)
    .set({ payAppId })
    .where(and(inArray(forceAccountSheets.id, ids), isNull(forceAccountSheets.payAppId)))
    .returning({ id: forceAccountSheets.id });
  return rows.length;
}

export function forceAccountLines(tx: Executor, payAppId: string): Promise<ForceAccountLineRow[]> {
  return tx
    .select()
    .from(payAppForceAccountLines)
    .where(eq(payAppForceAccountLines.payAppId, payAppId))
    .orderBy(asc(payAppForceAccountLines.sortOrder));
}

export function projectChangeOrders(tx: Executor, projectId: string) {
  return tx
    .select({ id: changeOrders.id, number: changeOrders.number, title: changeOrders.title })
    .from(changeOrders)
    .where(eq(changeOrders.projectId, projectId));
}

/** The tickets a pay application paid on one bid item (the line's backup), by date. */
export async function ticketsPaidOn(tx: Executor, payAppId: string, bidItemId: string) {
  const [loads, weighed] = await Promise.all([
    tx
      .select()
      .from(truckTickets)
      .where(and(eq(truckTickets.payAppId, payAppId), eq(truckTickets.bidItemId, bidItemId)))
      .orderBy(asc(truckTickets.deliveredOn), asc(truckTickets.createdAt)),
    tx
      .select()
      .from(scaleTickets)
      .where(and(eq(scaleTickets.payAppId, payAppId), eq(scaleTickets.bidItemId, bidItemId)))
      .orderBy(asc(scaleTickets.weighedOn), asc(scaleTickets.ticketNumber)),
  ]);
  return { loads, weighed };
}

/**
 * For each change order among `changeOrderIds`, the bid item it added that is paid by force account (its
 * allowance: the days draw on that item's value), by change order.
 */
export async function allowanceItems(tx: Executor, changeOrderIds: string[]): Promise<Map<string, string>> {
  if (changeOrderIds.length === 0) return new Map();
  const rows = await tx
    .select({ changeOrderId: changeOrderItems.changeOrderId, bidItemId: changeOrderItems.bidItemId })
    .from(changeOrderItems)
    .innerJoin(bidItemProfiles, eq(bidItemProfiles.bidItemId, changeOrderItems.bidItemId))
    .where(
      and(
        inArray(changeOrderItems.changeOrderId, changeOrderIds),
        eq(changeOrderItems.kind, 'add_item'),
        eq(bidItemProfiles.profile, 'force_account'),
      ),
    );
  return new Map(rows.flatMap((r) => (r.bidItemId ? [[r.changeOrderId, r.bidItemId] as const] : [])));
}

/** How many tickets (loads and weighings) the application paid on each bid item: those lines' backup. */
export async function ticketCountsByItem(tx: Executor, payAppId: string): Promise<Map<string, number>> {
  const [loads, weighed] = await Promise.all([
    tx
      .select({ bidItemId: truckTickets.bidItemId, n: count() })
      .from(truckTickets)
      .where(eq(truckTickets.payAppId, payAppId))
      .groupBy(truckTickets.bidItemId),
    tx
      .select({ bidItemId: scaleTickets.bidItemId, n: count() })
      .from(scaleTickets)
      .where(eq(scaleTickets.payAppId, payAppId))
      .groupBy(scaleTickets.bidItemId),
  ]);
  const counts = new Map<string, number>();
  for (const r of [...loads, ...weighed]) counts.set(r.bidItemId, (counts.get(r.bidItemId) ?? 0) + Number(r.n));
  return counts;
}
