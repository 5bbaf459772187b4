import { index, integer, jsonb, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { EMAIL_STATUSES } from '../../../src/shared/constants';
import { timestamps } from './columns';
import { projects } from './projects';

export const emailStatus = pgEnum('email_status', EMAIL_STATUSES);

/**
 * Mail to send, written in the same transaction as the state change it announces and sent after commit with
 * retries; a failed send never rolls the change back and is recorded in the audit trail.
 */
export const emailOutbox = pgTable(
  'email_outbox',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    projectId: uuid('project_id').references(() => projects.id, { onDelete: 'cascade' }),
    template: text('template').notNull(),
    toAddresses: jsonb('to_addresses').$type<string[]>().notNull(),
    subject: text('subject').notNull(),
    text: text('text').notNull(),
    html: text('html').notNull(),
    status: emailStatus('status').notNull().default('pending'),
    attempts: integer('attempts').notNull().default(0),
    lastError: text('last_error'),
    sentAt: timestamp('sent_at', { withTimezone: true }),
    nextAttemptAt: timestamp('next_attempt_at', { withTimezone: true }).notNull().defaultNow(),
    /** While a server sends it: others skip it until then (a crashed server's lease runs out and another sends it). */
    leasedUntil: timestamp('leased_until', { withTimezone: true }),
    ...timestamps,
  },
  (t) => [index().on(t.status, t.nextAttemptAt)],
);
