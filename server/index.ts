import { openDatabase } from './db/client';
import { assertDeployable, loadEnv } from './env';
import { dataDirLayout, lockDataDir } from './lib/data-dir';
import { createLogger } from './lib/logger';
import { installTestHooks } from './lib/test-hooks';

/**
 * env -> lock -> db -> migrate -> seed -> createApp -> listen. The database opens while the rest of the server's
 * modules load (server/boot.ts, imported here only then): on the embedded database the two take about as long
 * as each other, and the start-up is their overlap.
 */
async function main() {
  const env = loadEnv();
  assertDeployable(env);
  const logger = createLogger(env.LOG_LEVEL);
  const layout = dataDirLayout(env.DATA_DIR);
  const unlock = env.DATABASE_URL ? async () => {} : await lockDataDir(layout);
  installTestHooks(env);
  const opening = openDatabase(
    env.DATABASE_URL ? { kind: 'postgres', url: env.DATABASE_URL } : { kind: 'pglite', dataDir: layout.db },
  );
  opening.catch(() => {}); // awaited below, after the import; this only keeps a failure from counting as unhandled meanwhile
  const { boot } = await import('./boot');
  await boot({ env, logger, layout, database: await opening, unlock });
}

main().catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
