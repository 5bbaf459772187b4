import { index, integer, jsonb, pgTable, primaryKey, text, timestamp } from 'drizzle-orm/pg-core';
import { user } from './auth';

/**
 * Answers already given to a write sent with an `Idempotency-Key` header (IETF draft "The Idempotency-Key HTTP
 * Header Field"): the same key from the same person answers the same again instead of doing the write twice. A row
 * without a status is a write still running. Rows older than a day are removed.
 */
export const idempotentRequests = pgTable(
  'idempotent_requests',
  {
    userId: text('user_id')
      .notNull()
      .references(() => user.id, { onDelete: 'cascade' }),
    key: text('key').notNull(),
    /** SHA-256 of method, path and body: a key sent again with another request is refused. */
    fingerprint: text('fingerprint').notNull(),
    statusCode: integer('status_code'),
    responseBody: jsonb('response_body'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.key] }), index().on(t.createdAt)],
);
