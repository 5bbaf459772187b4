import { and, eq, getTableColumns, inArray, sum } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { surfaceBaselines, user } from '../../db/schema';

export type BaselineRow = typeof surfaceBaselines.$inferSelect;
export type BaselineSummaryRow = Omit<BaselineRow, 'points' | 'faces' | 'breaklines'>;

function withoutPoints() {
  const columns: Partial<ReturnType<typeof getTableColumns<typeof surfaceBaselines>>> = {
    ...getTableColumns(surfaceBaselines),
  };
  delete columns.points;
  delete columns.faces;
  delete columns.breaklines;
  return columns as Omit<
    ReturnType<typeof getTableColumns<typeof surfaceBaselines>>,
    'points' | 'faces' | 'breaklines'
  >;
}
/** Every column but the points (a million points are 24 MB): lists and state changes never read them. */
const summaryColumns = withoutPoints();

export async function listBaselines(db: Executor, projectId: string): Promise<BaselineSummaryRow[]> {
  return db
    .select(summaryColumns)
    .from(surfaceBaselines)
    .where(eq(surfaceBaselines.projectId, projectId))
    .orderBy(surfaceBaselines.area, surfaceBaselines.createdAt);
}

export async function findBaseline(db: Executor, id: string): Promise<BaselineSummaryRow | undefined> {
  const [row] = await db.select(summaryColumns).from(surfaceBaselines).where(eq(surfaceBaselines.id, id));
  return row;
}

/** The row, locked for the rest of the transaction. */
export async function lockBaseline(tx: Executor, id: string): Promise<BaselineSummaryRow | undefined> {
  const [row] = await tx.select(summaryColumns).from(surfaceBaselines).where(eq(surfaceBaselines.id, id)).for('update');
  return row;
}

export async function findInState(tx: Executor, projectId: string, area: string, status: 'proposed' | 'locked') {
  const [row] = await tx
    .select(summaryColumns)
    .from(surfaceBaselines)
    .where(
      and(
        eq(surfaceBaselines.projectId, projectId),
        eq(surfaceBaselines.area, area),
        eq(surfaceBaselines.status, status),
      ),
    );
  return row;
}

/** A locked baseline of the project with its points (for measuring a surface tally). */
export async function findLockedWithPoints(
  db: Executor,
  projectId: string,
  id: string,
): Promise<BaselineRow | undefined> {
  const [row] = await db
    .select()
    .from(surfaceBaselines)
    .where(
      and(
        eq(surfaceBaselines.id, id),
        eq(surfaceBaselines.projectId, projectId),
        eq(surfaceBaselines.status, 'locked'),
      ),
    );
  return row;
}

export async function hasLocked(db: Executor, projectId: string): Promise<boolean> {
  const [row] = await db
    .select({ id: surfaceBaselines.id })
    .from(surfaceBaselines)
    .where(and(eq(surfaceBaselines.projectId, projectId), eq(surfaceBaselines.status, 'locked')))
    .limit(1);
  return row !== undefined;
}

export async function insertBaseline(tx: Executor, values: typeof surfaceBaselines.$inferInsert) {
  const [row] = await tx.insert(surfaceBaselines).values(values).returning({ id: surfaceBaselines.id });
  return row!.id;
}

export async function updateBaseline(tx: Executor, id: string, values: Partial<typeof surfaceBaselines.$inferInsert>) {
  await tx.update(surfaceBaselines).set(values).where(eq(surfaceBaselines.id, id));
}

export async function storedBaselineBytes(tx: Executor, projectId: string): Promise<number> {
  const [row] = await tx
    .select({ bytes: sum(surfaceBaselines.sizeBytes) })
    .from(surfaceBaselines)
    .where(eq(surfaceBaselines.projectId, projectId));
  return Number(row?.bytes ?? 0);
}

export async function userNames(db: Executor, ids: (string | null)[]): Promise<Map<string, string>> {
  const wanted = [...new Set(ids.filter((i): i is string => i !== null))];
  if (wanted.length === 0) return new Map();
  const rows = await db.select({ id: user.id, name: user.name }).from(user).where(inArray(user.id, wanted));
  return new Map(rows.map((r) => [r.id, r.name]));
}
