import { and, count, eq, inArray, isNotNull, min } from 'drizzle-orm';
import type { BidItemInput, UpdateBidItemInput } from '../../../src/shared/schemas/bid-item';
import type { Executor } from '../../db/client';
import { bidItemProfiles, bidItems, changeOrderItems, payAppLines, payApps, tallies } from '../../db/schema';
import type { BidItemRow } from './bid-items.presenter';

export async function listBidItems(db: Executor, projectId: string): Promise<BidItemRow[]> {
  return db.select().from(bidItems).where(eq(bidItems.projectId, projectId)).orderBy(bidItems.itemNumber);
}

/** The measurement profile of each item that has one (the others are measured by worksheet). */
export async function profilesOf(db: Executor, projectId: string) {
  return db
    .select({
      bidItemId: bidItemProfiles.bidItemId,
      profile: bidItemProfiles.profile,
      settings: bidItemProfiles.settings,
    })
    .from(bidItemProfiles)
    .where(eq(bidItemProfiles.projectId, projectId));
}

export async function findBidItem(db: Executor, bidItemId: string): Promise<BidItemRow | undefined> {
  const [row] = await db.select().from(bidItems).where(eq(bidItems.id, bidItemId)).limit(1);
  return row;
}

/** How many tallies, pay application lines and change order items name this bid item. */
export async function referencesTo(db: Executor, bidItemId: string) {
  const counted = async (table: typeof tallies | typeof payAppLines | typeof changeOrderItems) =>
    (await db.select({ n: count() }).from(table).where(eq(table.bidItemId, bidItemId)))[0]!.n;
  return {
    tallies: await counted(tallies),
    payAppLines: await counted(payAppLines),
    changeOrderItems: await counted(changeOrderItems),
  };
}

export async function existingItemNumbers(db: Executor, projectId: string, itemNumbers: string[]): Promise<string[]> {
  if (itemNumbers.length === 0) return [];
  const rows = await db
    .select({ itemNumber: bidItems.itemNumber })
    .from(bidItems)
    .where(and(eq(bidItems.projectId, projectId), inArray(bidItems.itemNumber, itemNumbers)));
  return rows.map((r) => r.itemNumber);
}

export async function insertBidItems(db: Executor, projectId: string, items: BidItemInput[]): Promise<BidItemRow[]> {
  if (items.length === 0) return [];
  return db
    .insert(bidItems)
    .values(items.map((item) => ({ ...item, projectId })))
    .returning();
}

/**
 * The contract is set up until the project's first pay application is submitted, and locked from then on: the
 * number of that application, or null while it is still being set up.
 */
export async function contractLockedSince(db: Executor, projectId: string): Promise<number | null> {
  const [row] = await db
    .select({ n: min(payApps.number) })
    .from(payApps)
    .where(and(eq(payApps.projectId, projectId), isNotNull(payApps.submittedAt)));
  return row?.n ?? null;
}

export async function updateBidItem(
  db: Executor,
  bidItemId: string,
  input: Omit<UpdateBidItemInput, 'reason'>,
): Promise<BidItemRow> {
  const [row] = await db.update(bidItems).set(input).where(eq(bidItems.id, bidItemId)).returning();
  return row!;
}

export async function deleteBidItem(db: Executor, bidItemId: string): Promise<void> {
  await db.delete(bidItems).where(eq(bidItems.id, bidItemId));
}
