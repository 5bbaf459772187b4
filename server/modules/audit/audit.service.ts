import { eq } from 'drizzle-orm';
import type { AuditEventView, AuditPage, AuditQuery } from '../../../src/shared/schemas/audit';
import type { Db } from '../../db/client';
import { payApps } from '../../db/schema';
import type { Actor } from '../../lib/actor';
import { AppError, notFound } from '../../lib/app-error';
import { isUuid, loadProjectAccess } from '../projects/project-access';
import { presentAuditEvent } from './audit.presenter';
import * as repo from './audit-query.repository';
import { nameObjects } from './trail-names.repository';
import { TRAIL_CSV_MAX, trailCsv } from './trail-csv';

async function present(db: Db, projectId: string, rows: repo.AuditRow[]): Promise<AuditEventView[]> {
  const names = await nameObjects(db, projectId, rows);
  return rows.map((row) => presentAuditEvent(row, names.get(row.id)!));
}

/** The project's trail, newest first; any member reads it. */
export async function projectTrail(db: Db, actor: Actor, projectId: string, query: AuditQuery): Promise<AuditPage> {
  await loadProjectAccess(db, actor, projectId);
  const { page, pageSize, objectType, person, from, to } = query;
  const filter = { objectType, person, from, to };
  const { rows, total } = await repo.listProjectAudit(db, projectId, {
    ...filter,
    limit: pageSize,
    offset: (page - 1) * pageSize,
  });
  const objectTypes = await repo.projectObjectTypes(db, projectId);
  const people = await repo.projectActors(db, projectId);
  return { events: await present(db, projectId, rows), page, pageSize, total, objectTypes, people };
}

/** The filtered trail as CSV (every matching event, newest first, up to TRAIL_CSV_MAX rows). */
export async function projectTrailCsv(
  db: Db,
  actor: Actor,
  projectId: string,
  query: AuditQuery,
): Promise<{ csv: string; projectName: string }> {
  const { project } = await loadProjectAccess(db, actor, projectId);
  const { objectType, person, from, to } = query;
  const { rows } = await repo.listProjectAudit(db, projectId, {
    objectType,
    person,
    from,
    to,
    limit: TRAIL_CSV_MAX,
    offset: 0,
  });
  return { csv: trailCsv(await present(db, projectId, rows)), projectName: project.name };
}

/** One pay application's trail: its own events and those of its lines and disputes. */
export async function payAppTrail(db: Db, actor: Actor, payAppId: string): Promise<AuditEventView[]> {
  const [app] = isUuid(payAppId)
    ? await db.select({ projectId: payApps.projectId }).from(payApps).where(eq(payApps.id, payAppId)).limit(1)
    : [];
  if (!app) throw notFound('The pay application');
  await loadProjectAccess(db, actor, app.projectId).catch((err: unknown) => {
    throw err instanceof AppError && err.status === 404 ? notFound('The pay application') : err;
  });
  const rows = await repo.listPayAppAudit(db, app.projectId, payAppId);
  return present(db, app.projectId, rows);
}
