import { asc, eq } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { payAdjustments } from '../../db/schema';

export type PayAdjustmentRow = typeof payAdjustments.$inferSelect;

export async function listAdjustments(db: Executor, projectId: string): Promise<PayAdjustmentRow[]> {
  return db
    .select()
    .from(payAdjustments)
    .where(eq(payAdjustments.projectId, projectId))
    .orderBy(asc(payAdjustments.appliesOn), asc(payAdjustments.createdAt));
}

export async function insertAdjustment(
  db: Executor,
  values: typeof payAdjustments.$inferInsert,
): Promise<PayAdjustmentRow> {
  const [row] = await db.insert(payAdjustments).values(values).returning();
  return row!;
}
