// `npm run seed:demo`: seeds the demo project into DATA_DIR or DATABASE_URL, even on a PostgreSQL server.
import { createAuth } from '../auth';
import { loadEnv } from '../env';
import { authSecret, dataDirLayout, lockDataDir } from '../lib/data-dir';
import { localStorage } from '../integrations/storage/storage';
import { appOrigins } from '../lib/origins';
import { openDatabase } from './client';
import { runMigrations } from './migrate';
import { seedDemo } from './seed-demo';

const env = loadEnv();
const layout = dataDirLayout(env.DATA_DIR);
const unlock = env.DATABASE_URL ? async () => {} : await lockDataDir(layout);
const database = await openDatabase(
  env.DATABASE_URL ? { kind: 'postgres', url: env.DATABASE_URL } : { kind: 'pglite', dataDir: layout.db },
);
await runMigrations(database);
const { baseURL, trustedOrigins } = appOrigins(env.PORT, env.APP_URL);
const auth = createAuth({
  db: database.db,
  secret: authSecret(layout, env.BETTER_AUTH_SECRET),
  baseURL,
  trustedOrigins,
  secureCookies: false,
});
console.log(
  (await seedDemo(database.db, auth, localStorage(layout.uploads)))
    ? 'Seeded the demo project.'
    : 'The demo project is already there.',
);
await database.close();
await unlock();
