import { readFileSync } from 'node:fs';
import { openDatabase, type Database } from '../../server/db/client';
import { SNAPSHOT_FILE } from './global-setup';
import { cloneTemplate } from './postgres';

/**
 * A fresh database for one test file: with TEST_DATABASE_URL (the suite's PostgreSQL pass) a new database copied
 * from the migrated template and dropped on close; otherwise an in-memory PGlite started from the snapshot.
 */
export async function createTestDatabase(): Promise<Database> {
  const serverUrl = process.env.TEST_DATABASE_URL;
  if (serverUrl) {
    const clone = await cloneTemplate(serverUrl);
    const database = await openDatabase({ kind: 'postgres', url: clone.url });
    return {
      ...database,
      close: async () => {
        await database.close();
        await clone.drop();
      },
    };
  }
  const blob = new Blob([readFileSync(SNAPSHOT_FILE)]);
  return openDatabase({ kind: 'pglite-memory', loadDataDir: blob });
}
