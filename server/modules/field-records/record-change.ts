import { and, eq } from 'drizzle-orm';
import { MEASUREMENT_PROFILE_LABELS, type AccessRole, type MeasurementProfile } from '../../../src/shared/constants';
import { isDomainError } from '../../../src/shared/domain/domain-error';
import type { Db, Executor } from '../../db/client';
import { bidItemProfiles, bidItems } from '../../db/schema';
import type { Actor } from '../../lib/actor';
import { AppError, notFound, validationFailed } from '../../lib/app-error';
import { recordAudit } from '../audit/audit.repository';
import { loadProjectAccess, isUuid, type ProjectAccess } from '../projects/project-access';

type Written<T> = { id: string; after: unknown; before?: unknown; value: T };

/**
 * One state change of a field record: access and role first (404 / 403), then one transaction that writes the
 * change and its audit event. A DomainError from the pure functions becomes a 400 naming the field.
 */
export async function recordChange<T>(
  db: Db,
  actor: Actor,
  projectId: string,
  rule: (roles: AccessRole[]) => boolean,
  audit: { objectType: string; action: string; notFoundAs?: string },
  write: (tx: Executor, access: ProjectAccess) => Promise<Written<T>>,
): Promise<T> {
  const access = await loadProjectAccess(db, actor, projectId, rule).catch((err: unknown) => {
    // Reached through a child object: the same 404 as for an id that exists nowhere.
    throw audit.notFoundAs && err instanceof AppError && err.status === 404 ? notFound(audit.notFoundAs) : err;
  });
  return db.transaction(async (tx) => {
    const done = await asAppError(() => write(tx, access));
    await recordAudit(tx, {
      projectId,
      actorUserId: actor.userId,
      objectType: audit.objectType,
      objectId: done.id,
      action: audit.action,
      before: done.before,
      after: done.after,
    });
    return done.value;
  });
}

/** Runs `fn`, turning a DomainError into a 400 with the domain's code and field path (a unique violation: 409). */
export async function asAppError<T>(fn: () => Promise<T> | T, pathPrefix = ''): Promise<T> {
  try {
    return await fn();
  } catch (err) {
    if (isDomainError(err)) {
      const details = err.issues.map((i) => ({ path: `${pathPrefix}${i.path}` || '(body)', message: i.message }));
      throw new AppError(400, err.code, err.message, details);
    }
    throw err;
  }
}

/** True for PostgreSQL's unique_violation (23505), however the driver wraps it. */
export function isUniqueViolation(err: unknown): boolean {
  for (let e: unknown = err; e && typeof e === 'object'; e = (e as { cause?: unknown }).cause) {
    if ((e as { code?: unknown }).code === '23505') return true;
  }
  return false;
}

/** The bid item, when it is on this project; otherwise a 400 naming the field (never another project's item). */
export async function projectBidItem(tx: Executor, projectId: string, bidItemId: string, path = 'bidItemId') {
  const [row] = isUuid(bidItemId)
    ? await tx
        .select()
        .from(bidItems)
        .where(and(eq(bidItems.id, bidItemId), eq(bidItems.projectId, projectId)))
        .limit(1)
    : [];
  if (!row) throw validationFailed([{ path, message: 'No such bid item on this project' }]);
  return row;
}

/** The bid item, when it is on this project and its measurement profile is `profile` (400 PROFILE_MISMATCH if not). */
export async function itemMeasuredBy(tx: Executor, projectId: string, bidItemId: string, profile: MeasurementProfile) {
  const item = await projectBidItem(tx, projectId, bidItemId);
  const [row] = await tx.select().from(bidItemProfiles).where(eq(bidItemProfiles.bidItemId, item.id)).limit(1);
  const actual = row?.profile ?? 'worksheet';
  if (actual !== profile) {
    throw new AppError(
      400,
      'PROFILE_MISMATCH',
      `Item ${item.itemNumber} is paid as "${MEASUREMENT_PROFILE_LABELS[actual]}", not "${MEASUREMENT_PROFILE_LABELS[profile]}".`,
      [{ path: 'bidItemId', message: `Item ${item.itemNumber} is not measured this way` }],
    );
  }
  return item;
}
