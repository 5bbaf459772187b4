import type { AuditEventView, AuditPage, AuditQuery } from '../../../src/shared/schemas/audit';
import type { Db } from '../../db/client';
import type { Actor } from '../../lib/actor';
import { loadPayAppAccess } from '../pay-apps/pay-app-access';
import { canSeePayApp } from '../pay-apps/pay-apps.policy';
import { loadProjectAccess } from '../projects/project-access';
import { presentAuditEvent } from './audit.presenter';
import * as repo from './audit-query.repository';

/**
 * The project's trail, newest first; any member reads it, and a viewer who sees pay applications only once
 * certified (the owner's side) reads no event of one that is not yet certified.
 */
export async function projectTrail(db: Db, actor: Actor, projectId: string, query: AuditQuery): Promise<AuditPage> {
  const { roles } = await loadProjectAccess(db, actor, projectId);
  const { page, pageSize, objectType } = query;
  const certifiedOnly = !canSeePayApp(roles, 'draft');
  const [{ rows, total }, objectTypes] = await Promise.all([
    repo.listProjectAudit(db, projectId, { objectType, limit: pageSize, offset: (page - 1) * pageSize, certifiedOnly }),
    repo.projectObjectTypes(db, projectId, certifiedOnly),
  ]);
  return { events: rows.map(presentAuditEvent), page, pageSize, total, objectTypes };
}

/**
 * One pay application's trail: its own events and those of its lines and disputes. The same visibility as the
 * application (loadPayAppAccess): 404 off the project, and for the owner's side before it is certified.
 */
export async function payAppTrail(db: Db, actor: Actor, payAppId: string): Promise<AuditEventView[]> {
  const { app } = await loadPayAppAccess(db, actor, payAppId);
  const rows = await repo.listPayAppAudit(db, app.projectId, app.id);
  return rows.map(presentAuditEvent);
}
