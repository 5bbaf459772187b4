import { and, asc, eq } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { changeOrders, companies, disputes, lienWaivers, payAppLines, payApps, payments } from '../../db/schema';

export type LienWaiverRow = typeof lienWaivers.$inferSelect;

export const listWaivers = (db: Executor, where: { payAppId?: string; projectId?: string }) =>
  db
    .select()
    .from(lienWaivers)
    .where(where.payAppId ? eq(lienWaivers.payAppId, where.payAppId) : eq(lienWaivers.projectId, where.projectId!))
    .orderBy(asc(lienWaivers.signedAt));

export async function findWaiver(db: Executor, id: string): Promise<LienWaiverRow | undefined> {
  const [row] = await db.select().from(lienWaivers).where(eq(lienWaivers.id, id)).limit(1);
  return row;
}

export const paymentsOf = (db: Executor, payAppId: string) =>
  db
    .select({ id: payments.id, amountCents: payments.amountCents, status: payments.status })
    .from(payments)
    .where(eq(payments.payAppId, payAppId))
    .orderBy(asc(payments.createdAt));

export const payAppsOf = (db: Executor, projectId: string) =>
  db.select().from(payApps).where(eq(payApps.projectId, projectId)).orderBy(asc(payApps.number));

export async function insertWaiver(db: Executor, values: typeof lienWaivers.$inferInsert): Promise<LienWaiverRow> {
  const [row] = await db.insert(lienWaivers).values(values).returning();
  return row!;
}

export async function companyName(db: Executor, id: string): Promise<string> {
  const [row] = await db.select({ name: companies.name }).from(companies).where(eq(companies.id, id)).limit(1);
  return row?.name ?? '';
}

/** Disputes raised on an application with their line's certified figures, oldest first. */
export const disputedLinesOf = (db: Executor, payAppId: string) =>
  db
    .select({
      lineId: payAppLines.id,
      itemNumber: payAppLines.itemNumber,
      description: payAppLines.description,
      payUnit: payAppLines.payUnit,
      unitPriceCents: payAppLines.unitPriceCents,
      certifiedQuantity: payAppLines.thisPeriodQuantity,
      claimedQuantity: disputes.claimedQuantity,
      resolution: disputes.resolution,
    })
    .from(disputes)
    .innerJoin(payAppLines, eq(payAppLines.id, disputes.lineId))
    .where(eq(disputes.payAppId, payAppId))
    .orderBy(asc(payAppLines.sortOrder), asc(disputes.createdAt));

/** The project's approved change orders (number, title, when decided). */
export const approvedChangeOrders = (db: Executor, projectId: string) =>
  db
    .select({ number: changeOrders.number, title: changeOrders.title, decidedAt: changeOrders.decidedAt })
    .from(changeOrders)
    .where(and(eq(changeOrders.projectId, projectId), eq(changeOrders.status, 'approved')));
