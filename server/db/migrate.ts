import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { migrate as migratePg } from 'drizzle-orm/node-postgres/migrator';
import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import { migrate as migratePglite } from 'drizzle-orm/pglite/migrator';
import type { PgliteDatabase } from 'drizzle-orm/pglite';
import type { Database } from './client';

export const MIGRATIONS_FOLDER = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../drizzle');

/** Applies the committed drizzle-kit migrations; the same SQL runs on PGlite and on PostgreSQL. */
export async function runMigrations(database: Database): Promise<void> {
  if (database.kind === 'postgres') {
    await migratePg(database.db as unknown as NodePgDatabase, { migrationsFolder: MIGRATIONS_FOLDER });
  } else {
    await migratePglite(database.db as unknown as PgliteDatabase, { migrationsFolder: MIGRATIONS_FOLDER });
  }
}
