import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { migrate as migratePg } from 'drizzle-orm/node-postgres/migrator';
import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import { migrate as migratePglite } from 'drizzle-orm/pglite/migrator';
import type { PgliteDatabase } from 'drizzle-orm/pglite';
import type { Database } from './client';

export const MIGRATIONS_FOLDER = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../drizzle');

/** The advisory lock key app servers take around their migrations ("tallyard" in ASCII, as a bigint). */
export const MIGRATION_LOCK_KEY = 0x74616c6c79617264n;

/**
 * Applies the committed drizzle-kit migrations; the same SQL runs on PGlite and on PostgreSQL. On PostgreSQL several
 * app servers may start at once: each waits for a session advisory lock (held on a connection of its own, released by
 * the server if the process dies), so one applies what is missing and the others then find nothing to do. Without
 * it, two servers starting on an older database both applied the same migration and all but one failed to start.
 */
export async function runMigrations(database: Database): Promise<void> {
  if (database.kind === 'postgres') {
    const db = database.db as unknown as NodePgDatabase & { $client: import('pg').Pool };
    const holder = await db.$client.connect();
    try {
      await holder.query('select pg_advisory_lock($1)', [MIGRATION_LOCK_KEY.toString()]);
      await migratePg(db, { migrationsFolder: MIGRATIONS_FOLDER });
    } finally {
      await holder.query('select pg_advisory_unlock($1)', [MIGRATION_LOCK_KEY.toString()]).catch(() => undefined);
      holder.release();
    }
  } else {
    await migratePglite(database.db as unknown as PgliteDatabase, { migrationsFolder: MIGRATIONS_FOLDER });
  }
}
