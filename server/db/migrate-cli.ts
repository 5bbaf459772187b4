// `npm run db:migrate`: applies the migrations in drizzle/ to DATA_DIR or DATABASE_URL without starting the app.
import { loadEnv } from '../env';
import { dataDirLayout, lockDataDir } from '../lib/data-dir';
import { openDatabase } from './client';
import { runMigrations } from './migrate';

const env = loadEnv();
const layout = dataDirLayout(env.DATA_DIR);
const unlock = env.DATABASE_URL ? async () => {} : await lockDataDir(layout);
const database = await openDatabase(
  env.DATABASE_URL ? { kind: 'postgres', url: env.DATABASE_URL } : { kind: 'pglite', dataDir: layout.db },
);
await runMigrations(database);
console.log(`Migrations applied (${database.kind}).`);
await database.close();
await unlock();
