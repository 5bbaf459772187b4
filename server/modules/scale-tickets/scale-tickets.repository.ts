import { and, asc, eq } from 'drizzle-orm';
import type { PageQuery } from '../../../src/shared/schemas/paging';
import type { Executor } from '../../db/client';
import { materialSources, scaleTickets } from '../../db/schema';
import { keyset } from '../../lib/paging';

export type MaterialSourceRow = typeof materialSources.$inferSelect;
export type ScaleTicketRow = typeof scaleTickets.$inferSelect;

export async function listSources(db: Executor, projectId: string): Promise<MaterialSourceRow[]> {
  return db
    .select()
    .from(materialSources)
    .where(eq(materialSources.projectId, projectId))
    .orderBy(asc(materialSources.name));
}

export async function findSource(db: Executor, projectId: string, id: string): Promise<MaterialSourceRow | undefined> {
  const [row] = await db
    .select()
    .from(materialSources)
    .where(and(eq(materialSources.id, id), eq(materialSources.projectId, projectId)))
    .limit(1);
  return row;
}

export async function insertSource(
  db: Executor,
  values: typeof materialSources.$inferInsert,
): Promise<MaterialSourceRow> {
  const [row] = await db.insert(materialSources).values(values).returning();
  return row!;
}

/** One page of a project's scale tickets, newest first by (created_at, id) (server/lib/paging.ts). */
export async function pageScaleTickets(db: Executor, projectId: string, q: PageQuery) {
  const page = keyset(scaleTickets.createdAt, scaleTickets.id, q);
  return db
    .select({ ticket: scaleTickets, pageKey: page.key })
    .from(scaleTickets)
    .where(and(eq(scaleTickets.projectId, projectId), page.after))
    .orderBy(...page.order)
    .limit(page.fetch);
}

export async function ticketNumberTaken(db: Executor, projectId: string, ticketNumber: string): Promise<boolean> {
  const [row] = await db
    .select({ id: scaleTickets.id })
    .from(scaleTickets)
    .where(and(eq(scaleTickets.projectId, projectId), eq(scaleTickets.ticketNumber, ticketNumber)))
    .limit(1);
  return row !== undefined;
}

export async function insertScaleTicket(
  db: Executor,
  values: typeof scaleTickets.$inferInsert,
): Promise<ScaleTicketRow> {
  const [row] = await db.insert(scaleTickets).values(values).returning();
  return row!;
}
