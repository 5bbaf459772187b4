import { and, asc, desc, eq, gte, inArray, sql } from 'drizzle-orm';
import type { PaymentStatus } from '../../../src/shared/constants';
import { sumCents } from '../../../src/shared/domain/money';
import type { Executor } from '../../db/client';
import { payApps, payAppStatusHistory, paymentStatusHistory, payments, stripeEvents } from '../../db/schema';

export type PayAppRow = typeof payApps.$inferSelect;
export type PaymentRow = typeof payments.$inferSelect;
export type HistoryRow = typeof paymentStatusHistory.$inferSelect;

export async function findPayApp(db: Executor, payAppId: string, forUpdate = false): Promise<PayAppRow | undefined> {
  const q = db.select().from(payApps).where(eq(payApps.id, payAppId)).limit(1);
  const [row] = forUpdate ? await q.for('update') : await q;
  return row;
}

export const listPayApps = (db: Executor, projectId: string) =>
  db.select().from(payApps).where(eq(payApps.projectId, projectId)).orderBy(asc(payApps.number));

export const listPayments = (db: Executor, where: { payAppId?: string; projectId?: string }) =>
  db
    .select()
    .from(payments)
    .where(where.payAppId ? eq(payments.payAppId, where.payAppId) : eq(payments.projectId, where.projectId!))
    .orderBy(desc(payments.createdAt));

/** Cents of the application's payments started since `since` that are open, processing or paid (not failed or ended). */
export async function recentPaymentCents(db: Executor, payAppId: string, since: Date): Promise<number> {
  const [row] = await db
    .select({ cents: sql<string>`coalesce(sum(${payments.amountCents}), 0)` })
    .from(payments)
    .where(
      and(
        eq(payments.payAppId, payAppId),
        gte(payments.createdAt, since),
        inArray(payments.status, ['created', 'processing', 'succeeded']),
      ),
    );
  return Number(row?.cents ?? 0);
}

export async function historyOf(db: Executor, paymentIds: string[]): Promise<HistoryRow[]> {
  if (paymentIds.length === 0) return [];
  return db
    .select()
    .from(paymentStatusHistory)
    .where(inArray(paymentStatusHistory.paymentId, paymentIds))
    .orderBy(asc(paymentStatusHistory.createdAt));
}

export async function findPayment(db: Executor, by: { id?: string; sessionId?: string; paymentIntentId?: string }) {
  const cond = by.id
    ? eq(payments.id, by.id)
    : by.sessionId
      ? eq(payments.stripeCheckoutSessionId, by.sessionId)
      : eq(payments.stripePaymentIntentId, by.paymentIntentId!);
  const [row] = await db.select().from(payments).where(cond).limit(1).for('update');
  return row;
}

export async function processingCentsOf(db: Executor, payAppId: string, exceptPaymentId?: string): Promise<number> {
  const rows = await db
    .select({ id: payments.id, amountCents: payments.amountCents })
    .from(payments)
    .where(and(eq(payments.payAppId, payAppId), eq(payments.status, 'processing')));
  return sumCents(rows.filter((r) => r.id !== exceptPaymentId).map((r) => r.amountCents));
}

export async function insertPayment(db: Executor, values: typeof payments.$inferInsert): Promise<PaymentRow> {
  const [row] = await db.insert(payments).values(values).returning();
  return row!;
}

export async function updatePayment(
  db: Executor,
  id: string,
  values: Partial<typeof payments.$inferInsert>,
): Promise<PaymentRow> {
  const [row] = await db
    .update(payments)
    .set({ ...values, updatedAt: new Date() })
    .where(eq(payments.id, id))
    .returning();
  return row!;
}

export async function addHistory(
  db: Executor,
  paymentId: string,
  from: PaymentStatus | null,
  to: PaymentStatus,
  note: string,
  stripeEventId?: string,
) {
  await db
    .insert(paymentStatusHistory)
    .values({ paymentId, fromStatus: from, toStatus: to, note, stripeEventId: stripeEventId ?? null });
}

/** Records an event id; false when it was already recorded (the event has been applied before). */
export async function claimEvent(db: Executor, event: { id: string; type: string; created: number }): Promise<boolean> {
  const rows = await db
    .insert(stripeEvents)
    .values({ id: event.id, type: event.type, stripeCreatedAt: new Date(event.created * 1000) })
    .onConflictDoNothing()
    .returning({ id: stripeEvents.id });
  return rows.length > 0;
}

export async function eventSeen(db: Executor, eventId: string): Promise<boolean> {
  const rows = await db.select({ id: stripeEvents.id }).from(stripeEvents).where(eq(stripeEvents.id, eventId)).limit(1);
  return rows.length > 0;
}

export async function movePayApp(
  db: Executor,
  app: PayAppRow,
  values: { status: PayAppRow['status']; paidCents: number },
  note: string,
) {
  await db
    .update(payApps)
    .set({ ...values, updatedAt: new Date() })
    .where(eq(payApps.id, app.id));
  if (values.status !== app.status) {
    await db.insert(payAppStatusHistory).values({
      payAppId: app.id,
      fromStatus: app.status,
      toStatus: values.status,
      revision: app.revision,
      note,
      actorUserId: null,
    });
  }
}

export const openPayments = (db: Executor, payAppId: string) =>
  db
    .select()
    .from(payments)
    .where(
      and(
        eq(payments.payAppId, payAppId),
        eq(payments.status, 'created'),
        sql`${payments.stripeCheckoutSessionId} is not null`,
      ),
    );

/** Every attempt not yet paid, failed or canceled: with a checkout session, or one being opened right now. */
export const unfinishedPayments = (db: Executor, payAppId: string) =>
  db
    .select()
    .from(payments)
    .where(and(eq(payments.payAppId, payAppId), eq(payments.status, 'created')));
