import type { AccessRole } from '../../../src/shared/constants';
import type { Executor } from '../../db/client';
import type { Actor } from '../../lib/actor';
import { forbidden, notFound } from '../../lib/app-error';
import { accessRoles, canReadProject } from '../../../src/shared/policies/projects';
import { findProject, memberRoles, type ProjectRow } from './projects.repository';

export type ProjectAccess = { project: ProjectRow; roles: AccessRole[] };

/**
 * Loads a project for an actor: 404 when it does not exist or the actor is not on it (never reveal that it
 * exists), then 403 when `allowed` says the actor's roles may not do what is asked.
 */
export async function loadProjectAccess(
  db: Executor,
  actor: Actor,
  projectId: string,
  allowed: (roles: AccessRole[]) => boolean = canReadProject,
): Promise<ProjectAccess> {
  const project = isUuid(projectId) ? await findProject(db, projectId) : undefined;
  if (!project) throw notFound('The project');
  const roles = accessRoles(actor, project, await memberRoles(db, projectId, actor.userId));
  if (!canReadProject(roles)) throw notFound('The project');
  if (!allowed(roles)) throw forbidden();
  return { project, roles };
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
export const isUuid = (value: string) => UUID.test(value);
