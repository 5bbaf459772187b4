/**
 * `npm run backup [-- --out DIR]`: one .tar.gz in DIR (default ./backups) with the database, the uploads, the auth
 * secret and a manifest. Embedded mode: the PGlite folder, while no server holds it. With DATABASE_URL: pg_dump of
 * the server (the app may keep running) plus the uploads: DATA_DIR's, or with S3_BUCKET a copy of the bucket's objects.
 */
import { loadEnv } from '../server/env';
import { s3OptionsFromEnv } from '../server/integrations/storage/s3-storage';
import { backupDataDir, backupPostgres } from '../server/lib/backup';

const env = loadEnv();
const outFlag = process.argv.indexOf('--out');
const outDir = outFlag > 0 ? process.argv[outFlag + 1] : 'backups';
if (!outDir) {
  console.error('Usage: npm run backup [-- --out DIR]');
  process.exit(1);
}
const objects = s3OptionsFromEnv(env);
const uploadsAt = objects ? `bucket ${objects.bucket}` : `${env.DATA_DIR}/uploads`;
const run = env.DATABASE_URL
  ? backupPostgres(env.DATABASE_URL, env.DATA_DIR, outDir, { objects })
  : backupDataDir(env.DATA_DIR, outDir, { objects });
run
  .then(({ file, manifest }) => {
    console.log(`Backup written: ${file}`);
    console.log(
      `  ${manifest.mode} database at migration ${manifest.migrations.latest ?? '(none)'}; ${manifest.parts.map((p) => `${p.name} ${p.bytes} bytes`).join(', ')}`,
    );
    if (manifest.missingUploads.length > 0) {
      console.warn(
        `Warning: ${manifest.missingUploads.length} file(s) the database refers to were not in ${uploadsAt} (deleted meanwhile, or lost):`,
      );
      for (const key of manifest.missingUploads) console.warn(`  ${key}`);
    }
  })
  .catch((err: unknown) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  });
