import { asc, count, eq } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { changeOrderDocuments, changeOrders } from '../../db/schema';

export type ChangeOrderDocumentRow = typeof changeOrderDocuments.$inferSelect;

/** In the order attached; files of one upload (one timestamp) by name, so the order is stable. */
export async function listDocuments(db: Executor, changeOrderId: string): Promise<ChangeOrderDocumentRow[]> {
  return db
    .select()
    .from(changeOrderDocuments)
    .where(eq(changeOrderDocuments.changeOrderId, changeOrderId))
    .orderBy(asc(changeOrderDocuments.createdAt), asc(changeOrderDocuments.fileName), asc(changeOrderDocuments.id));
}

export async function countDocuments(db: Executor, changeOrderId: string): Promise<number> {
  const [row] = await db
    .select({ n: count() })
    .from(changeOrderDocuments)
    .where(eq(changeOrderDocuments.changeOrderId, changeOrderId));
  return row?.n ?? 0;
}

export async function insertDocuments(
  tx: Executor,
  rows: (typeof changeOrderDocuments.$inferInsert)[],
): Promise<ChangeOrderDocumentRow[]> {
  return tx.insert(changeOrderDocuments).values(rows).returning();
}

/** A document with the project of its change order (for the access check). */
export async function findDocument(db: Executor, id: string) {
  const [row] = await db
    .select({ document: changeOrderDocuments, projectId: changeOrders.projectId })
    .from(changeOrderDocuments)
    .innerJoin(changeOrders, eq(changeOrders.id, changeOrderDocuments.changeOrderId))
    .where(eq(changeOrderDocuments.id, id))
    .limit(1);
  return row;
}
