import { and, asc, eq, gte, lte, type SQL } from 'drizzle-orm';
import type { PageQuery } from '../../../src/shared/schemas/paging';
import type { Executor } from '../../db/client';
import { trucks, truckTickets } from '../../db/schema';
import { keyset } from '../../lib/paging';

export type TruckRow = typeof trucks.$inferSelect;
export type TruckTicketRow = typeof truckTickets.$inferSelect;

export async function listTrucks(db: Executor, projectId: string): Promise<TruckRow[]> {
  return db.select().from(trucks).where(eq(trucks.projectId, projectId)).orderBy(asc(trucks.label));
}

export async function insertTruck(db: Executor, values: typeof trucks.$inferInsert): Promise<TruckRow> {
  const [row] = await db.insert(trucks).values(values).returning();
  return row!;
}

export type TicketFilter = { bidItemId?: string; from?: string; to?: string };

function ticketWhere(projectId: string, f: TicketFilter): SQL[] {
  const where: SQL[] = [eq(truckTickets.projectId, projectId)];
  if (f.bidItemId) where.push(eq(truckTickets.bidItemId, f.bidItemId));
  if (f.from) where.push(gte(truckTickets.deliveredOn, f.from));
  if (f.to) where.push(lte(truckTickets.deliveredOn, f.to));
  return where;
}

/** Every ticket of the filter, by delivery date (for compiling and the PDF's appendix). */
export async function listTickets(db: Executor, projectId: string, f: TicketFilter = {}): Promise<TruckTicketRow[]> {
  return db
    .select()
    .from(truckTickets)
    .where(and(...ticketWhere(projectId, f)))
    .orderBy(asc(truckTickets.deliveredOn), asc(truckTickets.createdAt));
}

/** One page of tickets, newest first by (created_at, id) (server/lib/paging.ts); `pageKey` is for the cursor. */
export async function pageTickets(db: Executor, projectId: string, q: TicketFilter & PageQuery) {
  const page = keyset(truckTickets.createdAt, truckTickets.id, q);
  const where: (SQL | undefined)[] = [...ticketWhere(projectId, q), page.after];
  return db
    .select({ ticket: truckTickets, pageKey: page.key })
    .from(truckTickets)
    .where(and(...where))
    .orderBy(...page.order)
    .limit(page.fetch);
}

/** Only what the totals need, for every ticket of the filter: the list itself comes a page at a time. */
export async function ticketTotalLines(db: Executor, projectId: string, f: TicketFilter) {
  return db
    .select({
      truckLabel: truckTickets.truckLabel,
      deliveredOn: truckTickets.deliveredOn,
      bidItemId: truckTickets.bidItemId,
      loadVolumeCy: truckTickets.loadVolumeCy,
    })
    .from(truckTickets)
    .where(and(...ticketWhere(projectId, f)));
}

export async function insertTickets(
  db: Executor,
  values: (typeof truckTickets.$inferInsert)[],
): Promise<TruckTicketRow[]> {
  if (values.length === 0) return [];
  return db.insert(truckTickets).values(values).returning();
}
