import type { AuditEventView, AuditPage, AuditQuery } from '../../../src/shared/schemas/audit';
import type { Db } from '../../db/client';
import type { Actor } from '../../lib/actor';
import { loadPayAppAccess } from '../pay-apps/pay-app-access';
import { canSeePayApp } from '../../../src/shared/policies/pay-apps';
import { loadProjectAccess } from '../projects/project-access';
import { presentAuditEvent } from './audit.presenter';
import * as repo from './audit-query.repository';
import { nameObjects } from './trail-names.repository';
import { TRAIL_CSV_MAX, trailCsv } from './trail-csv';

async function present(db: Db, projectId: string, rows: repo.AuditRow[]): Promise<AuditEventView[]> {
  const names = await nameObjects(db, projectId, rows);
  return rows.map((row) => presentAuditEvent(row, names.get(row.id)!));
}

/**
 * The project's trail, newest first; any member reads it, and a viewer who sees pay applications only once
 * certified (the owner's side) reads no event of one that is not yet certified.
 */
export async function projectTrail(db: Db, actor: Actor, projectId: string, query: AuditQuery): Promise<AuditPage> {
  const { roles } = await loadProjectAccess(db, actor, projectId);
  const { page, pageSize, objectType, person, from, to } = query;
  const filter = { objectType, person, from, to };
  const certifiedOnly = !canSeePayApp(roles, 'draft');
  const { rows, total } = await repo.listProjectAudit(db, projectId, {
    ...filter,
    limit: pageSize,
    offset: (page - 1) * pageSize,
    certifiedOnly,
  });
  const objectTypes = await repo.projectObjectTypes(db, projectId, certifiedOnly);
  const people = await repo.projectActors(db, projectId);
  return { events: await present(db, projectId, rows), page, pageSize, total, objectTypes, people };
}

/** The filtered trail as CSV (every matching event, newest first, up to TRAIL_CSV_MAX rows), with the same visibility. */
export async function projectTrailCsv(
  db: Db,
  actor: Actor,
  projectId: string,
  query: AuditQuery,
): Promise<{ csv: string; projectName: string }> {
  const { project, roles } = await loadProjectAccess(db, actor, projectId);
  const { objectType, person, from, to } = query;
  const { rows } = await repo.listProjectAudit(db, projectId, {
    objectType,
    person,
    from,
    to,
    limit: TRAIL_CSV_MAX,
    offset: 0,
    certifiedOnly: !canSeePayApp(roles, 'draft'),
  });
  return { csv: trailCsv(await present(db, projectId, rows)), projectName: project.name };
}

/**
 * One pay application's trail: its own events and those of its lines and disputes. The same visibility as the
 * application (loadPayAppAccess): 404 off the project, and for the owner's side before it is certified.
 */
export async function payAppTrail(db: Db, actor: Actor, payAppId: string): Promise<AuditEventView[]> {
  const { app } = await loadPayAppAccess(db, actor, payAppId);
  const rows = await repo.listPayAppAudit(db, app.projectId, app.id);
  return present(db, app.projectId, rows);
}
