import { asc, eq, inArray } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { storedMaterialMovements, storedMaterials } from '../../db/schema';

export type StoredMaterialRow = typeof storedMaterials.$inferSelect;
export type MovementRow = typeof storedMaterialMovements.$inferSelect;

export async function listMaterials(db: Executor, projectId: string): Promise<StoredMaterialRow[]> {
  return db
    .select()
    .from(storedMaterials)
    .where(eq(storedMaterials.projectId, projectId))
    .orderBy(asc(storedMaterials.createdAt));
}

export async function findMaterial(db: Executor, id: string): Promise<StoredMaterialRow | undefined> {
  const [row] = await db.select().from(storedMaterials).where(eq(storedMaterials.id, id)).limit(1);
  return row;
}

export async function movementsOf(db: Executor, ids: string[]): Promise<MovementRow[]> {
  if (ids.length === 0) return [];
  return db
    .select()
    .from(storedMaterialMovements)
    .where(inArray(storedMaterialMovements.storedMaterialId, ids))
    .orderBy(asc(storedMaterialMovements.movedOn), asc(storedMaterialMovements.createdAt));
}

export async function insertMaterial(db: Executor, values: typeof storedMaterials.$inferInsert) {
  const [row] = await db.insert(storedMaterials).values(values).returning();
  return row!;
}

export async function insertMovement(db: Executor, values: typeof storedMaterialMovements.$inferInsert) {
  const [row] = await db.insert(storedMaterialMovements).values(values).returning();
  return row!;
}
