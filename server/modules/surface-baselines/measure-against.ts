import type { Executor } from '../../db/client';
import { AppError } from '../../lib/app-error';
import { baselineBreaklines, baselineFaces, baselineRows } from './baseline-file';
import * as repo from './surface-baselines.repository';

const required = (message: string) =>
  new AppError(400, 'BASELINE_REQUIRED', message, [{ path: 'inputs.baselineId', message }]);

/**
 * A surface tally on a project with a locked original ground surface measures against it: the tally names the
 * baseline (`inputs.baselineId`) and the server takes the existing survey from the baseline's stored points, never
 * from the client. Answers the engine's inputs, the fields kept beside them, and a trail line; null when the project
 * has no locked baseline (the tally's own existing survey stands).
 */
export async function surfaceAgainstBaseline(
  db: Executor,
  projectId: string,
  inputs: Record<string, unknown> | null | undefined,
): Promise<{ engineInputs: Record<string, unknown>; kept: Record<string, unknown>; trail: string } | null> {
  // The existing survey's faces and breaklines are the baseline's too: what the client sent for them is dropped.
  const {
    baselineId,
    baselineSha256: _sent,
    existingFaces: _faces,
    existingBreaklines: _breaklines,
    ...rest
  } = (inputs ?? {}) as Record<string, unknown>;
  if (baselineId === undefined || baselineId === null) {
    if (await repo.hasLocked(db, projectId))
      throw required('This project has a locked original ground surface: choose it as the existing survey.');
    return null;
  }
  const unit = rest.unit === 'm' ? 'm' : 'ft';
  const b = typeof baselineId === 'string' ? await repo.findLockedWithPoints(db, projectId, baselineId) : undefined;
  if (!b) throw required('The chosen original ground surface is not a locked baseline of this project.');
  const names = await repo.userNames(db, [b.subAcceptedByUserId, b.gcAcceptedByUserId]);
  const day = (d: Date | null) => d?.toISOString().slice(0, 10) ?? '';
  return {
    engineInputs: {
      ...rest,
      existing: baselineRows(b, unit),
      existingFaces: baselineFaces(b),
      existingBreaklines: baselineBreaklines(b, unit),
    },
    kept: { baselineId: b.id, baselineSha256: b.sha256 },
    trail: `Existing surface: the locked original ground "${b.fileName}"${b.area ? ` (${b.area})` : ''}, SHA-256 ${b.sha256}, ${b.pointCount.toLocaleString('en-US')} points; accepted by ${names.get(b.subAcceptedByUserId ?? '') ?? ''} (subcontractor) on ${day(b.subAcceptedAt)} and ${names.get(b.gcAcceptedByUserId ?? '') ?? ''} (general contractor) on ${day(b.gcAcceptedAt)}`,
  };
}
