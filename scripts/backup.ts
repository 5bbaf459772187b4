/**
 * `npm run backup [-- --out DIR]`: one .tar.gz in DIR (default ./backups) with the database, the uploads, the auth
 * secret and a manifest. Embedded mode: the PGlite folder, while no server holds it. With DATABASE_URL: pg_dump of
 * the server (the app may keep running) plus DATA_DIR's uploads.
 */
import { loadEnv } from '../server/env';
import { backupDataDir, backupPostgres } from '../server/lib/backup';

const env = loadEnv();
const outFlag = process.argv.indexOf('--out');
const outDir = outFlag > 0 ? process.argv[outFlag + 1] : 'backups';
if (!outDir) {
  console.error('Usage: npm run backup [-- --out DIR]');
  process.exit(1);
}
const run = env.DATABASE_URL
  ? backupPostgres(env.DATABASE_URL, env.DATA_DIR, outDir)
  : backupDataDir(env.DATA_DIR, outDir);
run
  .then(({ file, manifest }) => {
    console.log(`Backup written: ${file}`);
    console.log(
      `  ${manifest.mode} database at migration ${manifest.migrations.latest ?? '(none)'}; ${manifest.parts.map((p) => `${p.name} ${p.bytes} bytes`).join(', ')}`,
    );
    if (manifest.missingUploads.length > 0) {
      console.warn(
        `Warning: ${manifest.missingUploads.length} file(s) the database refers to were not in ${env.DATA_DIR}/uploads (deleted meanwhile, or lost):`,
      );
      for (const key of manifest.missingUploads) console.warn(`  ${key}`);
    }
  })
  .catch((err: unknown) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  });
