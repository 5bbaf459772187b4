import type { AccessRole } from '../../../src/shared/constants';
import type { Executor } from '../../db/client';
import type { Actor } from '../../lib/actor';
import { AppError, notFound } from '../../lib/app-error';
import { isUuid, loadProjectAccess } from '../projects/project-access';
import { canReadProject } from '../../../src/shared/policies/projects';
import { canSeePayApp } from '../../../src/shared/policies/pay-apps';
import type { PayAppStatus } from '../../../src/shared/constants';
import * as repo from './tallies.repository';

/** Loads a tally for an actor: 404 when it does not exist or sits on a project the actor is not on. */
export async function loadTallyAccess(
  db: Executor,
  actor: Actor,
  tallyId: string,
  rule: (roles: AccessRole[]) => boolean = canReadProject,
) {
  const row = isUuid(tallyId) ? await repo.findTally(db, tallyId) : undefined;
  if (!row) throw notFound('The tally');
  const access = await loadProjectAccess(db, actor, row.tally.projectId, rule).catch((err: unknown) => {
    throw err instanceof AppError && err.status === 404 ? notFound('The tally') : err;
  });
  // A tally billed on an application the actor may not see (the owner before certification) is not there either.
  if (!(await payAppVisible(db, access.roles, row.tally.payAppId))) throw notFound('The tally');
  return { row, ...access };
}

/** Whether the roles may see the pay application a tally or file sits on (true when it is on none). */
export async function payAppVisible(db: Executor, roles: AccessRole[], payAppId: string | null): Promise<boolean> {
  const status = await repo.payAppStatusOf(db, payAppId);
  return status === null || canSeePayApp(roles, status as PayAppStatus);
}

export const tallyNotDraft = (status: string) =>
  new AppError(
    409,
    'TALLY_NOT_DRAFT',
    `This tally is ${status}; only a draft can be changed. Billed quantities change through the pay application's review.`,
  );
