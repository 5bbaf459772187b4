import path from 'node:path';
import { buildClientIfStale } from '../../scripts/build-client';
import { buildServerIfStale, SERVER_BUNDLE } from '../../scripts/build-server';
import { startServerProcess } from '../../tests/setup/server-process';

export const DIST = path.resolve('dist');

/** Builds what the benchmarks of the built app need (client and server) when missing or stale; untimed. */
export async function ensureBuilt(): Promise<void> {
  await buildClientIfStale();
  await buildServerIfStale();
}

/** The built app as `npm start` runs the demo (`node dist-server/index.js`, production, embedded), on this data folder. */
export function startBuiltServer(dataDir: string, port: number) {
  return startServerProcess(dataDir, port, { NODE_ENV: 'production', TALLYARD_DEMO: 'on' }, [SERVER_BUNDLE]);
}
