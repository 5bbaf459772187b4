import type { AuditEventView } from '../../../src/shared/schemas/audit';
import type { AuditRow } from './audit-query.repository';

export function presentAuditEvent(row: AuditRow): AuditEventView {
  return {
    id: row.id,
    at: row.createdAt.toISOString(),
    actor: row.actorUserId ? { userId: row.actorUserId, name: row.actorName ?? 'Former user' } : null,
    objectType: row.objectType,
    objectId: row.objectId,
    action: row.action,
    before: row.before ?? null,
    after: row.after ?? null,
  };
}
