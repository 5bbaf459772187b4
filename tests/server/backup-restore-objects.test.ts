import { spawn, spawnSync } from 'node:child_process';
import { createHash, randomBytes } from 'node:crypto';
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import {
  CreateBucketCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  ListObjectsV2Command,
  PutObjectCommand,
  S3Client,
} from '@aws-sdk/client-s3';
import { eq } from 'drizzle-orm';
import S3rver from 's3rver';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openDatabase } from '../../server/db/client';
import { runMigrations } from '../../server/db/migrate';
import { companies } from '../../server/db/schema';
import { s3Storage } from '../../server/integrations/storage/s3-storage';
import { dataDirLayout } from '../../server/lib/data-dir';

// Backups include the object store (issue 16): with S3_BUCKET set, `npm run backup` copies the bucket's objects into
// the archive's uploads part and `npm run restore` puts them back, against s3rver (an S3-compatible stand-in from npm).
// Embedded database here; the PostgreSQL mode shares the same two steps (server/lib/backup.ts).
const root = mkdtempSync(path.join(tmpdir(), 'tallyard-backup-objects-'));
const dataDir = path.join(root, 'data');
const outDir = path.join(root, 'backups');
const layout = dataDirLayout(dataDir);
const BUCKET = 'tallyard-backup';
const credentials = { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' };
let s3: S3rver;
let endpoint: string;
let client: S3Client;

beforeAll(async () => {
  s3 = new S3rver({ port: 0, address: '127.0.0.1', silent: true, directory: path.join(root, 's3') });
  const { port } = await s3.run();
  endpoint = `http://127.0.0.1:${port}`;
  client = new S3Client({ endpoint, region: 'us-east-1', forcePathStyle: true, credentials });
  await client.send(new CreateBucketCommand({ Bucket: BUCKET }));
});
afterAll(async () => {
  client?.destroy();
  await s3?.close();
  rmSync(root, { recursive: true, force: true });
});

const sha = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');

/** The CLI in a child process, awaited (not spawnSync: s3rver answers from this process's event loop). */
const cli = (script: string, args: string[], bucket = BUCKET) =>
  new Promise<{ status: number | null; stdout: string; stderr: string }>((resolve) => {
    const child = spawn(process.execPath, ['--import', 'tsx', script, ...args], {
      env: {
        ...process.env,
        DATA_DIR: dataDir,
        DATABASE_URL: '',
        S3_BUCKET: bucket,
        S3_ENDPOINT: endpoint,
        AWS_ACCESS_KEY_ID: credentials.accessKeyId,
        AWS_SECRET_ACCESS_KEY: credentials.secretAccessKey,
        LOG_LEVEL: 'silent',
      },
    });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (d) => (stdout += String(d)));
    child.stderr.on('data', (d) => (stderr += String(d)));
    child.on('close', (status) => resolve({ status, stdout, stderr }));
  });

/** SHA-256 of every object in the bucket, by key. */
async function bucketHashes(): Promise<Record<string, string>> {
  const out: Record<string, string> = {};
  const page = await client.send(new ListObjectsV2Command({ Bucket: BUCKET }));
  for (const { Key } of page.Contents ?? []) {
    const body = await client.send(new GetObjectCommand({ Bucket: BUCKET, Key }));
    out[Key!] = sha(Buffer.from(await body.Body!.transformToByteArray()));
  }
  return out;
}

async function companyNames(): Promise<string[]> {
  const database = await openDatabase({ kind: 'pglite', dataDir: layout.db });
  const rows = await database.db.select({ name: companies.name }).from(companies);
  await database.close();
  return rows.map((r) => r.name).sort();
}

describe('npm run backup and restore with uploads in an S3-compatible bucket', () => {
  let stored: Record<string, string>;
  let archive: string;

  it('copies every object of the bucket into the uploads part, byte for byte, and not the local folder', async () => {
    const database = await openDatabase({ kind: 'pglite', dataDir: layout.db });
    await runMigrations(database);
    await database.db.insert(companies).values({ kind: 'owner', name: 'Backed Up Owner' });
    await database.close();
    // Files as the app stores them (random keys under a folder), one of them larger than one read of the stream.
    const storage = await s3Storage({
      bucket: BUCKET,
      endpoint,
      region: 'us-east-1',
      forcePathStyle: true,
      credentials,
    });
    await storage.put(Buffer.from('load,tons\n1,18.5\n'), 'evidence');
    await storage.put(randomBytes(3 * 1024 * 1024 + 17), 'evidence');
    await storage.put(Buffer.from('%PDF-1.4 signed waiver'), 'lien-waivers');
    stored = await bucketHashes();
    expect(Object.keys(stored)).toHaveLength(3);
    mkdirSync(path.join(layout.uploads, 'stale'), { recursive: true });
    writeFileSync(path.join(layout.uploads, 'stale', 'left-from-before-s3'), 'not in the bucket');

    const backup = await cli('scripts/backup.ts', ['--out', outDir]);
    expect(backup.status, backup.stderr).toBe(0);
    archive = path.join(
      outDir,
      readdirSync(outDir).find((n) => n.endsWith('.tar.gz'))!,
    );
    const look = path.join(root, 'look');
    mkdirSync(look);
    spawnSync('tar', ['-xzf', archive, '-C', look]);
    const files = path.join(root, 'look-uploads');
    mkdirSync(files);
    spawnSync('tar', ['-xf', path.join(look, 'uploads.tar'), '-C', files]);
    const packed: Record<string, string> = {};
    for (const name of readdirSync(files, { recursive: true, encoding: 'utf8' })) {
      const full = path.join(files, name);
      if (statSync(full).isFile()) packed[name] = sha(readFileSync(full));
    }
    expect(packed).toEqual(stored);
  }, 120_000);

  it('puts the objects back into the bucket (before the database), leaving the local folder alone', async () => {
    const [lost, ...kept] = Object.keys(stored);
    await client.send(new DeleteObjectCommand({ Bucket: BUCKET, Key: lost }));
    await client.send(new PutObjectCommand({ Bucket: BUCKET, Key: 'evidence/stray', Body: 'added after the backup' }));
    const later = await openDatabase({ kind: 'pglite', dataDir: layout.db });
    await later.db.delete(companies).where(eq(companies.name, 'Backed Up Owner'));
    await later.close();

    const restore = await cli('scripts/restore.ts', [archive, '--yes']);
    expect(restore.status, restore.stderr).toBe(0);
    expect(restore.stdout).toContain(`the files in bucket ${BUCKET}`);
    const now = await bucketHashes();
    for (const key of [lost!, ...kept]) expect(now[key], key).toBe(stored[key]);
    // Keys are random and never reused: an object the restored database does not name is left in place.
    expect(Object.keys(now).sort()).toEqual([...Object.keys(stored), 'evidence/stray'].sort());
    expect(await companyNames()).toEqual(['Backed Up Owner']);
    expect(readFileSync(path.join(layout.uploads, 'stale', 'left-from-before-s3'), 'utf8')).toBe('not in the bucket');
  }, 120_000);

  it('refuses a bucket it cannot reach before changing anything', async () => {
    const db = await openDatabase({ kind: 'pglite', dataDir: layout.db });
    await db.db.insert(companies).values({ kind: 'owner', name: 'Added After The Restore' });
    await db.close();
    const restore = await cli('scripts/restore.ts', [archive, '--yes'], 'no-such-bucket');
    expect(restore.status).toBe(1);
    expect(restore.stderr).toMatch(/Reaching bucket no-such-bucket at http:\/\/127\.0\.0\.1:\d+ failed/);
    expect(await companyNames()).toEqual(['Added After The Restore', 'Backed Up Owner']);
    expect(readdirSync(dataDir).filter((n) => n.startsWith('before-restore-'))).toHaveLength(1);
  }, 120_000);
});
