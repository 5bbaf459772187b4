import { execFileSync } from 'node:child_process';
import { cpSync, existsSync, mkdirSync, mkdtempSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { PGlite } from '@electric-sql/pglite';
import { dataDirLayout, lockDataDir } from './data-dir';

const FORMAT = 'tallyard-backup';
type Manifest = { format: typeof FORMAT; version: 1; createdAt: string; database: 'pglite' };

/**
 * Writes one .tar.gz with the embedded database (PGlite's dumpDataDir, taken under the data folder lock, so no
 * server is writing), the uploads folder and the auth secret. The file holds password hashes and the secret:
 * keep it as private as the data folder. Returns the file's path.
 */
export async function backupDataDir(dataDir: string, outDir: string): Promise<string> {
  const layout = dataDirLayout(dataDir);
  if (!existsSync(layout.db)) throw new Error(`There is no database in ${layout.db} to back up.`);
  const unlock = await lockDataDir(layout);
  const stage = mkdtempSync(path.join(tmpdir(), 'tallyard-backup-'));
  try {
    const pg = await PGlite.create(layout.db);
    const dump = await pg.dumpDataDir('gzip');
    await pg.close();
    writeFileSync(path.join(stage, 'db.tar.gz'), Buffer.from(await dump.arrayBuffer()));
    if (existsSync(layout.uploads)) cpSync(layout.uploads, path.join(stage, 'uploads'), { recursive: true });
    const secret = path.join(layout.root, 'auth-secret');
    if (existsSync(secret)) cpSync(secret, path.join(stage, 'auth-secret'));
    const manifest: Manifest = { format: FORMAT, version: 1, createdAt: new Date().toISOString(), database: 'pglite' };
    writeFileSync(path.join(stage, 'manifest.json'), JSON.stringify(manifest, null, 2));
    mkdirSync(outDir, { recursive: true });
    const file = path.resolve(outDir, `tallyard-${manifest.createdAt.replace(/[:.]/g, '-')}.tar.gz`);
    execFileSync('tar', ['-czf', file, '-C', stage, '.']);
    return file;
  } finally {
    rmSync(stage, { recursive: true, force: true });
    await unlock();
  }
}

/**
 * Brings a backup back into the data folder. Refuses while a server holds the folder (the lock). What was there
 * is moved aside into `before-restore-<time>/` rather than deleted. Returns that folder, or null.
 */
export async function restoreDataDir(dataDir: string, file: string): Promise<string | null> {
  if (!existsSync(file)) throw new Error(`No backup file at ${file}.`);
  const layout = dataDirLayout(dataDir);
  const unlock = await lockDataDir(layout);
  const stage = mkdtempSync(path.join(tmpdir(), 'tallyard-restore-'));
  try {
    execFileSync('tar', ['-xzf', path.resolve(file), '-C', stage]);
    const manifestFile = path.join(stage, 'manifest.json');
    const manifest = existsSync(manifestFile) ? (JSON.parse(readFileSync(manifestFile, 'utf8')) as Manifest) : null;
    if (manifest?.format !== FORMAT || manifest.version !== 1) throw new Error(`${file} is not a Tallyard backup.`);
    let aside: string | null = null;
    for (const name of ['db', 'uploads', 'auth-secret']) {
      const current = path.join(layout.root, name);
      if (!existsSync(current)) continue;
      aside ??= path.join(layout.root, `before-restore-${new Date().toISOString().replace(/[:.]/g, '-')}`);
      mkdirSync(aside, { recursive: true });
      renameSync(current, path.join(aside, name));
    }
    const dump = readFileSync(path.join(stage, 'db.tar.gz'));
    const pg = await PGlite.create(layout.db, { loadDataDir: new Blob([dump]) });
    await pg.query('select 1');
    await pg.close();
    if (existsSync(path.join(stage, 'uploads'))) cpSync(path.join(stage, 'uploads'), layout.uploads, { recursive: true });
    if (existsSync(path.join(stage, 'auth-secret'))) cpSync(path.join(stage, 'auth-secret'), path.join(layout.root, 'auth-secret'));
    return aside;
  } finally {
    rmSync(stage, { recursive: true, force: true });
    await unlock();
  }
}
