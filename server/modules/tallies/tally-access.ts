import type { AccessRole } from '../../../src/shared/constants';
import type { Executor } from '../../db/client';
import type { Actor } from '../../lib/actor';
import { AppError, notFound } from '../../lib/app-error';
import { isUuid, loadProjectAccess } from '../projects/project-access';
import { canReadProject } from '../projects/projects.policy';
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
  return { row, ...access };
}

export const tallyNotDraft = (status: string) =>
  new AppError(
    409,
    'TALLY_NOT_DRAFT',
    `This tally is ${status}; only a draft can be changed. Billed quantities change through the pay application's review.`,
  );
