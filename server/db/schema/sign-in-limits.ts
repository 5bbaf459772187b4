import { index, pgTable, primaryKey, text, timestamp, uuid } from 'drizzle-orm/pg-core';

/**
 * Failed sign-ins (and failed re-authentications) by account and client address, for the back-off and the hourly
 * cap of server/lib/sign-in-guard.ts. In the database so every app server counts the same failures; rows older
 * than the hour are deleted as new ones come.
 */
export const signInFailures = pgTable(
  'sign_in_failures',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    account: text('account').notNull(),
    address: text('address').notNull(),
    failedAt: timestamp('failed_at', { withTimezone: true }).notNull(),
  },
  (t) => [index().on(t.account, t.failedAt)],
);

/** Where an account last signed in successfully: its owner's usual places keep working during a guessing attack. */
export const signInKnownAddresses = pgTable(
  'sign_in_known_addresses',
  {
    account: text('account').notNull(),
    address: text('address').notNull(),
    lastSuccessAt: timestamp('last_success_at', { withTimezone: true }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.account, t.address] })],
);
