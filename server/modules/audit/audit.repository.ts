import type { Executor } from '../../db/client';
import { auditEvents } from '../../db/schema';

export type AuditEntry = {
  projectId: string | null;
  actorUserId: string | null;
  objectType: string;
  objectId: string;
  action: string;
  before?: unknown;
  after?: unknown;
};

/** Writes one audit event; call it inside the transaction of the change it records. */
export async function recordAudit(tx: Executor, entry: AuditEntry): Promise<void> {
  await tx.insert(auditEvents).values({
    ...entry,
    before: entry.before ?? null,
    after: entry.after ?? null,
  });
}
