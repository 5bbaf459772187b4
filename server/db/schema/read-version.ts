import { bigint, check, integer, pgTable } from 'drizzle-orm/pg-core';
import { sql } from 'drizzle-orm';

/**
 * One row whose `version` grows by one in every committed transaction that writes a table a cached read depends on
 * (the triggers are in migration `read_version_triggers`; the tables, and those left out, in
 * `server/db/read-version-tables.ts`). The bump is in the writer's own transaction, so a reader that sees version N
 * sees every write committed before it. Not a sequence: nextval is taken before commit, so a reader could pair a
 * new number with old rows.
 */
export const readVersion = pgTable(
  'read_version',
  {
    id: integer('id').primaryKey(),
    version: bigint('version', { mode: 'number' }).notNull().default(0),
  },
  (t) => [check('read_version_one_row', sql`${t.id} = 1`)],
);
