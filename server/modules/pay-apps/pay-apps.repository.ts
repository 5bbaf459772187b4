import { and, asc, desc, eq, gte, inArray, lte, max, sql, type SQLWrapper } from 'drizzle-orm';
import { FROZEN_STATUSES } from '../../../src/shared/domain/pay-app-status';
import type { ProjectRole } from '../../../src/shared/constants';
import type { Db, Executor } from '../../db/client';
import { preparedFor } from '../../db/prepared';
import {
  bidItems,
  companies,
  companyMembers,
  session,
  user,
  disputeComments,
  tallyEvidence,
  disputes,
  payAppLines,
  payApps,
  payAppStatusHistory,
  projectMembers,
  projects,
  projectReadVersions,
  readVersion,
  tallies,
} from '../../db/schema';

export type PayAppRow = typeof payApps.$inferSelect;
export type LineRow = typeof payAppLines.$inferSelect;
export type DisputeRow = typeof disputes.$inferSelect;

export async function listPayApps(db: Executor, projectId: string): Promise<PayAppRow[]> {
  return db.select().from(payApps).where(eq(payApps.projectId, projectId)).orderBy(desc(payApps.number));
}

export async function findPayApp(db: Executor, payAppId: string): Promise<PayAppRow | undefined> {
  const [row] = await db.select().from(payApps).where(eq(payApps.id, payAppId)).limit(1);
  return row;
}

export async function listLines(db: Executor, payAppId: string): Promise<LineRow[]> {
  return db.select().from(payAppLines).where(eq(payAppLines.payAppId, payAppId)).orderBy(asc(payAppLines.sortOrder));
}

export async function lastNumberAndPeriod(db: Executor, projectId: string) {
  const [row] = await db
    .select({ number: max(payApps.number), periodEnd: max(payApps.periodEnd) })
    .from(payApps)
    .where(eq(payApps.projectId, projectId));
  return { number: row?.number ?? 0, periodEnd: row?.periodEnd ?? null };
}

export async function openPayApps(db: Executor, projectId: string): Promise<PayAppRow[]> {
  const all = await listPayApps(db, projectId);
  return all.filter((a) => !FROZEN_STATUSES.includes(a.status));
}

/** The latest certified (or later) application of the project, whose lines are the next one's "previous". */
export async function latestFrozen(db: Executor, projectId: string): Promise<PayAppRow | undefined> {
  const [row] = await db
    .select()
    .from(payApps)
    .where(and(eq(payApps.projectId, projectId), inArray(payApps.status, [...FROZEN_STATUSES])))
    .orderBy(desc(payApps.number))
    .limit(1);
  return row;
}

/** Sum of current due of every certified application before `number`: the "less previous certified". */
export async function previousCertifiedCents(db: Executor, projectId: string, number: number): Promise<number[]> {
  const rows = await db
    .select({ cents: payApps.currentDueCents, number: payApps.number })
    .from(payApps)
    .where(and(eq(payApps.projectId, projectId), inArray(payApps.status, [...FROZEN_STATUSES])));
  return rows.filter((r) => r.number < number).map((r) => r.cents);
}

export async function projectBidItems(db: Executor, projectId: string) {
  return db.select().from(bidItems).where(eq(bidItems.projectId, projectId)).orderBy(asc(bidItems.itemNumber));
}

export async function projectBandOverBps(db: Executor, projectId: string): Promise<number> {
  const [row] = await db.select({ band: projects.bandOverBps }).from(projects).where(eq(projects.id, projectId));
  return row?.band ?? 0;
}

/** The tallies among `ids` that have at least one evidence file. */
export async function talliesWithEvidence(db: Executor, ids: string[]): Promise<Set<string>> {
  if (ids.length === 0) return new Set();
  const rows = await db
    .selectDistinct({ id: tallyEvidence.tallyId })
    .from(tallyEvidence)
    .where(inArray(tallyEvidence.tallyId, ids));
  return new Set(rows.map((r) => r.id));
}

export async function readyTallies(db: Executor, projectId: string, from: string, to: string) {
  return db
    .select()
    .from(tallies)
    .where(
      and(
        eq(tallies.projectId, projectId),
        eq(tallies.status, 'ready'),
        gte(tallies.measuredOn, from),
        lte(tallies.measuredOn, to),
      ),
    );
}

export async function findDispute(db: Executor, disputeId: string) {
  const [row] = await db
    .select({ d: disputes, projectId: payApps.projectId, status: payApps.status })
    .from(disputes)
    .innerJoin(payApps, eq(payApps.id, disputes.payAppId))
    .where(eq(disputes.id, disputeId))
    .limit(1);
  return row;
}

export async function openDisputes(db: Executor, payAppId: string): Promise<DisputeRow[]> {
  return db
    .select()
    .from(disputes)
    .where(and(eq(disputes.payAppId, payAppId), eq(disputes.status, 'open')));
}

/** Everyone who submitted any revision of the application (its status history). */
export async function submitterIds(db: Executor, payAppId: string): Promise<string[]> {
  const rows = await db
    .selectDistinct({ id: payAppStatusHistory.actorUserId })
    .from(payAppStatusHistory)
    .where(and(eq(payAppStatusHistory.payAppId, payAppId), eq(payAppStatusHistory.toStatus, 'submitted')));
  return rows.flatMap((r) => (r.id ? [r.id] : []));
}

const nameOnly = { columns: { name: true } } as const;

/** The roles a person (by default the `userId` placeholder) holds on the joined project, as a JSON array. */
const rolesOf = (userId: SQLWrapper = sql.placeholder('userId')) =>
  sql<
    ProjectRole[]
  >`coalesce((select json_agg(${projectMembers.role}) from ${projectMembers} where ${projectMembers.projectId} = ${projects.id} and ${projectMembers.userId} = ${userId}), '[]'::json)`;

/** The read versions a cached answer of the joined project is valid at (server/db/schema/read-version.ts). */
const readVersionsOf = sql<
  string | null
>`(select ${readVersion.version}::text from ${readVersion} where ${readVersion.id} = 1) || '.' || coalesce((select ${projectReadVersions.version} from ${projectReadVersions} where ${projectReadVersions.projectId} = ${projects.id}), 0)::text`;

const partiesOf = {
  subcontractorCompanyId: projects.subcontractorCompanyId,
  generalContractorCompanyId: projects.generalContractorCompanyId,
  ownerCompanyId: projects.ownerCompanyId,
};

const reads = preparedFor((db: Db) => ({
  /** A pay application, its project and the person's roles on that project. */
  withAccess: db
    .select({
      app: payApps,
      project: projects,
      roles: rolesOf(),
    })
    .from(payApps)
    .innerJoin(projects, eq(projects.id, payApps.projectId))
    .where(eq(payApps.id, sql.placeholder('payAppId')))
    .limit(1)
    .prepare('pay_app_with_access'),
  /**
   * What a cached read checks on every request, and only that (PGlite pays for every column it hands back): the
   * application's status, its project's parties, the person's roles there, and the read versions (read_version and
   * the project's row of project_read_versions) in the same snapshot, so whatever is read after it is at least that
   * new.
   */
  readAccess: db
    .select({
      status: payApps.status,
      project: partiesOf,
      roles: rolesOf(),
      readVersion: readVersionsOf,
    })
    .from(payApps)
    .innerJoin(projects, eq(projects.id, payApps.projectId))
    .where(eq(payApps.id, sql.placeholder('payAppId')))
    .limit(1)
    .prepare('pay_app_read_access'),
  /**
   * The session behind a token (as requireActor reads it: session, person, company membership) and, for that
   * person, the cached read's access facts of one application, in one statement: the cached GET's short path
   * (pay-app-fast-read.ts). The application's columns are null when there is no such application.
   */
  sessionAndReadAccess: db
    .select({
      session: { id: session.id, expiresAt: session.expiresAt, createdAt: session.createdAt },
      person: { id: user.id, name: user.name, email: user.email },
      membership: {
        companyId: companies.id,
        kind: companies.kind,
        name: companies.name,
        isAdmin: companyMembers.isAdmin,
      },
      status: payApps.status,
      project: partiesOf,
      roles: rolesOf(user.id),
      readVersion: readVersionsOf,
    })
    .from(session)
    .innerJoin(user, eq(user.id, session.userId))
    .leftJoin(companyMembers, eq(companyMembers.userId, user.id))
    .leftJoin(companies, eq(companies.id, companyMembers.companyId))
    .leftJoin(payApps, eq(payApps.id, sql.placeholder('payAppId')))
    .leftJoin(projects, eq(projects.id, payApps.projectId))
    .where(eq(session.token, sql.placeholder('token')))
    .limit(1)
    .prepare('session_and_pay_app_read_access'),
  /**
   * Everything the detail view shows, as one statement (Drizzle's relational query: each relation is a JSON
   * aggregate, so 200 lines come back as one value instead of 200 rows to decode).
   */
  detail: db.query.payApps
    .findFirst({
      where: eq(payApps.id, sql.placeholder('payAppId')),
      with: {
        certifiedBy: nameOnly,
        lines: {
          columns: { payAppId: false, sortOrder: false, createdAt: false, updatedAt: false },
          orderBy: [asc(payAppLines.sortOrder)],
        },
        history: {
          with: { actor: nameOnly },
          orderBy: [asc(payAppStatusHistory.createdAt), asc(payAppStatusHistory.revision)],
        },
        disputes: {
          with: {
            openedBy: nameOnly,
            resolvedBy: nameOnly,
            comments: { with: { author: nameOnly }, orderBy: [asc(disputeComments.createdAt)] },
          },
          orderBy: [asc(disputes.createdAt)],
        },
        tallies: {
          columns: { id: true, bidItemId: true, measuredOn: true, title: true, quantity: true },
          orderBy: [asc(tallies.measuredOn)],
        },
      },
    })
    .prepare('pay_app_detail'),
}));

/** A pay application with its project and the roles `userId` holds there (an empty list when none), in one read. */
export async function findPayAppWithAccess(db: Db, payAppId: string, userId: string) {
  const [row] = await reads(db).withAccess.execute({ payAppId, userId });
  return row;
}

/** The session behind `token` with its person and membership, and that person's access facts of one application. */
export async function findSessionAndReadAccess(db: Db, token: string, payAppId: string) {
  const [row] = await reads(db).sessionAndReadAccess.execute({ token, payAppId });
  return row;
}

/** An application's status, its project's parties, the roles `userId` holds there and the read version, in one read. */
export async function findPayAppReadAccess(db: Db, payAppId: string, userId: string) {
  const [row] = await reads(db).readAccess.execute({ payAppId, userId });
  return row;
}

/** A pay application with its lines, history, disputes with their threads, and the tallies it bills, in one read. */
export async function findPayAppDetail(db: Db, payAppId: string) {
  return reads(db).detail.execute({ payAppId });
}

export type PayAppDetailRow = NonNullable<Awaited<ReturnType<typeof findPayAppDetail>>>;
