import type { AuditEventView } from '../../../src/shared/schemas/audit';
import { trailChanges, trailSentence, type TrailObject } from '../../../src/shared/trail-words';
import type { AuditRow } from './audit-query.repository';

export function presentAuditEvent(row: AuditRow, object: TrailObject): AuditEventView {
  const actorName = row.actorUserId ? (row.actorName ?? 'A former member') : null;
  return {
    id: row.id,
    sentence: trailSentence({ ...row, actorName }, object.unit),
    object,
    changes: trailChanges(row.before, row.after, object.unit),
    at: row.createdAt.toISOString(),
    actor: row.actorUserId ? { userId: row.actorUserId, name: actorName! } : null,
    objectType: row.objectType,
    objectId: row.objectId,
    action: row.action,
    before: row.before ?? null,
    after: row.after ?? null,
  };
}
