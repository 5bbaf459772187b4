import { and, asc, eq, gte, lte, type SQL } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { trucks, truckTickets } from '../../db/schema';

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

export async function listTickets(db: Executor, projectId: string, f: TicketFilter = {}): Promise<TruckTicketRow[]> {
  const where: SQL[] = [eq(truckTickets.projectId, projectId)];
  if (f.bidItemId) where.push(eq(truckTickets.bidItemId, f.bidItemId));
  if (f.from) where.push(gte(truckTickets.deliveredOn, f.from));
  if (f.to) where.push(lte(truckTickets.deliveredOn, f.to));
  return db
    .select()
    .from(truckTickets)
    .where(and(...where))
    .orderBy(asc(truckTickets.deliveredOn), asc(truckTickets.createdAt));
}

export async function insertTickets(
  db: Executor,
  values: (typeof truckTickets.$inferInsert)[],
): Promise<TruckTicketRow[]> {
  if (values.length === 0) return [];
  return db.insert(truckTickets).values(values).returning();
}
