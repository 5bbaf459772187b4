import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { PGlite } from '@electric-sql/pglite';
import type { ExtractTablesWithRelations } from 'drizzle-orm';
import { drizzle as drizzlePg } from 'drizzle-orm/node-postgres';
import type { PgDatabase, PgQueryResultHKT, PgTransaction } from 'drizzle-orm/pg-core';
import { drizzle as drizzlePglite } from 'drizzle-orm/pglite';
import pg from 'pg';
import * as schema from './schema';

export type Schema = typeof schema;
/** One database type for both drivers: PGlite (embedded) and node-postgres (a server). */
export type Db = PgDatabase<PgQueryResultHKT, Schema, ExtractTablesWithRelations<Schema>>;
export type Tx = PgTransaction<PgQueryResultHKT, Schema, ExtractTablesWithRelations<Schema>>;
/** Anything a repository can run a query on: the database or an open transaction. */
export type Executor = Db | Tx;

export type Database = {
  db: Db;
  kind: 'pglite' | 'postgres';
  close: () => Promise<void>;
};

export type DatabaseOptions =
  | { kind: 'postgres'; url: string }
  | { kind: 'pglite'; dataDir: string }
  | { kind: 'pglite-memory'; loadDataDir?: Blob | File };

export async function openDatabase(options: DatabaseOptions): Promise<Database> {
  if (options.kind === 'postgres') {
    const pool = new pg.Pool({ connectionString: options.url, max: 10 });
    // An idle connection the server ends (restart, failover, a dropped test database) must not crash the process;
    // the pool replaces it on the next query.
    pool.on('error', (err) => console.warn(`PostgreSQL connection lost: ${err.message}`));
    const db = drizzlePg(pool, { schema, casing: 'snake_case' }) as unknown as Db;
    return { db, kind: 'postgres', close: () => pool.end() };
  }
  let client: PGlite;
  if (options.kind === 'pglite') {
    // PGlite does not create parent folders itself.
    mkdirSync(path.dirname(path.resolve(options.dataDir)), { recursive: true });
    client = await PGlite.create(options.dataDir);
  } else {
    client = await PGlite.create(options.loadDataDir ? { loadDataDir: options.loadDataDir } : {});
  }
  const db = drizzlePglite(client, { schema, casing: 'snake_case' }) as unknown as Db;
  return { db, kind: 'pglite', close: () => client.close() };
}
