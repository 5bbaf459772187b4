import { eq } from 'drizzle-orm';
import type { AuditEventView, AuditPage, AuditQuery } from '../../../src/shared/schemas/audit';
import type { Db } from '../../db/client';
import { payApps } from '../../db/schema';
import type { Actor } from '../../lib/actor';
import { AppError, notFound } from '../../lib/app-error';
import { isUuid, loadProjectAccess } from '../projects/project-access';
import { presentAuditEvent } from './audit.presenter';
import * as repo from './audit-query.repository';

/** The project's trail, newest first; any member reads it. */
export async function projectTrail(db: Db, actor: Actor, projectId: string, query: AuditQuery): Promise<AuditPage> {
  await loadProjectAccess(db, actor, projectId);
  const { page, pageSize, objectType } = query;
  const [{ rows, total }, objectTypes] = await Promise.all([
    repo.listProjectAudit(db, projectId, { objectType, limit: pageSize, offset: (page - 1) * pageSize }),
    repo.projectObjectTypes(db, projectId),
  ]);
  return { events: rows.map(presentAuditEvent), page, pageSize, total, objectTypes };
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
  return rows.map(presentAuditEvent);
}
