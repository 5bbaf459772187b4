import { boolean, pgEnum, pgTable, text, uuid } from 'drizzle-orm/pg-core';
import { COMPANY_KINDS } from '../../../src/shared/constants';
import { user } from './auth';
import { timestamps } from './columns';

export const companyKind = pgEnum('company_kind', COMPANY_KINDS);

export const companies = pgTable('companies', {
  id: uuid('id').primaryKey().defaultRandom(),
  name: text('name').notNull(),
  kind: companyKind('kind').notNull(),
  ...timestamps,
});

/** A person belongs to one company; company admins manage its members and invitations. */
export const companyMembers = pgTable('company_members', {
  userId: text('user_id')
    .primaryKey()
    .references(() => user.id, { onDelete: 'cascade' }),
  companyId: uuid('company_id')
    .notNull()
    .references(() => companies.id),
  isAdmin: boolean('is_admin').notNull().default(false),
  ...timestamps,
});
