import { existsSync, mkdirSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import type { PGlite } from '@electric-sql/pglite';
import { createAuth } from '../../server/auth';
import { openDatabase, type Database } from '../../server/db/client';
import { seedDemo } from '../../server/db/seed-demo';
import { memoryStorage, type Storage } from '../../server/integrations/storage/storage';
import { createLogger } from '../../server/lib/logger';
import { fastPasswordHasher } from './fast-password';
import { DEMO_SNAPSHOT_DIR, SNAPSHOT_FILE } from './global-setup';

// The demo seeded once per run into DEMO_SNAPSHOT_DIR (the global setup removes the last run's): its database, and
// its stored files.
const DATA = 'data.tar.gz';
const FILES = 'files.json';

/** A memory storage that remembers what was put in it, by key. */
function recordingStorage(files: Map<string, Buffer>): Storage {
  const inner = memoryStorage();
  return {
    ...inner,
    async put(bytes, hint) {
      const stored = await inner.put(bytes, hint);
      files.set(stored.key, Buffer.from(bytes));
      return stored;
    },
    async putFile(file, hint) {
      const stored = await inner.putFile(file, hint);
      files.set(stored.key, readFileSync(file));
      return stored;
    },
  };
}

/** Seeds the demo on the migrated snapshot (fast password hashing, as the test servers use) and writes both files. */
async function writeDemoSnapshot(): Promise<void> {
  const database = await openDatabase({ kind: 'pglite-memory', loadDataDir: new Blob([readFileSync(SNAPSHOT_FILE)]) });
  try {
    const auth = createAuth({
      logger: createLogger('silent'),
      db: database.db,
      secret: 'test-secret-test-secret-test-secret-0123',
      baseURL: 'http://127.0.0.1',
      trustedOrigins: [],
      secureCookies: false,
      passwordHasher: fastPasswordHasher,
    });
    const files = new Map<string, Buffer>();
    await seedDemo(database.db, auth, recordingStorage(files));
    const client = (database.db as unknown as { $client: PGlite }).$client;
    const dump = Buffer.from(await (await client.dumpDataDir('gzip')).arrayBuffer());
    // Written into a folder of this process's own, renamed into place whole: two workers may both seed at once, and
    // a reader never sees one's database with the other's files. The second rename finds the folder there and fails.
    const own = `${DEMO_SNAPSHOT_DIR}.${process.pid}`;
    mkdirSync(own, { recursive: true });
    writeFileSync(path.join(own, DATA), dump);
    writeFileSync(
      path.join(own, FILES),
      JSON.stringify(Object.fromEntries([...files].map(([key, bytes]) => [key, bytes.toString('base64')]))),
    );
    try {
      renameSync(own, DEMO_SNAPSHOT_DIR);
    } catch {
      rmSync(own, { recursive: true, force: true });
    }
  } finally {
    await database.close();
  }
}

/**
 * An in-memory PGlite of this caller's own with the demo already seeded, and the demo's stored files in a memory
 * storage of its own: seeding once per run instead of once per browser test file. The first caller of a run seeds.
 */
export async function openDemoDatabase(): Promise<{ database: Database; storage: Storage }> {
  if (!existsSync(DEMO_SNAPSHOT_DIR)) await writeDemoSnapshot();
  const files = JSON.parse(readFileSync(path.join(DEMO_SNAPSHOT_DIR, FILES), 'utf8')) as Record<string, string>;
  const database = await openDatabase({
    kind: 'pglite-memory',
    loadDataDir: new Blob([readFileSync(path.join(DEMO_SNAPSHOT_DIR, DATA))]),
  });
  return {
    database,
    storage: memoryStorage(new Map(Object.entries(files).map(([key, b64]) => [key, Buffer.from(b64, 'base64')]))),
  };
}
