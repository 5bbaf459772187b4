import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../server/db/demo/demo-data';
import { sampleBidItem } from '../setup/factories';
import { freePort, signInCookie, startServerProcess } from '../setup/server-process';

const dataDir = mkdtempSync(path.join(tmpdir(), 'tallyard-crash-'));
afterAll(() => rmSync(dataDir, { recursive: true, force: true }));

const WORKERS = 6;
const KILL_AFTER_ACKS = 30;

async function projectId(url: string, cookie: string): Promise<string> {
  const res = await fetch(`${url}/api/projects`, { headers: { cookie } });
  const body = (await res.json()) as { projects: { id: string }[] };
  return body.projects[0]!.id;
}

// PostgreSQL docs, "Reliability and the Write-Ahead Log" (30.1): a commit reported to the client survives a crash
// of the server process. A kill -9 is such a crash; a power loss is not tested (PGlite does not fsync).
describe('crash recovery on the embedded database', () => {
  it('keeps every acknowledged write after kill -9 mid-stream, and opens cleanly on restart', async () => {
    const port = await freePort();
    const first = await startServerProcess(dataDir, port, { SEED_DEMO: 'auto' });
    const cookie = await signInCookie(first.url, 'gc@tallyard.test', DEMO_PASSWORD);
    const project = await projectId(first.url, cookie);

    const acknowledged: string[] = [];
    let n = 0;
    let killed = false;
    const worker = async () => {
      while (!killed) {
        const item = sampleBidItem({ itemNumber: `K-${++n}` });
        try {
          const res = await fetch(`${first.url}/api/projects/${project}/bid-items`, {
            method: 'POST',
            headers: { 'content-type': 'application/json', cookie, origin: first.url },
            body: JSON.stringify(item),
          });
          if (res.status === 201) acknowledged.push(item.itemNumber);
          else expect(res.status).toBe(201);
        } catch {
          return; // the connection died with the server: this write was never acknowledged
        }
        if (acknowledged.length >= KILL_AFTER_ACKS && !killed) {
          killed = true;
          first.child.kill('SIGKILL');
        }
      }
    };
    await Promise.all(Array.from({ length: WORKERS }, worker));
    expect(await first.exited).toBeNull(); // ended by the signal, not by itself
    expect(acknowledged.length).toBeGreaterThanOrEqual(KILL_AFTER_ACKS);

    // The killed server's lock goes stale after about 4 s; the new one waits for it.
    const second = await startServerProcess(dataDir, port, { SEED_DEMO: 'auto' });
    try {
      const health = await fetch(`${second.url}/api/health`);
      expect(await health.json()).toEqual({ status: 'ok', database: 'pglite' });
      const cookie2 = await signInCookie(second.url, 'gc@tallyard.test', DEMO_PASSWORD);
      const res = await fetch(`${second.url}/api/projects/${project}/bid-items`, { headers: { cookie: cookie2 } });
      expect(res.status).toBe(200);
      const body = (await res.json()) as { bidItems: { itemNumber: string }[] };
      const present = new Set(body.bidItems.map((b) => b.itemNumber));
      expect(acknowledged.filter((i) => !present.has(i))).toEqual([]);
    } finally {
      second.child.kill('SIGTERM');
      await second.exited;
    }
  }, 90_000);
});
