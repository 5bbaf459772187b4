import { randomUUID } from 'node:crypto';
import pg from 'pg';

export const PG_TEMPLATE = 'tallyard_test_template';

/** The URL of another database on the same PostgreSQL server. */
export function databaseUrl(serverUrl: string, name: string): string {
  const url = new URL(serverUrl);
  url.pathname = `/${name}`;
  return url.toString();
}

async function admin<T>(serverUrl: string, run: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: serverUrl });
  await client.connect();
  try {
    return await run(client);
  } finally {
    await client.end();
  }
}

/** Recreates the empty template database the migrations are applied to once per run. */
export function recreateTemplate(serverUrl: string) {
  return admin(serverUrl, async (c) => {
    await c.query(`DROP DATABASE IF EXISTS ${PG_TEMPLATE} WITH (FORCE)`);
    await c.query(`CREATE DATABASE ${PG_TEMPLATE}`);
  });
}

/** A fresh database for one test file, copied from the migrated template; `drop` removes it. */
export async function cloneTemplate(serverUrl: string): Promise<{ url: string; drop: () => Promise<void> }> {
  const name = `tallyard_t_${randomUUID().replace(/-/g, '').slice(0, 16)}`;
  await admin(serverUrl, (c) => c.query(`CREATE DATABASE ${name} TEMPLATE ${PG_TEMPLATE}`));
  return {
    url: databaseUrl(serverUrl, name),
    drop: () => admin(serverUrl, (c) => c.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`)).then(() => undefined),
  };
}
