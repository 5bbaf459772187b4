import type { SurfaceBaselineList, SurfaceBaselineView } from '../../../src/shared/schemas/surface-baseline';
import type { RecordBaselineInput } from '../../../src/shared/schemas/surface-baseline';
import { baselineSideOf, canRecordBaseline } from '../../../src/shared/policies/surface-baselines';
import type { Db } from '../../db/client';
import type { Storage } from '../../integrations/storage/storage';
import type { Actor } from '../../lib/actor';
import type { ComputePool } from '../../lib/compute/compute-pool';
import { AppError, forbidden, notFound } from '../../lib/app-error';
import { assertProjectQuota, DEFAULT_PROJECT_QUOTA_BYTES } from '../../lib/upload';
import { recordAudit } from '../audit/audit.repository';
import { isUuid, loadProjectAccess } from '../projects/project-access';
import { lockedProjectStoredBytes } from '../tallies/tallies.repository';
import { readBaselineFile } from './baseline-file';
import { peopleOf, presentBaseline } from './surface-baselines.presenter';
import * as repo from './surface-baselines.repository';

const areaName = (area: string) => (area === '' ? 'the whole project' : `area "${area}"`);

/** Everyone on the project sees its baselines, newest state first within each area. */
export async function listBaselines(db: Db, actor: Actor, projectId: string): Promise<SurfaceBaselineList> {
  const { roles } = await loadProjectAccess(db, actor, projectId);
  const rows = await repo.listBaselines(db, projectId);
  const names = await repo.userNames(db, rows.flatMap(peopleOf));
  return { baselines: rows.map((r) => presentBaseline(r, names, roles)), can: { record: canRecordBaseline(roles) } };
}

/**
 * Records an original ground surface (proposed): the file goes to storage, then one transaction (the project row
 * locked for the quota) inserts the row and its audit event. One proposal per area at a time; a proposal for an area
 * with a locked baseline is its replacement, in force only once both sides accept it.
 */
export async function recordBaseline(
  db: Db,
  storage: Storage,
  actor: Actor,
  projectId: string,
  input: RecordBaselineInput,
  upload: Express.Multer.File | undefined,
  quotaBytes = DEFAULT_PROJECT_QUOTA_BYTES,
  compute?: ComputePool,
): Promise<SurfaceBaselineView> {
  const { roles } = await loadProjectAccess(db, actor, projectId, canRecordBaseline);
  // Read only for someone who may record: nobody else makes the server parse a file.
  const file = await readBaselineFile(upload, input.unit, input.order, compute);
  const { key } = await storage.putFile(file.path, 'baseline');
  try {
    const id = await db.transaction(async (tx) => {
      const used = (await lockedProjectStoredBytes(tx, projectId)) + (await repo.storedBaselineBytes(tx, projectId));
      assertProjectQuota(used, file.sizeBytes, quotaBytes);
      if (await repo.findInState(tx, projectId, input.area, 'proposed')) {
        throw new AppError(
          409,
          'BASELINE_PROPOSAL_OPEN',
          `An original ground surface for ${areaName(input.area)} is already awaiting acceptance; accept it, or record for another area.`,
        );
      }
      const locked = await repo.findInState(tx, projectId, input.area, 'locked');
      const newId = await repo.insertBaseline(tx, {
        projectId,
        area: input.area,
        fileName: file.fileName,
        contentType: file.contentType,
        sizeBytes: file.sizeBytes,
        sha256: file.sha256,
        storageKey: key,
        surfaceName: file.surfaceName,
        pointCount: file.pointCount,
        linearUnit: file.linearUnit,
        elevationUnit: file.elevationUnit,
        unitsFrom: file.unitsFrom,
        points: file.points,
        faces: file.faces,
        breaklines: file.breaklines,
        pointOrder: file.pointOrder,
        replacesId: locked?.id ?? null,
        recordedByUserId: actor.userId,
      });
      await recordAudit(tx, {
        projectId,
        actorUserId: actor.userId,
        objectType: 'surface_baseline',
        objectId: newId,
        action: locked ? 'surface_baseline.replacement_recorded' : 'surface_baseline.recorded',
        after: {
          area: input.area,
          fileName: file.fileName,
          sha256: file.sha256,
          pointCount: file.pointCount,
          units: { linear: file.linearUnit, elevation: file.elevationUnit, from: file.unitsFrom },
          replaces: locked?.id ?? null,
        },
      });
      return newId;
    });
    return presentOne(db, id, roles);
  } catch (err) {
    await storage.remove(key).catch(() => undefined);
    throw err;
  }
}

async function presentOne(db: Db, id: string, roles: Parameters<typeof presentBaseline>[2]) {
  const row = (await repo.findBaseline(db, id))!;
  return presentBaseline(row, await repo.userNames(db, peopleOf(row)), roles);
}

/** A baseline the actor may see: 404 for a missing one and for one of a project the actor is not on. */
async function loadBaseline(db: Db, actor: Actor, id: string) {
  const row = isUuid(id) ? await repo.findBaseline(db, id) : undefined;
  if (!row) throw notFound('The surface baseline');
  const access = await loadProjectAccess(db, actor, row.projectId).catch((err: unknown) => {
    throw err instanceof AppError && err.status === 404 ? notFound('The surface baseline') : err;
  });
  return { row, ...access };
}

/**
 * The actor accepts the baseline for its side (subcontractor or general contractor). The second acceptance locks
 * it and retires the locked baseline it replaces, in the same transaction: one audit event, `accepted`, `locked`,
 * or `replaced` (locked in place of an earlier one).
 */
export async function acceptBaseline(db: Db, actor: Actor, id: string): Promise<SurfaceBaselineView> {
  const { row, roles } = await loadBaseline(db, actor, id);
  const side = baselineSideOf(roles);
  if (!side) throw forbidden('Only the subcontractor and the general contractor accept an original ground surface.');
  await db.transaction(async (tx) => {
    const b = (await repo.lockBaseline(tx, row.id))!;
    if (b.status !== 'proposed')
      throw new AppError(
        409,
        'BASELINE_NOT_PROPOSED',
        `This original ground surface is ${b.status}; only a proposed one is accepted.`,
      );
    const mine = side === 'subcontractor' ? b.subAcceptedAt : b.gcAcceptedAt;
    if (mine)
      throw new AppError(
        409,
        'BASELINE_ALREADY_ACCEPTED',
        'Your side has already accepted this original ground surface.',
      );
    const now = new Date();
    const acceptance =
      side === 'subcontractor'
        ? { subAcceptedByUserId: actor.userId, subAcceptedAt: now }
        : { gcAcceptedByUserId: actor.userId, gcAcceptedAt: now };
    const both = (side === 'subcontractor' ? b.gcAcceptedAt : b.subAcceptedAt) !== null;
    const previous = both ? await repo.findInState(tx, b.projectId, b.area, 'locked') : undefined;
    if (previous) await repo.updateBaseline(tx, previous.id, { status: 'replaced', replacedAt: now });
    await repo.updateBaseline(tx, b.id, { ...acceptance, ...(both ? { status: 'locked', lockedAt: now } : {}) });
    await recordAudit(tx, {
      projectId: b.projectId,
      actorUserId: actor.userId,
      objectType: 'surface_baseline',
      objectId: b.id,
      action: !both ? 'surface_baseline.accepted' : previous ? 'surface_baseline.replaced' : 'surface_baseline.locked',
      before: { status: b.status, ...(previous ? { locked: { id: previous.id, sha256: previous.sha256 } } : {}) },
      after: { side, status: both ? 'locked' : 'proposed', sha256: b.sha256, area: b.area },
    });
  });
  return presentOne(db, row.id, roles);
}

export async function downloadBaseline(db: Db, storage: Storage, actor: Actor, id: string) {
  const { row } = await loadBaseline(db, actor, id);
  return { row, bytes: await storage.get(row.storageKey) };
}
