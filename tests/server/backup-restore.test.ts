import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { openDatabase } from '../../server/db/client';
import { runMigrations } from '../../server/db/migrate';
import { companies } from '../../server/db/schema';
import { restoreDataDir } from '../../server/lib/backup';
import { dataDirLayout, lockDataDir } from '../../server/lib/data-dir';

const root = mkdtempSync(path.join(tmpdir(), 'tallyard-backup-test-'));
const dataDir = path.join(root, 'data');
const outDir = path.join(root, 'backups');
const layout = dataDirLayout(dataDir);
afterAll(() => rmSync(root, { recursive: true, force: true }));

const cli = (script: string, args: string[] = []) =>
  spawnSync(process.execPath, ['--import', 'tsx', script, ...args], {
    env: { ...process.env, DATA_DIR: dataDir, DATABASE_URL: '' },
    encoding: 'utf8',
  });

async function companyNames(): Promise<string[]> {
  const database = await openDatabase({ kind: 'pglite', dataDir: layout.db });
  const rows = await database.db.select({ name: companies.name }).from(companies);
  await database.close();
  return rows.map((r) => r.name).sort();
}

describe('npm run backup and npm run restore', () => {
  it('round-trips the database and the uploads, keeping what was replaced aside', async () => {
    const database = await openDatabase({ kind: 'pglite', dataDir: layout.db });
    await runMigrations(database);
    await database.db.insert(companies).values({ kind: 'owner', name: 'Backed Up Owner' });
    await database.close();
    mkdirSync(path.join(layout.uploads, 'evidence'), { recursive: true });
    writeFileSync(path.join(layout.uploads, 'evidence', 'ticket.csv'), 'load,tons\n1,18.5\n');

    const backup = cli('scripts/backup.ts', ['--out', outDir]); // the npm run backup CLI
    expect(backup.status, backup.stderr).toBe(0);
    const [file] = readdirSync(outDir);
    expect(file).toMatch(/^tallyard-.*\.tar\.gz$/);

    // Change everything after the backup.
    const later = await openDatabase({ kind: 'pglite', dataDir: layout.db });
    await later.db.delete(companies).where(eq(companies.name, 'Backed Up Owner'));
    await later.db.insert(companies).values({ kind: 'owner', name: 'Added Later' });
    await later.close();
    rmSync(layout.uploads, { recursive: true });

    const aside = await restoreDataDir(dataDir, path.join(outDir, file!)); // what npm run restore calls
    expect(aside).toMatch(/before-restore-/);
    expect(await companyNames()).toEqual(['Backed Up Owner']);
    expect(readFileSync(path.join(layout.uploads, 'evidence', 'ticket.csv'), 'utf8')).toContain('18.5');
    expect(readdirSync(dataDir).some((n) => n.startsWith('before-restore-'))).toBe(true);
  }, 120_000);

  it('refuses to restore while a server holds the data folder, and changes nothing', async () => {
    const [file] = readdirSync(outDir);
    const unlock = await lockDataDir(layout);
    try {
      await expect(restoreDataDir(dataDir, path.join(outDir, file!))).rejects.toThrow(/Another Tallyard process is using the data folder/);
      expect(existsSync(layout.db)).toBe(true);
      expect(readdirSync(dataDir).filter((n) => n.startsWith('before-restore-'))).toHaveLength(1);
    } finally {
      await unlock();
    }
  }, 60_000);

  it('refuses a file that is not a Tallyard backup', () => {
    const bogus = path.join(root, 'bogus.tar.gz');
    spawnSync('tar', ['-czf', bogus, '-C', root, 'backups']);
    const restore = cli('scripts/restore.ts', [bogus]); // the npm run restore CLI
    expect(restore.status).toBe(1);
    expect(restore.stderr).toMatch(/not a Tallyard backup/);
  }, 30_000);
});
