import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { freePort, startServerProcess } from '../../tests/setup/server-process';
import { withinLimit, type MeasuredBench } from './measured';

const LIMIT_SECONDS = 2;

async function healthyAfterStart(dataDir: string): Promise<number> {
  const port = await freePort();
  const start = performance.now();
  const server = await startServerProcess(dataDir, port, { NODE_ENV: 'production' }).catch(async () => {
    throw new Error('the server did not start');
  });
  for (;;) {
    const res = await fetch(`${server.url}/api/health`).catch(() => null);
    if (res?.ok) break;
    await new Promise((r) => setTimeout(r, 20));
  }
  const seconds = (performance.now() - start) / 1000;
  server.child.kill('SIGTERM');
  await server.exited;
  return seconds;
}

/** Cold start of the app (`node --import tsx server/index.ts`, built client) on a migrated, seeded data folder. */
export const coldStart: MeasuredBench = {
  name: 'cold-start-to-health',
  async measure() {
    const dataDir = mkdtempSync(path.join(tmpdir(), 'tallyard-bench-cold-'));
    try {
      await healthyAfterStart(dataDir); // first start migrates and seeds: not timed
      let best = Infinity;
      for (let i = 0; i < 3; i++) best = Math.min(best, await healthyAfterStart(dataDir));
      return withinLimit(this.name, best, LIMIT_SECONDS, 'limit 2 s from spawn to a healthy /api/health');
    } finally {
      rmSync(dataDir, { recursive: true, force: true });
    }
  },
};
