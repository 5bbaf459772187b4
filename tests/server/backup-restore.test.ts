import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { openDatabase } from '../../server/db/client';
import { runMigrations } from '../../server/db/migrate';
import { companies } from '../../server/db/schema';
import { restoreDataDir, restorePostgres } from '../../server/lib/backup';
import { shippedMigrations } from '../../server/lib/backup-archive';
import { dataDirLayout, lockDataDir } from '../../server/lib/data-dir';

const root = mkdtempSync(path.join(tmpdir(), 'tallyard-backup-test-'));
const dataDir = path.join(root, 'data');
const outDir = path.join(root, 'backups');
const layout = dataDirLayout(dataDir);
afterAll(() => rmSync(root, { recursive: true, force: true }));

/** Unpacks an archive into a new folder under the test root. */
function unpack(file: string, name: string): string {
  const folder = path.join(root, name);
  mkdirSync(folder);
  spawnSync('tar', ['-xzf', file, '-C', folder]);
  return folder;
}

/** Packs a folder (an edited backup) into a new archive. */
function repack(folder: string, name: string): string {
  const file = path.join(root, `${name}.tar.gz`);
  spawnSync('tar', ['-czf', file, '-C', folder, ...readdirSync(folder)]);
  return file;
}

const asideFolders = () => readdirSync(dataDir).filter((n) => n.startsWith('before-restore-'));

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
    expect(file).toMatch(/^tallyard-embedded-.*\.tar\.gz$/);
    const look = unpack(path.join(outDir, file!), 'look');
    const manifest = JSON.parse(readFileSync(path.join(look, 'manifest.json'), 'utf8'));
    expect(manifest).toMatchObject({ format: 'tallyard-backup', version: 2, mode: 'embedded', missingUploads: [] });
    expect(manifest.migrations).toEqual({
      applied: shippedMigrations().length,
      latest: shippedMigrations().at(-1)!.tag,
    });
    expect(manifest.parts.map((p: { name: string }) => p.name)).toEqual(['database', 'uploads']);
    for (const part of manifest.parts) {
      expect(
        createHash('sha256')
          .update(readFileSync(path.join(look, part.file)))
          .digest('hex'),
        part.name,
      ).toBe(part.sha256);
    }

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
      await expect(restoreDataDir(dataDir, path.join(outDir, file!))).rejects.toThrow(
        /Another Tallyard process is using the data folder/,
      );
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

  it('refuses an archive whose part fails its checksum, naming the part, and changes nothing', async () => {
    const [file] = readdirSync(outDir);
    const work = unpack(path.join(outDir, file!), 'tampered');
    writeFileSync(
      path.join(work, 'uploads.tar'),
      Buffer.concat([readFileSync(path.join(work, 'uploads.tar')), Buffer.alloc(512)]),
    );
    const asideBefore = asideFolders();
    await expect(restoreDataDir(dataDir, repack(work, 'tampered'))).rejects.toThrow(
      /The uploads part \(uploads\.tar\) of .* fails its checksum/,
    );
    expect(asideFolders()).toEqual(asideBefore);
    expect(await companyNames()).toEqual(['Backed Up Owner']);
  }, 60_000);

  it('refuses a manifest that does not match: a field missing, a file it does not list, another format version', async () => {
    const [file] = readdirSync(outDir);
    const edit = (name: string, change: (m: Record<string, unknown>, folder: string) => unknown) => {
      const work = unpack(path.join(outDir, file!), name);
      const manifest = JSON.parse(readFileSync(path.join(work, 'manifest.json'), 'utf8'));
      writeFileSync(path.join(work, 'manifest.json'), JSON.stringify(change(manifest, work) ?? manifest));
      return repack(work, name);
    };
    const noMigrations = edit('no-migrations', (m) => ({ ...m, migrations: undefined }));
    await expect(restoreDataDir(dataDir, noMigrations)).rejects.toThrow(
      /manifest of .* does not match the backup format: migrations: /,
    );
    const extra = edit('extra-file', (_m, folder) => writeFileSync(path.join(folder, 'notes.txt'), 'hello'));
    await expect(restoreDataDir(dataDir, extra)).rejects.toThrow(/holds files its manifest does not list: notes\.txt/);
    const version1 = edit('version-1', (m) => ({ ...m, version: 1 }));
    await expect(restoreDataDir(dataDir, version1)).rejects.toThrow(
      /backup format version 1; this Tallyard reads version 2/,
    );
    const future = edit('future-migration', (m) => ({
      ...m,
      migrations: { applied: 99, latest: '0099_from_the_future' },
    }));
    await expect(restoreDataDir(dataDir, future)).rejects.toThrow(
      /made at migration 0099_from_the_future, which this version of Tallyard does not have/,
    );
    // An embedded backup is never poured into a PostgreSQL server (checked before any connection is made).
    await expect(
      restorePostgres('postgresql://nobody@127.0.0.1:9/none', dataDir, path.join(outDir, file!)),
    ).rejects.toThrow(/is a backup of the embedded database, but DATABASE_URL is set/);
    expect(await companyNames()).toEqual(['Backed Up Owner']);
  }, 60_000);

  it('npm run restore without --yes says what it would replace and changes nothing', async () => {
    const [file] = readdirSync(outDir);
    const asideBefore = asideFolders();
    const restore = cli('scripts/restore.ts', [path.join(outDir, file!)]);
    expect(restore.status).toBe(1);
    expect(restore.stdout).toMatch(/embedded backup made .* every part's checksum matches/);
    expect(restore.stderr).toMatch(/This replaces the embedded database and uploads in .* Run again with --yes/);
    expect(asideFolders()).toEqual(asideBefore);
  }, 60_000);
});
