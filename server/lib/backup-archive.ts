import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import {
  createReadStream,
  existsSync,
  lstatSync,
  mkdirSync,
  readdirSync,
  readFileSync,
  statSync,
  writeFileSync,
} from 'node:fs';
import path from 'node:path';
import { z } from 'zod';
import { MIGRATIONS_FOLDER } from '../db/migrate';

export const BACKUP_FORMAT = 'tallyard-backup';
export const BACKUP_FORMAT_VERSION = 2;
export const MANIFEST_FILE = 'manifest.json';

/** The parts of a backup and their file names inside the archive. */
export const PART_FILES = {
  embedded: { database: 'database.pglite.tar.gz', uploads: 'uploads.tar', 'auth-secret': 'auth-secret' },
  postgres: { database: 'database.pgdump', uploads: 'uploads.tar', 'auth-secret': 'auth-secret' },
} as const;
export type BackupMode = keyof typeof PART_FILES;
export type PartName = keyof (typeof PART_FILES)['embedded'];

const partSchema = z.strictObject({
  name: z.enum(['database', 'uploads', 'auth-secret']),
  file: z.string().regex(/^[a-z0-9.-]+$/),
  bytes: z.number().int().min(0),
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
});

const manifestSchema = z.strictObject({
  format: z.literal(BACKUP_FORMAT),
  version: z.literal(BACKUP_FORMAT_VERSION),
  mode: z.enum(['embedded', 'postgres']),
  createdAt: z.iso.datetime(),
  /** The app's migration level of the database when it was backed up (drizzle's journal tags). */
  migrations: z.strictObject({ applied: z.number().int().min(0), latest: z.string().nullable() }),
  parts: z.array(partSchema).min(2),
  /** PostgreSQL mode: the server's and pg_dump's versions ("16.4"). */
  postgres: z.strictObject({ serverVersion: z.string(), pgDumpVersion: z.string() }).optional(),
  /** Files the database refers to that were not in the uploads folder when it was copied. */
  missingUploads: z.array(z.string()),
});
export type BackupManifest = z.infer<typeof manifestSchema>;
export type BackupPart = z.infer<typeof partSchema>;

export class BackupError extends Error {}

export function sha256File(file: string): Promise<string> {
  return new Promise((resolve, reject) => {
    const hash = createHash('sha256');
    createReadStream(file)
      .on('data', (chunk) => hash.update(chunk))
      .on('error', reject)
      .on('end', () => resolve(hash.digest('hex')));
  });
}

/** Runs tar; `okStatuses` lets a copy of a folder that changed while read (GNU tar's status 1) through. */
export function tar(args: string[], what: string, okStatuses = [0]): void {
  const run = spawnSync('tar', args, { encoding: 'utf8' });
  if (run.error) throw new BackupError(`tar could not run (${run.error.message}); install Debian's tar package.`);
  if (!okStatuses.includes(run.status ?? -1))
    throw new BackupError(`${what}: tar failed: ${run.stderr.trim() || `status ${run.status}`}`);
}

/** A part's entry for the manifest: size and SHA-256 of the file in the staging folder. */
export async function describePart(stage: string, mode: BackupMode, name: PartName): Promise<BackupPart> {
  const file = PART_FILES[mode][name];
  const full = path.join(stage, file);
  return { name, file, bytes: statSync(full).size, sha256: await sha256File(full) };
}

/** Packs one folder (which may be missing or empty) into a plain tar file. */
export function packFolder(folder: string, into: string): void {
  if (!existsSync(folder)) mkdirSync(folder, { recursive: true });
  tar(['-cf', into, '-C', folder, '.'], `Copying ${folder}`, [0, 1]);
}

export function writeArchive(stage: string, manifest: BackupManifest, outDir: string): string {
  writeFileSync(path.join(stage, MANIFEST_FILE), `${JSON.stringify(manifest, null, 2)}\n`);
  mkdirSync(outDir, { recursive: true });
  const file = path.resolve(outDir, `tallyard-${manifest.mode}-${manifest.createdAt.replace(/[:.]/g, '-')}.tar.gz`);
  tar(['-czf', file, '-C', stage, MANIFEST_FILE, ...manifest.parts.map((p) => p.file)], 'Writing the backup');
  return file;
}

const notOurs = (file: string, why: string) => new BackupError(`${file} is not a Tallyard backup (${why}).`);

/**
 * Unpacks an archive into `stage` and checks it before anything is changed: the manifest's format, version and
 * shape, the mode it was made in, each listed part present with its size and SHA-256, nothing else inside, and
 * a migration level this version of the app knows. Each refusal names the part or field at fault.
 */
export async function openArchive(file: string, stage: string, mode: BackupMode): Promise<BackupManifest> {
  if (!existsSync(file)) throw new BackupError(`No backup file at ${file}.`);
  tar(['-xzf', path.resolve(file), '-C', stage, '--no-same-owner'], `Reading ${file}`);
  const manifestFile = path.join(stage, MANIFEST_FILE);
  if (!existsSync(manifestFile)) throw notOurs(file, `it has no ${MANIFEST_FILE}`);
  let raw: unknown;
  try {
    raw = JSON.parse(readFileSync(manifestFile, 'utf8'));
  } catch {
    throw notOurs(file, `${MANIFEST_FILE} is not JSON`);
  }
  const head = raw as { format?: unknown; version?: unknown };
  if (head?.format !== BACKUP_FORMAT) throw notOurs(file, `${MANIFEST_FILE} does not say format "${BACKUP_FORMAT}"`);
  if (head.version !== BACKUP_FORMAT_VERSION) {
    throw new BackupError(
      `${file} is backup format version ${String(head.version)}; this Tallyard reads version ${BACKUP_FORMAT_VERSION}.`,
    );
  }
  const parsed = manifestSchema.safeParse(raw);
  if (!parsed.success) {
    const issues = parsed.error.issues.map((i) => `${i.path.join('.') || '(top)'}: ${i.message}`).join('; ');
    throw new BackupError(`The manifest of ${file} does not match the backup format: ${issues}.`);
  }
  const manifest = parsed.data;
  if (manifest.mode !== mode) {
    throw new BackupError(
      mode === 'postgres'
        ? `${file} is a backup of the embedded database, but DATABASE_URL is set: unset it to restore into DATA_DIR.`
        : `${file} is a backup of a PostgreSQL server: set DATABASE_URL to the server to restore it into.`,
    );
  }
  await checkParts(file, stage, manifest);
  checkMigrationLevel(file, manifest);
  return manifest;
}

async function checkParts(file: string, stage: string, manifest: BackupManifest) {
  const expected = PART_FILES[manifest.mode];
  for (const name of ['database', 'uploads'] as const) {
    if (!manifest.parts.some((p) => p.name === name))
      throw new BackupError(`The manifest of ${file} lists no ${name} part.`);
  }
  const listed = new Set([MANIFEST_FILE]);
  for (const part of manifest.parts) {
    if (part.file !== expected[part.name])
      throw new BackupError(`The ${part.name} part of ${file} should be ${expected[part.name]}, not ${part.file}.`);
    if (listed.has(part.file)) throw new BackupError(`The manifest of ${file} lists the ${part.name} part twice.`);
    listed.add(part.file);
    const full = path.join(stage, part.file);
    if (!existsSync(full)) throw new BackupError(`The ${part.name} part (${part.file}) is missing from ${file}.`);
    if (!lstatSync(full).isFile())
      throw new BackupError(`The ${part.name} part (${part.file}) of ${file} is not a plain file.`);
    const bytes = statSync(full).size;
    const sha256 = await sha256File(full);
    if (bytes !== part.bytes || sha256 !== part.sha256) {
      throw new BackupError(
        `The ${part.name} part (${part.file}) of ${file} fails its checksum (SHA-256 ${sha256.slice(0, 12)}..., ${bytes} bytes; the manifest says ${part.sha256.slice(0, 12)}..., ${part.bytes} bytes): the archive is damaged or was changed.`,
      );
    }
  }
  const extra = readdirSync(stage).filter((n) => !listed.has(n));
  if (extra.length > 0) throw new BackupError(`${file} holds files its manifest does not list: ${extra.join(', ')}.`);
}

type JournalEntry = { idx: number; when: number; tag: string };

/** The migrations this version of the app ships (drizzle-kit's journal), oldest first. */
export function shippedMigrations(): JournalEntry[] {
  const journal = JSON.parse(readFileSync(path.join(MIGRATIONS_FOLDER, 'meta', '_journal.json'), 'utf8')) as {
    entries: JournalEntry[];
  };
  return journal.entries;
}

/**
 * The migration level from drizzle's `__drizzle_migrations` rows (their `created_at` is the journal entry's
 * `when`). An entry this app does not ship comes back as `unknown-<when>`.
 */
export function migrationLevel(createdAts: (string | number)[]): BackupManifest['migrations'] {
  if (createdAts.length === 0) return { applied: 0, latest: null };
  const last = Math.max(...createdAts.map(Number));
  const known = shippedMigrations().find((m) => m.when === last);
  return { applied: createdAts.length, latest: known?.tag ?? `unknown-${last}` };
}

function checkMigrationLevel(file: string, manifest: BackupManifest) {
  const { latest } = manifest.migrations;
  const shipped = shippedMigrations();
  if (latest !== null && !shipped.some((m) => m.tag === latest)) {
    throw new BackupError(
      `${file} was made at migration ${latest}, which this version of Tallyard does not have (its latest is ${shipped.at(-1)?.tag}). Update Tallyard, then restore.`,
    );
  }
}

/** Whether level `a` is newer than level `b` (by position in the shipped journal; unknown counts as newest). */
export function isNewerLevel(a: string | null, b: string | null): boolean {
  const rank = (tag: string | null) =>
    tag === null ? -1 : (shippedMigrations().find((m) => m.tag === tag)?.idx ?? Number.MAX_SAFE_INTEGER);
  return rank(a) > rank(b);
}
