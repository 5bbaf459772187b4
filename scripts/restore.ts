/**
 * `npm run restore -- FILE --yes`: brings a backup back. Embedded mode: into DATA_DIR, refused while a server
 * holds the folder. With DATABASE_URL: pg_restore into that database, refused while other sessions are connected,
 * then the uploads into DATA_DIR (with S3_BUCKET: into the bucket, before the database). The archive is checked first (manifest, mode, checksums); without --yes it only
 * says what it would replace. What was in DATA_DIR is moved into DATA_DIR/before-restore-<time>/.
 */
import path from 'node:path';
import { loadEnv } from '../server/env';
import { s3OptionsFromEnv } from '../server/integrations/storage/s3-storage';
import { restoreDataDir, restorePostgres, type BackupManifest } from '../server/lib/backup';

const env = loadEnv();
const args = process.argv.slice(2);
const yes = args.includes('--yes');
const file = args.find((a) => !a.startsWith('--'));
if (!file) {
  console.error('Usage: npm run restore -- backups/tallyard-<mode>-<time>.tar.gz --yes');
  process.exit(1);
}

const objects = s3OptionsFromEnv(env);
const uploads = objects
  ? `the files in bucket ${objects.bucket} (objects of the same name are overwritten; others stay)`
  : `the uploads in ${path.resolve(env.DATA_DIR)}`;

function target(): string {
  if (!env.DATABASE_URL)
    return objects
      ? `the embedded database in ${path.resolve(env.DATA_DIR)} and ${uploads}`
      : `the embedded database and uploads in ${path.resolve(env.DATA_DIR)}`;
  const url = new URL(env.DATABASE_URL);
  return `database ${url.pathname.slice(1)} on ${url.hostname}:${url.port || 5432} and ${uploads}`;
}

const confirm = (m: BackupManifest) => {
  console.log(
    `${file}: ${m.mode} backup made ${m.createdAt}, migration ${m.migrations.latest ?? '(none)'}; every part's checksum matches.`,
  );
  if (yes) return true;
  console.error(`This replaces ${target()}. Run again with --yes to go ahead.`);
  return false;
};

const run = env.DATABASE_URL
  ? restorePostgres(env.DATABASE_URL, env.DATA_DIR, file, { confirm, objects })
  : restoreDataDir(env.DATA_DIR, file, { confirm, objects });
run
  .then((aside) => {
    console.log(`Restored ${file} into ${target()}.`);
    if (aside) console.log(`What was in the data folder before is kept in ${aside}.`);
  })
  .catch((err: unknown) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  });
