/** `npm run restore -- FILE`: brings a backup back into DATA_DIR; refuses while a server holds the folder. */
import { loadEnv } from '../server/env';
import { restoreDataDir } from '../server/lib/backup';

const env = loadEnv();
const file = process.argv[2];
if (!file) {
  console.error('Usage: npm run restore -- backups/tallyard-<time>.tar.gz');
  process.exit(1);
}
restoreDataDir(env.DATA_DIR, file)
  .then((aside) => {
    console.log(`Restored ${file} into ${env.DATA_DIR}.`);
    if (aside) console.log(`What was there before is kept in ${aside}.`);
  })
  .catch((err: unknown) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  });
