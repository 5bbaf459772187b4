import type { Db } from '../../db/client';
import type { Actor } from '../../lib/actor';
import { notFound } from '../../lib/app-error';
import { isUuid } from '../projects/project-access';
import type { PayAppStatus, ProjectRole } from '../../../src/shared/constants';
import { accessRoles, canReadProject, type ProjectParties } from '../../../src/shared/policies/projects';
import { canSeePayApp } from '../../../src/shared/policies/pay-apps';
import * as repo from './pay-apps.repository';

/**
 * A pay application for an actor: 404 off the project, and 404 for the owner before it is certified. The same
 * rules as loadProjectAccess, with the application, its project and the actor's roles read in one statement.
 */
export async function loadPayAppAccess(db: Db, actor: Actor, payAppId: string) {
  const found = isUuid(payAppId) ? await repo.findPayAppWithAccess(db, payAppId, actor.userId) : undefined;
  if (!found) throw notFound('The pay application');
  const roles = rolesIfVisible(actor, found.project, found.roles, found.app.status);
  return { app: found.app, project: found.project, roles };
}

/**
 * The same rules for the cached read (getPayAppAnswer): only what they need, and the read version its answer is
 * valid at (server/lib/read-cache.ts), in one lean statement.
 */
export async function loadPayAppReadAccess(db: Db, actor: Actor, payAppId: string) {
  const found = isUuid(payAppId) ? await repo.findPayAppReadAccess(db, payAppId, actor.userId) : undefined;
  if (!found) throw notFound('The pay application');
  return { roles: rolesIfVisible(actor, found.project, found.roles, found.status), readVersion: found.readVersion };
}

/** The actor's roles on the application's project, or 404 when they may not see it (off the project, or too early). */
export function rolesIfVisible(
  actor: Actor,
  project: ProjectParties,
  memberRoles: ProjectRole[],
  status: PayAppStatus,
) {
  const roles = accessRoles(actor, project, memberRoles);
  if (!canReadProject(roles) || !canSeePayApp(roles, status)) throw notFound('The pay application');
  return roles;
}
