import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { PGlite } from '@electric-sql/pglite';
import { drizzle } from 'drizzle-orm/pglite';
import { migrate } from 'drizzle-orm/pglite/migrator';
import { openDatabase } from '../../server/db/client';
import { MIGRATIONS_FOLDER, runMigrations } from '../../server/db/migrate';
import { databaseUrl, PG_TEMPLATE, recreateTemplate } from './postgres';

export const SNAPSHOT_FILE = path.resolve('.data-test/migrated.tar.gz');
/** The seeded demo of tests/setup/demo-snapshot.ts, made by the first browser test of a run from this snapshot. */
export const DEMO_SNAPSHOT_DIR = path.resolve('.data-test/demo');

/**
 * Migrates once per run: a PGlite dumped to a snapshot that every test database starts from (~0.5 s), or, with
 * TEST_DATABASE_URL, a template database on the PostgreSQL server that each test file copies.
 */
export default async function setup(): Promise<void> {
  const serverUrl = process.env.TEST_DATABASE_URL;
  if (serverUrl) {
    await recreateTemplate(serverUrl);
    const template = await openDatabase({ kind: 'postgres', url: databaseUrl(serverUrl, PG_TEMPLATE) });
    await runMigrations(template);
    await template.close();
    return;
  }
  rmSync(DEMO_SNAPSHOT_DIR, { recursive: true, force: true });
  const client = await PGlite.create();
  await migrate(drizzle(client), { migrationsFolder: MIGRATIONS_FOLDER });
  const dump = await client.dumpDataDir('gzip');
  mkdirSync(path.dirname(SNAPSHOT_FILE), { recursive: true });
  writeFileSync(SNAPSHOT_FILE, Buffer.from(await dump.arrayBuffer()));
  await client.close();
}
