import { and, asc, eq } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { changeOrders, forceAccountSheets } from '../../db/schema';

export type DailySheetRow = typeof forceAccountSheets.$inferSelect;

export async function listSheets(db: Executor, projectId: string): Promise<DailySheetRow[]> {
  return db
    .select()
    .from(forceAccountSheets)
    .where(eq(forceAccountSheets.projectId, projectId))
    .orderBy(asc(forceAccountSheets.workedOn), asc(forceAccountSheets.createdAt));
}

export async function findSheet(db: Executor, id: string): Promise<DailySheetRow | undefined> {
  const [row] = await db.select().from(forceAccountSheets).where(eq(forceAccountSheets.id, id)).limit(1);
  return row;
}

export async function findProjectChangeOrder(db: Executor, projectId: string, id: string) {
  const [row] = await db
    .select()
    .from(changeOrders)
    .where(and(eq(changeOrders.id, id), eq(changeOrders.projectId, projectId)))
    .limit(1);
  return row;
}

export async function sheetForDay(db: Executor, changeOrderId: string, workedOn: string) {
  const [row] = await db
    .select({ id: forceAccountSheets.id })
    .from(forceAccountSheets)
    .where(and(eq(forceAccountSheets.changeOrderId, changeOrderId), eq(forceAccountSheets.workedOn, workedOn)))
    .limit(1);
  return row;
}

export async function insertSheet(
  db: Executor,
  values: typeof forceAccountSheets.$inferInsert,
): Promise<DailySheetRow> {
  const [row] = await db.insert(forceAccountSheets).values(values).returning();
  return row!;
}

export async function updateSheet(db: Executor, id: string, set: Partial<typeof forceAccountSheets.$inferInsert>) {
  const [row] = await db.update(forceAccountSheets).set(set).where(eq(forceAccountSheets.id, id)).returning();
  return row!;
}
