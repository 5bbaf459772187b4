import { and, count, desc, eq, gte, inArray, lte, not, or, sql, type SQL } from 'drizzle-orm';
import { FROZEN_STATUSES } from '../../../src/shared/domain/pay-app-status';
import type { Executor } from '../../db/client';
import { auditEvents, disputes, payAppLines, payApps, user } from '../../db/schema';

const columns = {
  id: auditEvents.id,
  createdAt: auditEvents.createdAt,
  actorUserId: auditEvents.actorUserId,
  actorName: user.name,
  objectType: auditEvents.objectType,
  objectId: auditEvents.objectId,
  action: auditEvents.action,
  before: auditEvents.before,
  after: auditEvents.after,
};

export type AuditRow = {
  id: number;
  createdAt: Date;
  actorUserId: string | null;
  actorName: string | null;
  objectType: string;
  objectId: string;
  action: string;
  before: unknown;
  after: unknown;
};

function select(db: Executor, where: SQL | undefined) {
  return db.select(columns).from(auditEvents).leftJoin(user, eq(user.id, auditEvents.actorUserId)).where(where);
}

/** Mail about the contractors' hand-offs before certification (their failures are events of the trail). */
const PRE_CERTIFICATION_MAIL = ['pay_app.submitted', 'pay_app.returned'];

/**
 * Events a viewer who sees pay applications only once certified (the owner's side) must not read: those of the
 * project's applications not yet certified (their lines, disputes, and rows naming them as payAppId), and failed
 * mail of the hand-offs before certification. Each test is made false rather than null, so NOT keeps other rows.
 */
function aboutUncertified(projectId: string): SQL {
  const hidden = sql`(select ${payApps.id}::text from ${payApps} where ${payApps.projectId} = ${projectId} and ${payApps.status} not in (${sql.join(
    FROZEN_STATUSES.map((s) => sql`${s}`),
    sql`, `,
  )}))`;
  const hiddenApps = sql`(select ${payApps.id} from ${payApps} where ${payApps.projectId} = ${projectId} and ${payApps.status} not in (${sql.join(
    FROZEN_STATUSES.map((s) => sql`${s}`),
    sql`, `,
  )}))`;
  return sql`(
    (${auditEvents.objectType} = 'pay_app' and ${auditEvents.objectId} in ${hidden})
    or (${auditEvents.objectType} = 'dispute' and ${auditEvents.objectId} in (select ${disputes.id}::text from ${disputes} where ${disputes.payAppId} in ${hiddenApps}))
    or (${auditEvents.objectType} = 'pay_app_line' and ${auditEvents.objectId} in (select ${payAppLines.id}::text from ${payAppLines} where ${payAppLines.payAppId} in ${hiddenApps}))
    or coalesce(${auditEvents.after} ->> 'payAppId' in ${hidden}, false)
    or coalesce(${auditEvents.before} ->> 'payAppId' in ${hidden}, false)
    or (${auditEvents.objectType} = 'email' and coalesce(${auditEvents.after} ->> 'template' in (${sql.join(
      PRE_CERTIFICATION_MAIL.map((t) => sql`${t}`),
      sql`, `,
    )}), false))
  )`;
}

/**
 * One page of a project's trail, newest first (id breaks ties within one transaction). `certifiedOnly` leaves out
 * what concerns applications not yet certified, for a viewer who sees applications only once certified.
 */
export async function listProjectAudit(
  db: Executor,
  projectId: string,
  opts: TrailFilter & { limit: number; offset: number; certifiedOnly?: boolean },
): Promise<{ rows: AuditRow[]; total: number }> {
  const where = and(
    eq(auditEvents.projectId, projectId),
    opts.objectType ? eq(auditEvents.objectType, opts.objectType) : undefined,
    opts.person ? eq(auditEvents.actorUserId, opts.person) : undefined,
    opts.from ? gte(auditEvents.createdAt, new Date(opts.from)) : undefined,
    opts.to ? lte(auditEvents.createdAt, new Date(opts.to)) : undefined,
    opts.certifiedOnly ? not(aboutUncertified(projectId)) : undefined,
  );
  const rows = await select(db, where)
    .orderBy(desc(auditEvents.createdAt), desc(auditEvents.id))
    .limit(opts.limit)
    .offset(opts.offset);
  const [total] = await db.select({ n: count() }).from(auditEvents).where(where);
  return { rows, total: total?.n ?? 0 };
}

export type TrailFilter = {
  objectType?: string | undefined;
  person?: string | undefined;
  from?: string | undefined;
  to?: string | undefined;
};

/** People who acted on the project's trail, for the person filter. */
export async function projectActors(db: Executor, projectId: string): Promise<{ userId: string; name: string }[]> {
  const rows = await db
    .selectDistinct({ userId: user.id, name: user.name })
    .from(auditEvents)
    .innerJoin(user, eq(user.id, auditEvents.actorUserId))
    .where(eq(auditEvents.projectId, projectId))
    .orderBy(user.name);
  return rows;
}

export async function projectObjectTypes(db: Executor, projectId: string, certifiedOnly = false): Promise<string[]> {
  const rows = await db
    .selectDistinct({ objectType: auditEvents.objectType })
    .from(auditEvents)
    .where(and(eq(auditEvents.projectId, projectId), certifiedOnly ? not(aboutUncertified(projectId)) : undefined))
    .orderBy(auditEvents.objectType);
  return rows.map((r) => r.objectType);
}

/**
 * Events about one object: its own rows, plus rows of its parts that name it in before or after under
 * `parentKey` (a pay application's lines and disputes carry `payAppId`).
 */
export async function listObjectAudit(
  db: Executor,
  projectId: string,
  objectType: string,
  objectId: string,
  parentKey?: string,
): Promise<AuditRow[]> {
  const own = and(eq(auditEvents.objectType, objectType), eq(auditEvents.objectId, objectId));
  const parts = parentKey
    ? or(
        sql`${auditEvents.after} ->> ${parentKey} = ${objectId}`,
        sql`${auditEvents.before} ->> ${parentKey} = ${objectId}`,
      )
    : undefined;
  return select(db, and(eq(auditEvents.projectId, projectId), parts ? or(own, parts) : own)).orderBy(
    desc(auditEvents.createdAt),
    desc(auditEvents.id),
  );
}

/** A pay application's trail: its own events, its lines' and disputes' events, and rows that name it as payAppId. */
export async function listPayAppAudit(db: Executor, projectId: string, payAppId: string): Promise<AuditRow[]> {
  const disputeIds = db
    .select({ id: sql<string>`${disputes.id}::text` })
    .from(disputes)
    .where(eq(disputes.payAppId, payAppId));
  const lineIds = db
    .select({ id: sql<string>`${payAppLines.id}::text` })
    .from(payAppLines)
    .where(eq(payAppLines.payAppId, payAppId));
  const where = or(
    and(eq(auditEvents.objectType, 'pay_app'), eq(auditEvents.objectId, payAppId)),
    and(eq(auditEvents.objectType, 'dispute'), inArray(auditEvents.objectId, disputeIds)),
    and(eq(auditEvents.objectType, 'pay_app_line'), inArray(auditEvents.objectId, lineIds)),
    sql`${auditEvents.after} ->> 'payAppId' = ${payAppId}`,
    sql`${auditEvents.before} ->> 'payAppId' = ${payAppId}`,
  );
  return select(db, and(eq(auditEvents.projectId, projectId), where)).orderBy(
    desc(auditEvents.createdAt),
    desc(auditEvents.id),
  );
}
