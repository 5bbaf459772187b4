import { bigserial, index, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { user } from './auth';
import { projects } from './projects';

/** Append-only: no route updates or deletes a row (a trigger in the migration refuses it). */
export const auditEvents = pgTable(
  'audit_events',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    projectId: uuid('project_id').references(() => projects.id, { onDelete: 'cascade' }),
    actorUserId: text('actor_user_id').references(() => user.id),
    objectType: text('object_type').notNull(),
    objectId: text('object_id').notNull(),
    action: text('action').notNull(),
    before: jsonb('before'),
    after: jsonb('after'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index().on(t.projectId, t.createdAt), index().on(t.objectType, t.objectId)],
);
