import { and, asc, desc, eq, gte, inArray, lte, max } from 'drizzle-orm';
import { FROZEN_STATUSES } from '../../../src/shared/domain/pay-app-status';
import type { ProjectRole } from '../../../src/shared/constants';
import type { Executor } from '../../db/client';
import { bidItems, disputeComments, disputes, payAppLines, payApps, payAppStatusHistory, projectMembers, tallies, user } from '../../db/schema';

export type PayAppRow = typeof payApps.$inferSelect;
export type LineRow = typeof payAppLines.$inferSelect;
export type DisputeRow = typeof disputes.$inferSelect;

export async function listPayApps(db: Executor, projectId: string): Promise<PayAppRow[]> {
  return db.select().from(payApps).where(eq(payApps.projectId, projectId)).orderBy(desc(payApps.number));
}

export async function findPayApp(db: Executor, payAppId: string): Promise<PayAppRow | undefined> {
  const [row] = await db.select().from(payApps).where(eq(payApps.id, payAppId)).limit(1);
  return row;
}

export async function listLines(db: Executor, payAppId: string): Promise<LineRow[]> {
  return db.select().from(payAppLines).where(eq(payAppLines.payAppId, payAppId)).orderBy(asc(payAppLines.sortOrder));
}

export async function lastNumberAndPeriod(db: Executor, projectId: string) {
  const [row] = await db.select({ number: max(payApps.number), periodEnd: max(payApps.periodEnd) }).from(payApps).where(eq(payApps.projectId, projectId));
  return { number: row?.number ?? 0, periodEnd: row?.periodEnd ?? null };
}

export async function openPayApps(db: Executor, projectId: string): Promise<PayAppRow[]> {
  const all = await listPayApps(db, projectId);
  return all.filter((a) => !FROZEN_STATUSES.includes(a.status));
}

/** The latest certified (or later) application of the project, whose lines are the next one's "previous". */
export async function latestFrozen(db: Executor, projectId: string): Promise<PayAppRow | undefined> {
  const [row] = await db
    .select()
    .from(payApps)
    .where(and(eq(payApps.projectId, projectId), inArray(payApps.status, [...FROZEN_STATUSES])))
    .orderBy(desc(payApps.number))
    .limit(1);
  return row;
}

/** Sum of current due of every certified application before `number`: the "less previous certified". */
export async function previousCertifiedCents(db: Executor, projectId: string, number: number): Promise<number[]> {
  const rows = await db
    .select({ cents: payApps.currentDueCents, number: payApps.number })
    .from(payApps)
    .where(and(eq(payApps.projectId, projectId), inArray(payApps.status, [...FROZEN_STATUSES])));
  return rows.filter((r) => r.number < number).map((r) => r.cents);
}

export async function projectBidItems(db: Executor, projectId: string) {
  return db.select().from(bidItems).where(eq(bidItems.projectId, projectId)).orderBy(asc(bidItems.itemNumber));
}

export async function readyTallies(db: Executor, projectId: string, from: string, to: string) {
  return db
    .select()
    .from(tallies)
    .where(and(eq(tallies.projectId, projectId), eq(tallies.status, 'ready'), gte(tallies.measuredOn, from), lte(tallies.measuredOn, to)));
}

export async function talliesOf(db: Executor, payAppId: string) {
  return db.select().from(tallies).where(eq(tallies.payAppId, payAppId)).orderBy(asc(tallies.measuredOn));
}

export async function historyOf(db: Executor, payAppId: string) {
  return db
    .select({ h: payAppStatusHistory, actor: user.name })
    .from(payAppStatusHistory)
    .leftJoin(user, eq(user.id, payAppStatusHistory.actorUserId))
    .where(eq(payAppStatusHistory.payAppId, payAppId))
    .orderBy(asc(payAppStatusHistory.createdAt), asc(payAppStatusHistory.revision));
}

export async function disputesOf(db: Executor, payAppId: string) {
  const rows = await db.select({ d: disputes, openedBy: user.name }).from(disputes).innerJoin(user, eq(user.id, disputes.openedByUserId)).where(eq(disputes.payAppId, payAppId)).orderBy(asc(disputes.createdAt));
  const ids = rows.map((r) => r.d.id);
  const comments = ids.length
    ? await db.select({ c: disputeComments, author: user.name }).from(disputeComments).innerJoin(user, eq(user.id, disputeComments.authorUserId)).where(inArray(disputeComments.disputeId, ids)).orderBy(asc(disputeComments.createdAt))
    : [];
  const resolverIds = [...new Set(rows.map((r) => r.d.resolvedByUserId).filter((x): x is string => !!x))];
  const resolvers = resolverIds.length ? await db.select({ id: user.id, name: user.name }).from(user).where(inArray(user.id, resolverIds)) : [];
  return { rows, comments, resolvers: new Map(resolvers.map((r) => [r.id, r.name])) };
}

export async function findDispute(db: Executor, disputeId: string) {
  const [row] = await db.select({ d: disputes, projectId: payApps.projectId, status: payApps.status }).from(disputes).innerJoin(payApps, eq(payApps.id, disputes.payAppId)).where(eq(disputes.id, disputeId)).limit(1);
  return row;
}

export async function openDisputes(db: Executor, payAppId: string): Promise<DisputeRow[]> {
  return db.select().from(disputes).where(and(eq(disputes.payAppId, payAppId), eq(disputes.status, 'open')));
}

/** E-mail addresses of the people holding `role` on the project. */
export async function addressesOf(db: Executor, projectId: string, role: ProjectRole): Promise<string[]> {
  const rows = await db.select({ email: user.email }).from(projectMembers).innerJoin(user, eq(user.id, projectMembers.userId)).where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.role, role)));
  return [...new Set(rows.map((r) => r.email))].sort();
}

export async function userName(db: Executor, userId: string | null): Promise<string | null> {
  if (!userId) return null;
  const [row] = await db.select({ name: user.name }).from(user).where(eq(user.id, userId)).limit(1);
  return row?.name ?? null;
}
