import { randomUUID } from 'node:crypto';
import pg from 'pg';
import { afterAll, describe, expect, it } from 'vitest';
import { openDatabase } from '../../server/db/client';
import { runMigrations } from '../../server/db/migrate';
import { shippedMigrations } from '../../server/lib/backup-archive';
import { databaseUrl } from '../setup/postgres';

// Several app servers start at once on one PostgreSQL database (issue 16; docker-compose.yml starts two replicas):
// each runs the migrations at start. Both must come up, and each migration must be applied once. PostgreSQL pass only.
const serverUrl = process.env.TEST_DATABASE_URL;

async function admin(sql: string) {
  const client = new pg.Client({ connectionString: serverUrl });
  await client.connect();
  try {
    await client.query(sql);
  } finally {
    await client.end();
  }
}

describe.skipIf(!serverUrl)('migrations run by several servers starting at the same moment', () => {
  const name = `tallyard_m_${randomUUID().replace(/-/g, '').slice(0, 16)}`;
  afterAll(() => admin(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`));

  it('applies each migration once on an empty database, and every server starts', async () => {
    await admin(`CREATE DATABASE ${name}`);
    const url = databaseUrl(serverUrl!, name);
    const servers = await Promise.all([1, 2, 3].map(() => openDatabase({ kind: 'postgres', url })));
    try {
      const results = await Promise.allSettled(servers.map((s) => runMigrations(s)));
      expect(results.map((r) => (r.status === 'rejected' ? String(r.reason) : 'ok'))).toEqual(['ok', 'ok', 'ok']);
      const client = new pg.Client({ connectionString: url });
      await client.connect();
      const { rows } = await client.query<{ n: number }>('select count(*)::int as n from drizzle.__drizzle_migrations');
      await client.end();
      expect(rows[0]!.n).toBe(shippedMigrations().length);
    } finally {
      await Promise.all(servers.map((s) => s.close()));
    }
  }, 120_000);
});
