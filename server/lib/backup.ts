import { spawnSync } from 'node:child_process';
import { cpSync, existsSync, mkdirSync, mkdtempSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { PGlite } from '@electric-sql/pglite';
import {
  BackupError,
  describePart,
  isNewerLevel,
  migrationLevel,
  openArchive,
  packFolder,
  PART_FILES,
  tar,
  writeArchive,
  type BackupManifest,
  type BackupMode,
  type BackupPart,
} from './backup-archive';
import type { S3Options } from '../integrations/storage/s3-storage';
import { checkBucket, downloadBucket, uploadFolder } from './backup-objects';
import { connect, findPgTool, otherSessions, pgDump, pgRestore, serverVersion } from './backup-postgres';
import { dataDirLayout, lockDataDir, type DataDirLayout } from './data-dir';

export { BackupError, type BackupManifest } from './backup-archive';

export type BackupResult = { file: string; manifest: BackupManifest };
/** Asked after the archive passed every check and before anything is changed; false stops the restore. */
export type ConfirmRestore = (manifest: BackupManifest) => boolean | Promise<boolean>;
/**
 * Where the uploads live when not in DATA_DIR/uploads: the S3-compatible bucket (S3_BUCKET). A backup copies its
 * objects into the uploads part; a restore puts that part's files back into it.
 */
export type UploadsTarget = { objects?: S3Options | null };
export type RestoreOptions = UploadsTarget & { confirm?: ConfirmRestore };

type Query = <T>(sql: string) => Promise<T[]>;

async function tableExists(query: Query, name: string): Promise<boolean> {
  const [row] = await query<{ present: boolean }>(`select to_regclass('${name}') is not null as present`);
  return row?.present === true;
}

async function readMigrationLevel(query: Query): Promise<BackupManifest['migrations']> {
  if (!(await tableExists(query, 'drizzle.__drizzle_migrations'))) return migrationLevel([]);
  const rows = await query<{ created_at: string | number }>('select created_at from drizzle.__drizzle_migrations');
  return migrationLevel(rows.map((r) => r.created_at));
}

/** Storage keys the database refers to (evidence files and signed lien waivers). */
async function referencedUploads(query: Query): Promise<string[]> {
  const keys: string[] = [];
  for (const table of ['public.tally_evidence', 'public.lien_waivers']) {
    if (await tableExists(query, table))
      keys.push(...(await query<{ k: string }>(`select storage_key as k from ${table}`)).map((r) => r.k));
  }
  return keys.sort();
}

/**
 * Packs the uploads (DATA_DIR/uploads, or a copy of the bucket's objects taken into the staging folder) and answers
 * the referenced keys that are not in the pack (deleted meanwhile, or lost).
 */
async function packUploads(
  layout: DataDirLayout,
  stage: string,
  mode: BackupMode,
  referenced: string[],
  objects: S3Options | null | undefined,
): Promise<string[]> {
  const file = path.join(stage, PART_FILES[mode].uploads);
  let source = layout.uploads;
  if (objects) {
    source = path.join(stage, 'objects');
    mkdirSync(source);
    await downloadBucket(objects, source);
  }
  packFolder(source, file);
  const listing = spawnSync('tar', ['-tf', file], { encoding: 'utf8', maxBuffer: 256 * 1024 * 1024 });
  const packed = new Set(listing.stdout.split('\n').map((n) => n.replace(/^\.\//, '')));
  return referenced.filter((k) => !packed.has(k));
}

async function finish(
  layout: DataDirLayout,
  stage: string,
  outDir: string,
  base: Omit<BackupManifest, 'parts' | 'format' | 'version' | 'createdAt'>,
) {
  const parts: BackupPart[] = [
    await describePart(stage, base.mode, 'database'),
    await describePart(stage, base.mode, 'uploads'),
  ];
  const secret = path.join(layout.root, 'auth-secret');
  if (existsSync(secret)) {
    cpSync(secret, path.join(stage, PART_FILES[base.mode]['auth-secret']));
    parts.push(await describePart(stage, base.mode, 'auth-secret'));
  }
  const manifest: BackupManifest = {
    format: 'tallyard-backup',
    version: 2,
    createdAt: new Date().toISOString(),
    ...base,
    parts,
  };
  return { file: writeArchive(stage, manifest, outDir), manifest };
}

function stageIn(outDir: string): string {
  mkdirSync(outDir, { recursive: true });
  return mkdtempSync(path.join(path.resolve(outDir), '.tallyard-backup-'));
}

/**
 * The embedded database (PGlite's own data folder dump, taken under the data folder lock, so no server is
 * writing), the uploads and the auth secret in one .tar.gz with a manifest. The file holds password hashes and
 * the secret: keep it as private as the data folder.
 */
export async function backupDataDir(
  dataDir: string,
  outDir: string,
  { objects }: UploadsTarget = {},
): Promise<BackupResult> {
  const layout = dataDirLayout(dataDir);
  if (!existsSync(layout.db)) throw new BackupError(`There is no database in ${layout.db} to back up.`);
  const unlock = await lockDataDir(layout);
  const stage = stageIn(outDir);
  try {
    const pg = await PGlite.create(layout.db);
    const query: Query = async <T>(sql: string) => (await pg.query<T>(sql)).rows;
    const migrations = await readMigrationLevel(query);
    const referenced = await referencedUploads(query);
    const dump = await pg.dumpDataDir('gzip');
    await pg.close();
    writeFileSync(path.join(stage, PART_FILES.embedded.database), Buffer.from(await dump.arrayBuffer()));
    const missingUploads = await packUploads(layout, stage, 'embedded', referenced, objects);
    return await finish(layout, stage, outDir, { mode: 'embedded', migrations, missingUploads });
  } finally {
    rmSync(stage, { recursive: true, force: true });
    await unlock();
  }
}

/**
 * A PostgreSQL server's database with Debian's pg_dump (custom format, no owners) plus DATA_DIR's uploads and
 * auth secret. The app may keep running: pg_dump reads one snapshot, exported from a transaction that also reads
 * the migration level and the referenced files, so all three describe the same moment; the uploads are copied
 * after it (files added since are harmless extras, and one deleted since is listed in `missingUploads`).
 */
export async function backupPostgres(
  databaseUrl: string,
  dataDir: string,
  outDir: string,
  { objects }: UploadsTarget = {},
): Promise<BackupResult> {
  const layout = dataDirLayout(dataDir);
  const client = await connect(databaseUrl);
  const stage = stageIn(outDir);
  try {
    const server = await serverVersion(client);
    const tool = findPgTool('pg_dump', { major: server.major, of: `the PostgreSQL ${server.version} server` });
    await client.query('begin isolation level repeatable read read only');
    const snapshot = (await client.query<{ id: string }>('select pg_export_snapshot() as id')).rows[0]!.id;
    const query: Query = async <T>(sql: string) => (await client.query(sql)).rows as T[];
    const migrations = await readMigrationLevel(query);
    const referenced = await referencedUploads(query);
    pgDump(tool, databaseUrl, path.join(stage, PART_FILES.postgres.database), snapshot);
    await client.query('commit');
    const missingUploads = await packUploads(layout, stage, 'postgres', referenced, objects);
    return await finish(layout, stage, outDir, {
      mode: 'postgres',
      migrations,
      missingUploads,
      postgres: { serverVersion: server.version, pgDumpVersion: tool.version },
    });
  } finally {
    rmSync(stage, { recursive: true, force: true });
    await client.end();
  }
}

/** Unpacks the uploads part into a new folder beside the data, ready to be renamed into place. */
function unpackUploads(stage: string, mode: BackupMode): string {
  const folder = path.join(stage, 'uploads-restored');
  mkdirSync(folder);
  tar(['-xf', path.join(stage, PART_FILES[mode].uploads), '-C', folder, '--no-same-owner'], 'Unpacking the uploads');
  return folder;
}

/**
 * Puts the prepared replacements into the data folder by renaming: what was there first goes to
 * `before-restore-<time>/`. Returns that folder, or null when there was nothing.
 */
function swapIn(
  layout: DataDirLayout,
  candidates: { name: 'db' | 'uploads' | 'auth-secret'; from: string | null }[],
): string | null {
  const replacements = candidates.filter(
    (r): r is { name: 'db' | 'uploads' | 'auth-secret'; from: string } => r.from !== null,
  );
  let aside: string | null = null;
  for (const { name } of replacements) {
    const current = path.join(layout.root, name);
    if (!existsSync(current)) continue;
    aside ??= path.join(layout.root, `before-restore-${new Date().toISOString().replace(/[:.]/g, '-')}`);
    mkdirSync(aside, { recursive: true });
    renameSync(current, path.join(aside, name));
  }
  for (const { name, from } of replacements) renameSync(from, path.join(layout.root, name));
  return aside;
}

/**
 * The uploads part unpacked: into the bucket when there is one (answers null: nothing to move into DATA_DIR), otherwise
 * a folder ready to be renamed into place.
 */
async function restoreUploads(stage: string, mode: BackupMode, objects: S3Options | null | undefined) {
  const folder = unpackUploads(stage, mode);
  if (!objects) return folder;
  await uploadFolder(objects, folder);
  return null;
}

async function confirmed(manifest: BackupManifest, options: RestoreOptions) {
  if (options.confirm && !(await options.confirm(manifest)))
    throw new BackupError('Restore not confirmed: nothing was changed.');
}

/**
 * Brings an embedded-mode backup back into the data folder. Refuses while a server holds the folder (the lock)
 * and refuses an archive that fails any check (see openArchive). The new database and uploads are prepared
 * first; only then is what was there moved aside into `before-restore-<time>/`, never deleted.
 */
export async function restoreDataDir(
  dataDir: string,
  file: string,
  options: RestoreOptions = {},
): Promise<string | null> {
  const layout = dataDirLayout(dataDir);
  const unlock = await lockDataDir(layout);
  const stage = mkdtempSync(path.join(layout.root, '.restore-'));
  try {
    const manifest = await openArchive(file, stage, 'embedded');
    if (options.objects) await checkBucket(options.objects);
    await confirmed(manifest, options);
    const db = path.join(stage, 'db-restored');
    const dump = readFileSync(path.join(stage, PART_FILES.embedded.database));
    const pg = await PGlite.create(db, { loadDataDir: new Blob([dump]) });
    await pg.query('select 1');
    await pg.close();
    const uploads = await restoreUploads(stage, 'embedded', options.objects);
    const secret = manifest.parts.some((p) => p.name === 'auth-secret')
      ? path.join(stage, PART_FILES.embedded['auth-secret'])
      : null;
    return swapIn(layout, [
      { name: 'db', from: db },
      { name: 'uploads', from: uploads },
      { name: 'auth-secret', from: secret },
    ]);
  } finally {
    rmSync(stage, { recursive: true, force: true });
    await unlock();
  }
}

/**
 * Brings a PostgreSQL-mode backup back: pg_restore --clean --if-exists --single-transaction into DATABASE_URL
 * (all of the dump, or nothing), then the uploads and auth secret into DATA_DIR (the old ones moved aside).
 * Refuses while other sessions are connected to the database (stop the app first), when the database is at a
 * newer migration than the backup (its extra tables would survive --clean: restore into an empty database), and
 * when pg_restore is older than the pg_dump that wrote the archive.
 */
export async function restorePostgres(
  databaseUrl: string,
  dataDir: string,
  file: string,
  options: RestoreOptions = {},
): Promise<string | null> {
  const layout = dataDirLayout(dataDir);
  const unlock = await lockDataDir(layout);
  const stage = mkdtempSync(path.join(layout.root, '.restore-'));
  let client: Awaited<ReturnType<typeof connect>> | null = null;
  const disconnect = async () => {
    await client?.end().catch(() => undefined);
    client = null;
  };
  try {
    const manifest = await openArchive(file, stage, 'postgres');
    if (!manifest.postgres) throw new BackupError(`The manifest of ${file} does not say which pg_dump wrote it.`);
    const dumpMajor = Number(manifest.postgres.pgDumpVersion.split('.')[0]);
    const tool = findPgTool('pg_restore', {
      major: dumpMajor,
      of: `the pg_dump ${manifest.postgres.pgDumpVersion} that wrote the backup`,
    });
    const db = await connect(databaseUrl);
    client = db;
    const others = await otherSessions(db);
    if (others > 0) {
      throw new BackupError(
        `${others} other session${others === 1 ? ' is' : 's are'} connected to this database (a running Tallyard?). Stop the app, then restore.`,
      );
    }
    const current = await readMigrationLevel(async <T>(sql: string) => (await db.query(sql)).rows as T[]);
    if (isNewerLevel(current.latest, manifest.migrations.latest)) {
      throw new BackupError(
        `The database is at migration ${current.latest}, newer than the backup's ${manifest.migrations.latest ?? '(none)'}; restoring over it would leave the newer tables behind. Restore into an empty database (createdb), then point DATABASE_URL at it.`,
      );
    }
    if (options.objects) await checkBucket(options.objects);
    await confirmed(manifest, options);
    // Files first: the restored database then never names an object that is not there yet.
    const uploads = await restoreUploads(stage, 'postgres', options.objects);
    await disconnect();
    pgRestore(tool, databaseUrl, path.join(stage, PART_FILES.postgres.database));
    const secret = manifest.parts.some((p) => p.name === 'auth-secret')
      ? path.join(stage, PART_FILES.postgres['auth-secret'])
      : null;
    return swapIn(layout, [
      { name: 'uploads', from: uploads },
      { name: 'auth-secret', from: secret },
    ]);
  } finally {
    await disconnect();
    rmSync(stage, { recursive: true, force: true });
    await unlock();
  }
}
