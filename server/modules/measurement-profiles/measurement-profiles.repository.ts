import { eq } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { bidItemProfiles, bidItems } from '../../db/schema';

export type BidItemProfileRow = typeof bidItemProfiles.$inferSelect;
export type ProfileItemRow = typeof bidItems.$inferSelect;

export async function listItemsWithProfiles(db: Executor, projectId: string) {
  return db
    .select({ item: bidItems, profile: bidItemProfiles })
    .from(bidItems)
    .leftJoin(bidItemProfiles, eq(bidItemProfiles.bidItemId, bidItems.id))
    .where(eq(bidItems.projectId, projectId))
    .orderBy(bidItems.itemNumber);
}

export async function findProfile(db: Executor, bidItemId: string): Promise<BidItemProfileRow | undefined> {
  const [row] = await db.select().from(bidItemProfiles).where(eq(bidItemProfiles.bidItemId, bidItemId)).limit(1);
  return row;
}

export async function upsertProfile(
  db: Executor,
  values: typeof bidItemProfiles.$inferInsert,
): Promise<BidItemProfileRow> {
  const { bidItemId: _id, projectId: _p, ...changes } = values;
  const [row] = await db
    .insert(bidItemProfiles)
    .values(values)
    .onConflictDoUpdate({ target: bidItemProfiles.bidItemId, set: changes })
    .returning();
  return row!;
}
