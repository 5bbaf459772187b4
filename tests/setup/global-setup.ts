import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { PGlite } from '@electric-sql/pglite';
import { drizzle } from 'drizzle-orm/pglite';
import { migrate } from 'drizzle-orm/pglite/migrator';
import { MIGRATIONS_FOLDER } from '../../server/db/migrate';

export const SNAPSHOT_FILE = path.resolve('.data-test/migrated.tar.gz');

/** Migrates one PGlite once per run and dumps it; every test database starts from that snapshot (~0.5 s). */
export default async function setup(): Promise<void> {
  const client = await PGlite.create();
  await migrate(drizzle(client), { migrationsFolder: MIGRATIONS_FOLDER });
  const dump = await client.dumpDataDir('gzip');
  mkdirSync(path.dirname(SNAPSHOT_FILE), { recursive: true });
  writeFileSync(SNAPSHOT_FILE, Buffer.from(await dump.arrayBuffer()));
  await client.close();
}
