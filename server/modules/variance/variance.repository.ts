import { and, asc, eq, inArray, sql } from 'drizzle-orm';
import type { PayAppStatus } from '../../../src/shared/constants';
import type { Executor } from '../../db/client';
import {
  bidItemProfiles,
  changeOrderItems,
  changeOrders,
  forecasts,
  payAppForceAccountLines,
  payAppLines,
  payApps,
  user,
} from '../../db/schema';

/** Sum of this-period quantities per bid item over pay applications in the given statuses. */
export async function quantitiesByStatus(db: Executor, projectId: string, statuses: readonly PayAppStatus[]) {
  const rows = await db
    .select({ bidItemId: payAppLines.bidItemId, quantity: sql<string>`sum(${payAppLines.thisPeriodQuantity})` })
    .from(payAppLines)
    .innerJoin(payApps, eq(payApps.id, payAppLines.payAppId))
    .where(and(eq(payApps.projectId, projectId), inArray(payApps.status, [...statuses])))
    .groupBy(payAppLines.bidItemId);
  return new Map(rows.map((r) => [r.bidItemId, Number(r.quantity)]));
}

/**
 * Force account drawn on each allowance item (an item paid by force account that the change order added) on
 * applications in the given statuses: the sum of those change orders' force account lines this period, in cents.
 */
export async function allowanceDrawsByStatus(db: Executor, projectId: string, statuses: readonly PayAppStatus[]) {
  const rows = await db
    .select({
      bidItemId: changeOrderItems.bidItemId,
      cents: sql<string>`sum(${payAppForceAccountLines.thisPeriodAmountCents})`,
    })
    .from(payAppForceAccountLines)
    .innerJoin(payApps, eq(payApps.id, payAppForceAccountLines.payAppId))
    .innerJoin(
      changeOrderItems,
      and(
        eq(changeOrderItems.changeOrderId, payAppForceAccountLines.changeOrderId),
        eq(changeOrderItems.kind, 'add_item'),
      ),
    )
    .innerJoin(
      bidItemProfiles,
      and(eq(bidItemProfiles.bidItemId, changeOrderItems.bidItemId), eq(bidItemProfiles.profile, 'force_account')),
    )
    .where(and(eq(payApps.projectId, projectId), inArray(payApps.status, [...statuses])))
    .groupBy(changeOrderItems.bidItemId);
  return new Map(rows.flatMap((r) => (r.bidItemId ? [[r.bidItemId, Number(r.cents)] as const] : [])));
}

export async function listForecasts(db: Executor, projectId: string) {
  return db
    .select({
      bidItemId: forecasts.bidItemId,
      quantity: forecasts.forecastQuantity,
      note: forecasts.note,
      updatedAt: forecasts.updatedAt,
      updatedBy: user.name,
    })
    .from(forecasts)
    .innerJoin(user, eq(user.id, forecasts.updatedByUserId))
    .where(eq(forecasts.projectId, projectId));
}

export async function findForecast(db: Executor, bidItemId: string) {
  const [row] = await db.select().from(forecasts).where(eq(forecasts.bidItemId, bidItemId)).limit(1);
  return row;
}

export async function upsertForecast(db: Executor, values: typeof forecasts.$inferInsert) {
  const [row] = await db
    .insert(forecasts)
    .values(values)
    .onConflictDoUpdate({
      target: forecasts.bidItemId,
      set: {
        forecastQuantity: values.forecastQuantity,
        note: values.note,
        updatedByUserId: values.updatedByUserId,
        updatedAt: new Date(),
      },
    })
    .returning();
  return row!;
}

/** Proposed change orders that change a bid item's quantity, per bid item (the lowest number wins). */
export async function openQuantityChangeOrders(db: Executor, projectId: string) {
  const rows = await db
    .select({ bidItemId: changeOrderItems.bidItemId, id: changeOrders.id, number: changeOrders.number })
    .from(changeOrderItems)
    .innerJoin(changeOrders, eq(changeOrders.id, changeOrderItems.changeOrderId))
    .where(
      and(
        eq(changeOrders.projectId, projectId),
        eq(changeOrders.status, 'proposed'),
        eq(changeOrderItems.kind, 'change_quantity'),
      ),
    )
    .orderBy(asc(changeOrders.number));
  const byItem = new Map<string, { id: string; number: number }>();
  for (const r of rows)
    if (r.bidItemId && !byItem.has(r.bidItemId)) byItem.set(r.bidItemId, { id: r.id, number: r.number });
  return byItem;
}

/** Pay applications past draft, for the earned-to-date chart. */
export async function earnedPeriods(db: Executor, projectId: string) {
  return db
    .select({
      payAppId: payApps.id,
      number: payApps.number,
      periodEnd: payApps.periodEnd,
      status: payApps.status,
      earnedToDateCents: payApps.earnedToDateCents,
      thisPeriodCents: payApps.thisPeriodCents,
    })
    .from(payApps)
    .where(and(eq(payApps.projectId, projectId), sql`${payApps.status} <> 'draft'`))
    .orderBy(asc(payApps.number));
}
