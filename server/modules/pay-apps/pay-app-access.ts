import type { Db } from '../../db/client';
import type { Actor } from '../../lib/actor';
import { notFound } from '../../lib/app-error';
import { isUuid } from '../projects/project-access';
import { accessRoles, canReadProject } from '../../../src/shared/policies/projects';
import { canSeePayApp } from '../../../src/shared/policies/pay-apps';
import * as repo from './pay-apps.repository';

/**
 * A pay application for an actor: 404 off the project, and 404 for the owner before it is certified. The same
 * rules as loadProjectAccess, with the application, its project, the actor's roles and the read version (for cached
 * answers, server/lib/read-cache.ts) read in one statement.
 */
export async function loadPayAppAccess(db: Db, actor: Actor, payAppId: string) {
  const found = isUuid(payAppId) ? await repo.findPayAppWithAccess(db, payAppId, actor.userId) : undefined;
  if (!found) throw notFound('The pay application');
  const roles = accessRoles(actor, found.project, found.roles);
  if (!canReadProject(roles) || !canSeePayApp(roles, found.app.status)) throw notFound('The pay application');
  return { app: found.app, project: found.project, roles, readVersion: found.readVersion };
}
