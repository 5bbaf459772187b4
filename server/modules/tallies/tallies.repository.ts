import { and, asc, sql, count, desc, eq, gte, inArray, isNull, lte, ne, or, sum, type SQL } from 'drizzle-orm';
import type { PayAppStatus } from '../../../src/shared/constants';
import type { TallyListQuery } from '../../../src/shared/schemas/tally';
import type { Executor } from '../../db/client';
import { keyset } from '../../lib/paging';
import {
  bidItems,
  changeOrderDocuments,
  changeOrders,
  payApps,
  projects,
  tallies,
  tallyEvidence,
  tallyRevisions,
  user,
} from '../../db/schema';

export type TallyRow = typeof tallies.$inferSelect;
export type EvidenceRow = typeof tallyEvidence.$inferSelect;
export type RevisionRow = typeof tallyRevisions.$inferSelect;
export type TallyJoined = {
  tally: TallyRow;
  bidItem: Pick<typeof bidItems.$inferSelect, 'id' | 'itemNumber' | 'description' | 'payUnit' | 'basis'>;
  authorName: string;
};

const joinedColumns = {
  tally: tallies,
  bidItem: {
    id: bidItems.id,
    itemNumber: bidItems.itemNumber,
    description: bidItems.description,
    payUnit: bidItems.payUnit,
    basis: bidItems.basis,
  },
  authorName: user.name,
};

function joined(db: Executor) {
  return db
    .select(joinedColumns)
    .from(tallies)
    .innerJoin(bidItems, eq(bidItems.id, tallies.bidItemId))
    .innerJoin(user, eq(user.id, tallies.authorUserId));
}

/** The list's columns: no inputs and no result, so a page never reads the worksheets. */
const summaryColumns = {
  id: tallies.id,
  projectId: tallies.projectId,
  measuredOn: tallies.measuredOn,
  title: tallies.title,
  method: tallies.method,
  quantity: tallies.quantity,
  status: tallies.status,
  payAppId: tallies.payAppId,
  authorUserId: tallies.authorUserId,
  createdAt: tallies.createdAt,
  updatedAt: tallies.updatedAt,
};

function summaries(db: Executor, pageKey: SQL.Aliased<string> | SQL<string>) {
  return db
    .select({
      tally: summaryColumns,
      bidItem: joinedColumns.bidItem,
      authorName: user.name,
      payAppStatus: payApps.status,
      pageKey,
    })
    .from(tallies)
    .innerJoin(bidItems, eq(bidItems.id, tallies.bidItemId))
    .innerJoin(user, eq(user.id, tallies.authorUserId))
    .leftJoin(payApps, eq(payApps.id, tallies.payAppId));
}

/** One page of a project's tallies, newest first by (created_at, id); `pageKey` is created_at for the cursor. */
export async function listTallySummaries(
  db: Executor,
  projectId: string,
  q: TallyListQuery,
  billedOn: 'any' | readonly PayAppStatus[] = 'any',
) {
  const page = keyset(tallies.createdAt, tallies.id, q);
  const where: (SQL | undefined)[] = [eq(tallies.projectId, projectId), page.after];
  if (q.status) where.push(eq(tallies.status, q.status));
  if (q.bidItemId) where.push(eq(tallies.bidItemId, q.bidItemId));
  if (q.from) where.push(gte(tallies.measuredOn, q.from));
  if (q.to) where.push(lte(tallies.measuredOn, q.to));
  if (billedOn !== 'any') {
    const seen = db
      .select({ id: payApps.id })
      .from(payApps)
      .where(inArray(payApps.status, [...billedOn]));
    where.push(
      billedOn.length > 0 ? or(isNull(tallies.payAppId), inArray(tallies.payAppId, seen)) : isNull(tallies.payAppId),
    );
  }
  return summaries(db, page.key)
    .where(and(...where))
    .orderBy(...page.order)
    .limit(page.fetch);
}
export type TallySummaryRow = Awaited<ReturnType<typeof listTallySummaries>>[number];

export async function findTally(db: Executor, tallyId: string): Promise<TallyJoined | undefined> {
  const [row] = await joined(db).where(eq(tallies.id, tallyId)).limit(1);
  return row;
}

export async function evidenceCounts(db: Executor, tallyIds: string[]): Promise<Map<string, number>> {
  if (tallyIds.length === 0) return new Map();
  const rows = await db
    .select({ tallyId: tallyEvidence.tallyId, n: count() })
    .from(tallyEvidence)
    .where(inArray(tallyEvidence.tallyId, tallyIds))
    .groupBy(tallyEvidence.tallyId);
  return new Map(rows.map((r) => [r.tallyId, r.n]));
}

export async function listEvidence(db: Executor, tallyId: string) {
  return db
    .select({ evidence: tallyEvidence, uploadedBy: user.name })
    .from(tallyEvidence)
    .innerJoin(user, eq(user.id, tallyEvidence.uploadedByUserId))
    .where(eq(tallyEvidence.tallyId, tallyId))
    .orderBy(asc(tallyEvidence.createdAt));
}

export async function findEvidence(db: Executor, evidenceId: string) {
  const [row] = await db
    .select({
      evidence: tallyEvidence,
      projectId: tallies.projectId,
      tallyStatus: tallies.status,
      payAppId: tallies.payAppId,
    })
    .from(tallyEvidence)
    .innerJoin(tallies, eq(tallies.id, tallyEvidence.tallyId))
    .where(eq(tallyEvidence.id, evidenceId))
    .limit(1);
  return row;
}

export async function payAppStatusOf(db: Executor, payAppId: string | null): Promise<string | null> {
  if (!payAppId) return null;
  const [row] = await db.select({ status: payApps.status }).from(payApps).where(eq(payApps.id, payAppId)).limit(1);
  return row?.status ?? null;
}

export async function insertTally(db: Executor, values: typeof tallies.$inferInsert): Promise<TallyRow> {
  const [row] = await db.insert(tallies).values(values).returning();
  return row!;
}

/** Updates a tally only while it still has the status the caller saw; undefined when it changed meanwhile. */
export async function updateTallyIf(
  db: Executor,
  tallyId: string,
  status: TallyRow['status'],
  values: Partial<typeof tallies.$inferInsert>,
) {
  const [row] = await db
    .update(tallies)
    .set(values)
    .where(and(eq(tallies.id, tallyId), eq(tallies.status, status)))
    .returning();
  return row;
}

export async function deleteTallyIfDraft(db: Executor, tallyId: string): Promise<boolean> {
  const rows = await db
    .delete(tallies)
    .where(and(eq(tallies.id, tallyId), eq(tallies.status, 'draft')))
    .returning({ id: tallies.id });
  return rows.length > 0;
}

export async function insertEvidence(
  db: Executor,
  values: (typeof tallyEvidence.$inferInsert)[],
): Promise<EvidenceRow[]> {
  if (values.length === 0) return [];
  return db.insert(tallyEvidence).values(values).returning();
}

export async function deleteEvidence(db: Executor, evidenceId: string): Promise<void> {
  await db.delete(tallyEvidence).where(eq(tallyEvidence.id, evidenceId));
}

/** Quantity of an item's tallies other than `exceptTallyId` (null: all of them). */
export async function talliedQuantity(db: Executor, bidItemId: string, exceptTallyId: string | null): Promise<number> {
  const where = exceptTallyId
    ? and(eq(tallies.bidItemId, bidItemId), ne(tallies.id, exceptTallyId))
    : eq(tallies.bidItemId, bidItemId);
  const [row] = await db
    .select({ total: sum(tallies.quantity) })
    .from(tallies)
    .where(where);
  return Number(row?.total ?? 0);
}

/** Keeps the tally's current state as its next revision (1, 2, ...). */
export async function insertRevision(db: Executor, t: TallyRow, replacedByUserId: string): Promise<void> {
  const [last] = await db.select({ n: count() }).from(tallyRevisions).where(eq(tallyRevisions.tallyId, t.id));
  await db.insert(tallyRevisions).values({
    tallyId: t.id,
    revision: (last?.n ?? 0) + 1,
    bidItemId: t.bidItemId,
    measuredOn: t.measuredOn,
    title: t.title,
    method: t.method,
    inputs: t.inputs,
    result: t.result,
    quantity: t.quantity,
    manualBasis: t.manualBasis,
    replacedByUserId,
    savedAt: t.updatedAt,
  });
}

export async function listRevisions(db: Executor, tallyId: string) {
  return db
    .select({ revision: tallyRevisions, replacedBy: user.name })
    .from(tallyRevisions)
    .innerJoin(user, eq(user.id, tallyRevisions.replacedByUserId))
    .where(eq(tallyRevisions.tallyId, tallyId))
    .orderBy(desc(tallyRevisions.revision));
}

/** The tallies a pay application billed to one bid item: the backup of its line, oldest measurement first. */
/** The summaries of the tallies one application billed to one bid item (bounded by the application). */
export async function listLineTallies(db: Executor, payAppId: string, bidItemId: string) {
  return summaries(db, sql<string>`${tallies.createdAt}::text`)
    .where(and(eq(tallies.payAppId, payAppId), eq(tallies.bidItemId, bidItemId)))
    .orderBy(asc(tallies.measuredOn), asc(tallies.createdAt));
}

/**
 * Bytes of the files a project stores (tally evidence and change order documents), after locking the project's row for the rest of the
 * transaction: the quota check and the insert that follows cannot interleave with another upload's.
 */
export async function lockedProjectStoredBytes(tx: Executor, projectId: string): Promise<number> {
  await tx.select({ id: projects.id }).from(projects).where(eq(projects.id, projectId)).for('update');
  const [evidence] = await tx
    .select({ bytes: sum(tallyEvidence.sizeBytes) })
    .from(tallyEvidence)
    .innerJoin(tallies, eq(tallies.id, tallyEvidence.tallyId))
    .where(eq(tallies.projectId, projectId));
  const [documents] = await tx
    .select({ bytes: sum(changeOrderDocuments.sizeBytes) })
    .from(changeOrderDocuments)
    .innerJoin(changeOrders, eq(changeOrders.id, changeOrderDocuments.changeOrderId))
    .where(eq(changeOrders.projectId, projectId));
  return Number(evidence?.bytes ?? 0) + Number(documents?.bytes ?? 0);
}
