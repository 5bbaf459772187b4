import { bigint, check, integer, pgTable, uuid } from 'drizzle-orm/pg-core';
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

/**
 * The same counter per project (migration `project_read_versions`): a write whose rows belong to one project moves
 * only that project's row; people, companies and rows whose project cannot be found move `read_version`. A project
 * gets its row on its first write (absent reads as 0); rows are never deleted.
 */
export const projectReadVersions = pgTable('project_read_versions', {
  projectId: uuid('project_id').primaryKey(),
  version: bigint('version', { mode: 'number' }).notNull(),
});
