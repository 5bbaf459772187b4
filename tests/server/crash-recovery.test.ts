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

/**
 * A new job of the demo's companies: the demo job's contract is locked (its first pay application was submitted),
 * so bid items can only be added to a job still being set up.
 */
async function projectId(url: string, cookie: string): Promise<string> {
  const listed = await fetch(`${url}/api/companies`, { headers: { cookie } });
  const { companies } = (await listed.json()) as { companies: { id: string; kind: string }[] };
  const res = await fetch(`${url}/api/projects`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', cookie, origin: url },
    body: JSON.stringify({
      name: 'Crash test job',
      subcontractorCompanyId: companies.find((c) => c.kind === 'subcontractor')!.id,
      ownerCompanyId: companies.find((c) => c.kind === 'owner')!.id,
    }),
  });
  expect(res.status).toBe(201);
  const body = (await res.json()) as { project: { id: string } };
  return body.project.id;
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
        let status: number;
        try {
          const res = await fetch(`${first.url}/api/projects/${project}/bid-items`, {
            method: 'POST',
            headers: { 'content-type': 'application/json', cookie, origin: first.url },
            body: JSON.stringify(item),
          });
          status = res.status;
        } catch {
          return; // the connection died with the server: this write was never acknowledged
        }
        if (status !== 201) {
          // A refused write fails the test at once (it used to be swallowed here and the test waited out its limit).
          killed = true;
          first.child.kill('SIGKILL');
          expect(status).toBe(201);
        }
        acknowledged.push(item.itemNumber);
        if (acknowledged.length >= KILL_AFTER_ACKS && !killed) {
          killed = true;
          first.child.kill('SIGKILL');
        }
      }
    };
    await Promise.all(Array.from({ length: WORKERS }, worker));
    expect(await first.exited).toBeNull(); // ended by the signal, not by itself
    expect(acknowledged.length).toBeGreaterThanOrEqual(KILL_AFTER_ACKS);

    // The killed server's lock is released by the kernel with the process.
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
