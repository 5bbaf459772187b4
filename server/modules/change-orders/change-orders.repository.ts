import { and, asc, desc, eq, inArray, isNull, max } from 'drizzle-orm';
import type { ProjectRole } from '../../../src/shared/constants';
import type { CreateChangeOrderInput } from '../../../src/shared/schemas/change-order';
import type { Executor } from '../../db/client';
import { changeOrderItems, changeOrders, projectMembers, user } from '../../db/schema';

export type ChangeOrderRow = typeof changeOrders.$inferSelect;
export type ChangeOrderItemRow = typeof changeOrderItems.$inferSelect;

export async function findChangeOrder(db: Executor, id: string): Promise<ChangeOrderRow | undefined> {
  const [row] = await db.select().from(changeOrders).where(eq(changeOrders.id, id)).limit(1);
  return row;
}

export async function listChangeOrders(db: Executor, projectId: string): Promise<ChangeOrderRow[]> {
  return db.select().from(changeOrders).where(eq(changeOrders.projectId, projectId)).orderBy(desc(changeOrders.number));
}

export async function itemsOf(db: Executor, changeOrderIds: string[]): Promise<ChangeOrderItemRow[]> {
  if (changeOrderIds.length === 0) return [];
  return db
    .select()
    .from(changeOrderItems)
    .where(inArray(changeOrderItems.changeOrderId, changeOrderIds))
    .orderBy(asc(changeOrderItems.createdAt), asc(changeOrderItems.id));
}

export async function userNames(db: Executor, ids: string[]): Promise<Map<string, string>> {
  const unique = [...new Set(ids)];
  if (unique.length === 0) return new Map();
  const rows = await db.select({ id: user.id, name: user.name }).from(user).where(inArray(user.id, unique));
  return new Map(rows.map((r) => [r.id, r.name]));
}

/** Inserts the next numbered change order of the project with its items (inside the caller's transaction). */
export async function insertChangeOrder(
  tx: Executor,
  projectId: string,
  proposedByUserId: string,
  input: CreateChangeOrderInput,
): Promise<ChangeOrderRow> {
  const [last] = await tx
    .select({ n: max(changeOrders.number) })
    .from(changeOrders)
    .where(eq(changeOrders.projectId, projectId));
  const [row] = await tx
    .insert(changeOrders)
    .values({ projectId, number: (last?.n ?? 0) + 1, title: input.title, reason: input.reason, proposedByUserId })
    .returning();
  await tx.insert(changeOrderItems).values(
    input.items.map((item) => ({
      changeOrderId: row!.id,
      kind: item.kind,
      bidItemId: item.kind === 'add_item' ? null : item.bidItemId,
      newItem: item.kind === 'add_item' ? item.newItem : null,
      quantityDelta: item.kind === 'change_quantity' ? item.quantityDelta : null,
      newUnitPriceCents: item.kind === 'change_price' ? item.newUnitPriceCents : null,
    })),
  );
  return row!;
}

/** Updates only while the change order is still proposed; undefined means someone decided first (409). */
export async function updateIfProposed(
  tx: Executor,
  id: string,
  set: Partial<typeof changeOrders.$inferInsert>,
  /** Also require that this side has not approved yet. */
  unapprovedSide?: 'gc' | 'owner',
): Promise<ChangeOrderRow | undefined> {
  const side =
    unapprovedSide === 'gc'
      ? isNull(changeOrders.gcApprovedAt)
      : unapprovedSide === 'owner'
        ? isNull(changeOrders.ownerApprovedAt)
        : undefined;
  const [row] = await tx
    .update(changeOrders)
    .set(set)
    .where(and(eq(changeOrders.id, id), eq(changeOrders.status, 'proposed'), side))
    .returning();
  return row;
}

export async function setItemBidItem(tx: Executor, itemId: string, bidItemId: string) {
  await tx.update(changeOrderItems).set({ bidItemId }).where(eq(changeOrderItems.id, itemId));
}

/** The seat the person holds on the project (one seat per person per job), or null. */
export async function seatOf(db: Executor, projectId: string, userId: string): Promise<ProjectRole | null> {
  const [row] = await db
    .select({ role: projectMembers.role })
    .from(projectMembers)
    .where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.userId, userId)))
    .limit(1);
  return row?.role ?? null;
}
