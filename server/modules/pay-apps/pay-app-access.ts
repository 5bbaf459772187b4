import type { Executor } from '../../db/client';
import type { Actor } from '../../lib/actor';
import { AppError, notFound } from '../../lib/app-error';
import { isUuid, loadProjectAccess } from '../projects/project-access';
import { canSeePayApp } from './pay-apps.policy';
import * as repo from './pay-apps.repository';

/** A pay application for an actor: 404 off the project, and 404 for the owner before it is certified. */
export async function loadPayAppAccess(db: Executor, actor: Actor, payAppId: string) {
  const app = isUuid(payAppId) ? await repo.findPayApp(db, payAppId) : undefined;
  if (!app) throw notFound('The pay application');
  const access = await loadProjectAccess(db, actor, app.projectId).catch((err: unknown) => {
    throw err instanceof AppError && err.status === 404 ? notFound('The pay application') : err;
  });
  if (!canSeePayApp(access.roles, app.status)) throw notFound('The pay application');
  return { app, ...access };
}
