/** `npm run backup [-- --out DIR]`: the data folder's database and uploads into one .tar.gz (default ./backups). */
import { loadEnv } from '../server/env';
import { backupDataDir } from '../server/lib/backup';

const env = loadEnv();
const outFlag = process.argv.indexOf('--out');
const outDir = outFlag > 0 ? process.argv[outFlag + 1]! : 'backups';
if (env.DATABASE_URL) {
  console.error('DATABASE_URL is set: back up a PostgreSQL server with its own tools (pg_dump), and DATA_DIR/uploads.');
  process.exit(1);
}
backupDataDir(env.DATA_DIR, outDir)
  .then((file) => console.log(`Backup written: ${file}`))
  .catch((err: unknown) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  });
