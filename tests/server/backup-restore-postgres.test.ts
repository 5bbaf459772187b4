import { spawnSync } from 'node:child_process';
import { createHash, randomUUID } from 'node:crypto';
import {
  chmodSync,
  existsSync,
  mkdirSync,
  mkdtempSync,
  readdirSync,
  readFileSync,
  rmSync,
  statSync,
  writeFileSync,
} from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createAuth } from '../../server/auth';
import { openDatabase } from '../../server/db/client';
import { runMigrations } from '../../server/db/migrate';
import { seedDemo } from '../../server/db/seed-demo';
import { localStorage } from '../../server/integrations/storage/storage';
import { shippedMigrations } from '../../server/lib/backup-archive';
import { findPgTool } from '../../server/lib/backup-postgres';
import { dataDirLayout } from '../../server/lib/data-dir';
import { fastPasswordHasher } from '../setup/fast-password';
import { cloneTemplate, databaseUrl } from '../setup/postgres';

const root = mkdtempSync(path.join(tmpdir(), 'tallyard-pg-backup-test-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

describe('finding pg_dump and pg_restore', () => {
  const fakeTool = (dir: string, name: string, version: string) => {
    mkdirSync(dir, { recursive: true });
    const file = path.join(dir, name);
    writeFileSync(file, `#!/bin/sh\necho "${name} (PostgreSQL) ${version}"\n`);
    chmodSync(file, 0o755);
  };

  it('takes the newest of PATH and /usr/lib/postgresql/<version>/bin', () => {
    const onPath = path.join(root, 'tools-a', 'path');
    const libDir = path.join(root, 'tools-a', 'lib');
    fakeTool(onPath, 'pg_dump', '13.2');
    fakeTool(path.join(libDir, '16', 'bin'), 'pg_dump', '16.4');
    fakeTool(path.join(libDir, '9.6', 'bin'), 'pg_dump', '9.6.24');
    const tool = findPgTool('pg_dump', { major: 15, of: 'the server' }, { path: onPath, libDir });
    expect(tool).toMatchObject({ path: path.join(libDir, '16', 'bin', 'pg_dump'), version: '16.4', major: 16 });
  });

  it('says so when pg_dump is missing, and names the package', () => {
    const search = { path: path.join(root, 'empty'), libDir: path.join(root, 'no-such-lib') };
    expect(() => findPgTool('pg_dump', { major: 15, of: 'the server' }, search)).toThrow(
      /pg_dump was not found on PATH or under .*\/\*\/bin.*postgresql-client/,
    );
  });

  it('refuses a pg_dump older than the server, naming both versions', () => {
    const onPath = path.join(root, 'tools-b');
    fakeTool(onPath, 'pg_dump', '15.8');
    expect(() =>
      findPgTool(
        'pg_dump',
        { major: 17, of: 'the PostgreSQL 17.2 server' },
        { path: onPath, libDir: path.join(root, 'none') },
      ),
    ).toThrow(/pg_dump 15\.8 .* is older than the PostgreSQL 17\.2 server \(17\): install postgresql-client-17/);
  });
});

const serverUrl = process.env.TEST_DATABASE_URL;
const pgDumpMissing = (() => {
  try {
    findPgTool('pg_dump', { major: 0, of: 'any server' });
    return null;
  } catch (err) {
    return (err as Error).message;
  }
})();
const skipReason = !serverUrl
  ? 'TEST_DATABASE_URL is not set; scripts/test-postgres.sh sets it'
  : pgDumpMissing
    ? `no pg_dump: ${pgDumpMissing}`
    : null;

async function admin<T>(run: (c: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: serverUrl });
  await client.connect();
  try {
    return await run(client);
  } finally {
    await client.end();
  }
}

async function onDatabase<T>(url: string, run: (c: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    return await run(client);
  } finally {
    await client.end();
  }
}

/** Row counts of every table of the app and of drizzle's migration journal. */
const rowCounts = (url: string) =>
  onDatabase(url, async (c) => {
    const tables = await c.query<{ s: string; t: string }>(
      `select table_schema as s, table_name as t from information_schema.tables
       where table_schema in ('public', 'drizzle') and table_type = 'BASE TABLE' order by 1, 2`,
    );
    const counts: Record<string, number> = {};
    for (const { s, t } of tables.rows)
      counts[`${s}.${t}`] = Number((await c.query(`select count(*) as n from "${s}"."${t}"`)).rows[0].n);
    return counts;
  });

/** Money totals in integer cents. */
const moneyTotals = (url: string) =>
  onDatabase(url, async (c) => {
    const { rows } = await c.query<Record<string, string>>(
      `select (select sum(earned_to_date_cents) from pay_apps) as earned, (select sum(retainage_cents) from pay_apps) as retainage,
              (select sum(current_due_cents) from pay_apps) as due, (select sum(paid_cents) from pay_apps) as paid,
              (select sum(amount_to_date_cents) from pay_app_lines) as lines, (select sum(amount_cents) from payments) as payments`,
    );
    return Object.fromEntries(Object.entries(rows[0]!).map(([k, v]) => [k, Number(v)]));
  });

/** SHA-256 of every file under the uploads folder, by its path there. */
function uploadHashes(folder: string): Record<string, string> {
  const files = existsSync(folder) ? readdirSync(folder, { recursive: true, encoding: 'utf8' }) : [];
  const out: Record<string, string> = {};
  for (const name of files.sort()) {
    const full = path.join(folder, name);
    if (statSync(full).isFile()) out[name] = createHash('sha256').update(readFileSync(full)).digest('hex');
  }
  return out;
}

describe.skipIf(skipReason)(
  `npm run backup and restore on a PostgreSQL server${skipReason ? ` (skipped: ${skipReason})` : ''}`,
  () => {
    const dataDir = path.join(root, 'data');
    const outDir = path.join(root, 'backups');
    const layout = dataDirLayout(dataDir);
    let source: { url: string; drop: () => Promise<void> };
    let before: { counts: Record<string, number>; money: Record<string, number>; uploads: Record<string, string> };
    let archive: string;
    const extraDatabases: string[] = [];

    const cli = (script: string, args: string[], url: string | undefined) =>
      spawnSync(process.execPath, ['--import', 'tsx', script, ...args], {
        env: { ...process.env, DATA_DIR: dataDir, DATABASE_URL: url ?? '', LOG_LEVEL: 'silent' },
        encoding: 'utf8',
      });

    beforeAll(async () => {
      source = await cloneTemplate(serverUrl!); // a throwaway database, already migrated
      const database = await openDatabase({ kind: 'postgres', url: source.url });
      const auth = createAuth({
        db: database.db,
        secret: 'backup-test-secret-backup-test-secret-00',
        baseURL: 'http://localhost:3000',
        trustedOrigins: [],
        secureCookies: false,
        passwordHasher: fastPasswordHasher,
      });
      // The demo scenario through the real services: pay applications (paid, certified, in review), payments,
      // tallies with CSV evidence written to DATA_DIR/uploads.
      expect(await seedDemo(database.db, auth, localStorage(layout.uploads))).toBe(true);
      await database.close();
      writeFileSync(path.join(layout.root, 'auth-secret'), 'a'.repeat(64) + '\n');
      before = {
        counts: await rowCounts(source.url),
        money: await moneyTotals(source.url),
        uploads: uploadHashes(layout.uploads),
      };
      expect(before.counts['public.pay_apps']).toBeGreaterThan(1);
      expect(before.counts['public.tally_evidence']).toBeGreaterThan(0);
      expect(before.counts['public.payments']).toBeGreaterThan(0);
      expect(Object.keys(before.uploads).length).toBeGreaterThanOrEqual(before.counts['public.tally_evidence']!);
    }, 120_000);

    afterAll(async () => {
      await source?.drop();
      for (const name of extraDatabases) await admin((c) => c.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`));
    });

    it('backs up with the app connected: pg_dump custom format plus the uploads, with a manifest of checksums', async () => {
      const app = new pg.Client({ connectionString: source.url }); // a running app's open connection
      await app.connect();
      try {
        const backup = cli('scripts/backup.ts', ['--out', outDir], source.url);
        expect(backup.status, backup.stderr).toBe(0);
        expect(backup.stdout).toMatch(/Backup written: .*tallyard-postgres-.*\.tar\.gz/);
      } finally {
        await app.end();
      }
      archive = path.join(
        outDir,
        readdirSync(outDir).find((n) => n.endsWith('.tar.gz'))!,
      );
      const look = path.join(root, 'look');
      mkdirSync(look);
      spawnSync('tar', ['-xzf', archive, '-C', look]);
      const manifest = JSON.parse(readFileSync(path.join(look, 'manifest.json'), 'utf8'));
      expect(manifest).toMatchObject({ format: 'tallyard-backup', version: 2, mode: 'postgres', missingUploads: [] });
      expect(manifest.migrations).toEqual({
        applied: shippedMigrations().length,
        latest: shippedMigrations().at(-1)!.tag,
      });
      expect(manifest.parts.map((p: { name: string }) => p.name)).toEqual(['database', 'uploads', 'auth-secret']);
      for (const part of manifest.parts) {
        expect(
          createHash('sha256')
            .update(readFileSync(path.join(look, part.file)))
            .digest('hex'),
          part.name,
        ).toBe(part.sha256);
      }
      // pg_dump's custom format starts with "PGDMP" (PostgreSQL documentation, pg_dump, -F c).
      expect(readFileSync(path.join(look, 'database.pgdump')).subarray(0, 5).toString()).toBe('PGDMP');
    }, 60_000);

    it('refuses while another session is connected, and without --yes, changing nothing', async () => {
      await onDatabase(source.url, (c) =>
        c.query(`insert into companies (kind, name) values ('owner', 'Added After The Backup')`),
      );
      const app = new pg.Client({ connectionString: source.url });
      await app.connect();
      try {
        const busy = cli('scripts/restore.ts', [archive, '--yes'], source.url);
        expect(busy.status).toBe(1);
        expect(busy.stderr).toMatch(/1 other session is connected to this database .*Stop the app/);
      } finally {
        await app.end();
      }
      const unconfirmed = cli('scripts/restore.ts', [archive], source.url);
      expect(unconfirmed.status).toBe(1);
      expect(unconfirmed.stderr).toMatch(/Run again with --yes/);
      const names = await onDatabase(source.url, (c) =>
        c.query(`select 1 from companies where name = 'Added After The Backup'`),
      );
      expect(names.rowCount).toBe(1);
    }, 60_000);

    it('restores over a changed database (a table dropped, money changed, uploads lost): counts, totals and bytes come back', async () => {
      await onDatabase(source.url, async (c) => {
        await c.query('update pay_apps set paid_cents = 0, current_due_cents = current_due_cents * 2');
        await c.query('drop table tally_evidence cascade');
      });
      const [lost] = Object.keys(before.uploads);
      rmSync(path.join(layout.uploads, lost!));
      writeFileSync(path.join(layout.uploads, 'stray.bin'), 'not from the backup');
      expect(await moneyTotals(source.url)).not.toEqual(before.money);

      const restore = cli('scripts/restore.ts', [archive, '--yes'], source.url);
      expect(restore.status, restore.stderr).toBe(0);
      expect(await rowCounts(source.url)).toEqual(before.counts);
      expect(await moneyTotals(source.url)).toEqual(before.money);
      expect(uploadHashes(layout.uploads)).toEqual(before.uploads);
      // The bytes are the evidence the database describes: its stored SHA-256 matches each file.
      const evidence = await onDatabase(source.url, (c) =>
        c.query<{ k: string; h: string }>('select storage_key as k, sha256 as h from tally_evidence'),
      );
      for (const row of evidence.rows) expect(before.uploads[row.k], row.k).toBe(row.h);
      const aside = readdirSync(dataDir).find((n) => n.startsWith('before-restore-'))!;
      expect(existsSync(path.join(dataDir, aside, 'uploads', 'stray.bin'))).toBe(true);
      // The app starts on it: its migrations find nothing to do.
      const database = await openDatabase({ kind: 'postgres', url: source.url });
      await runMigrations(database);
      await database.close();
      expect(await rowCounts(source.url)).toEqual(before.counts);
    }, 90_000);

    it('restores into a new empty database on the same server', async () => {
      const name = `tallyard_restore_${randomUUID().replace(/-/g, '').slice(0, 12)}`;
      extraDatabases.push(name);
      await admin((c) => c.query(`CREATE DATABASE ${name}`));
      const target = databaseUrl(serverUrl!, name);
      const restore = cli('scripts/restore.ts', [archive, '--yes'], target);
      expect(restore.status, restore.stderr).toBe(0);
      expect(await rowCounts(target)).toEqual(before.counts);
      expect(await moneyTotals(target)).toEqual(before.money);
    }, 90_000);

    it('refuses a database at a migration the backup does not have, an embedded target, and a pg_restore older than the dump', async () => {
      const name = `tallyard_newer_${randomUUID().replace(/-/g, '').slice(0, 12)}`;
      extraDatabases.push(name);
      await admin((c) => c.query(`CREATE DATABASE ${name}`));
      const target = databaseUrl(serverUrl!, name);
      await onDatabase(target, async (c) => {
        await c.query(
          'create schema drizzle; create table drizzle.__drizzle_migrations (id serial primary key, hash text not null, created_at bigint)',
        );
        await c.query(
          `insert into drizzle.__drizzle_migrations (hash, created_at) values ('later', ${Date.now() + 86_400_000})`,
        );
      });
      const newer = cli('scripts/restore.ts', [archive, '--yes'], target);
      expect(newer.status).toBe(1);
      expect(newer.stderr).toMatch(
        /The database is at migration unknown-\d+, newer than the backup's .*Restore into an empty database/,
      );

      const embedded = cli('scripts/restore.ts', [archive, '--yes'], undefined);
      expect(embedded.status).toBe(1);
      expect(embedded.stderr).toMatch(/is a backup of a PostgreSQL server: set DATABASE_URL/);

      // The manifest is not covered by the part checksums; a claim of a newer pg_dump is refused by version.
      const work = path.join(root, 'newer-dump');
      mkdirSync(work);
      spawnSync('tar', ['-xzf', archive, '-C', work]);
      const manifest = JSON.parse(readFileSync(path.join(work, 'manifest.json'), 'utf8'));
      writeFileSync(
        path.join(work, 'manifest.json'),
        JSON.stringify({ ...manifest, postgres: { ...manifest.postgres, pgDumpVersion: '99.1' } }),
      );
      const edited = path.join(root, 'newer-dump.tar.gz');
      spawnSync('tar', ['-czf', edited, '-C', work, '.']);
      const old = cli('scripts/restore.ts', [edited, '--yes'], target);
      expect(old.status).toBe(1);
      expect(old.stderr).toMatch(/pg_restore [\d.]+ .* is older than the pg_dump 99\.1 that wrote the backup/);
    }, 60_000);

    it('lists, and warns of, files the database refers to that are missing from the uploads', async () => {
      const evidence = await onDatabase(source.url, (c) =>
        c.query<{ k: string }>('select storage_key as k from tally_evidence order by 1 limit 1'),
      );
      const key = evidence.rows[0]!.k;
      rmSync(path.join(layout.uploads, key));
      const out = path.join(root, 'backups-missing');
      const backup = cli('scripts/backup.ts', ['--out', out], source.url);
      expect(backup.status, backup.stderr).toBe(0);
      expect(backup.stderr).toContain(`Warning: 1 file(s) the database refers to were not in`);
      expect(backup.stderr).toContain(key);
      const look = path.join(root, 'look-missing');
      mkdirSync(look);
      spawnSync('tar', ['-xzf', path.join(out, readdirSync(out)[0]!), '-C', look, 'manifest.json']);
      expect(JSON.parse(readFileSync(path.join(look, 'manifest.json'), 'utf8')).missingUploads).toEqual([key]);
    }, 60_000);
  },
);
