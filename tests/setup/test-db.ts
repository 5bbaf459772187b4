import { readFileSync } from 'node:fs';
import { openDatabase, type Database } from '../../server/db/client';
import { runMigrations } from '../../server/db/migrate';
import { SNAPSHOT_FILE } from './global-setup';

/**
 * A fresh database for one test file: PostgreSQL when TEST_DATABASE_URL is set (the suite's second pass),
 * otherwise an in-memory PGlite started from the migrated snapshot.
 */
export async function createTestDatabase(): Promise<Database> {
  const url = process.env.TEST_DATABASE_URL;
  if (url) {
    const database = await openDatabase({ kind: 'postgres', url });
    await runMigrations(database);
    return database;
  }
  const blob = new Blob([readFileSync(SNAPSHOT_FILE)]);
  return openDatabase({ kind: 'pglite-memory', loadDataDir: blob });
}
