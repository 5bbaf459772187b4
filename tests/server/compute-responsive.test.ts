import { Agent, request as httpRequest } from 'node:http';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildServerIfStale, SERVER_BUNDLE } from '../../scripts/build-server';
import { DEMO_PASSWORD } from '../../server/db/demo/demo-data';
import { CALC_LIMITS } from '../../src/shared/schemas/calc-limits';
import { freePort, signInCookie, startServerProcess } from '../setup/server-process';

const dataDir = mkdtempSync(path.join(tmpdir(), 'tallyard-responsive-'));
afterAll(() => rmSync(dataDir, { recursive: true, force: true }));
// `npm start`'s server (dist-server/), so the bundled worker is proven too; the API tests run the tsx one.
beforeAll(() => buildServerIfStale(), 120_000);

/** The bound: /api/health answers within 50 ms while the largest allowed calculation runs. */
const HEALTH_BOUND_MS = 50;
/** Far below any step of the largest calculation, far above a busy machine's scheduling delays. */
const HELD_THREAD_MS = 500;

/** One survey of CALC_LIMITS.surfacePoints shots as CSV (invented, deterministic): a 1,000 x 1,000 ft site. */
function surveyCsv(seed: number, height: (x: number, y: number) => number): Buffer {
  const n = Math.sqrt(CALC_LIMITS.surfacePoints);
  const parts: string[] = ['x,y,z\n'];
  for (let i = 0; i < n; i++) {
    let rows = '';
    for (let j = 0; j < n; j++) {
      const k = i * n + j;
      const x = 5000 + j + 0.3 * Math.sin((k + seed) * 12.9898);
      const y = 8000 + i + 0.3 * Math.cos((k + seed) * 78.233);
      rows += `${x.toFixed(3)},${y.toFixed(3)},${height(x - 5000, y - 8000).toFixed(3)}\n`;
    }
    parts.push(rows);
  }
  return Buffer.from(parts.join(''));
}

function multipart(boundary: string, unit: string, files: Record<string, Buffer>): Buffer[] {
  const out: Buffer[] = [
    Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="unit"\r\n\r\n${unit}\r\n`),
  ];
  for (const [name, bytes] of Object.entries(files)) {
    out.push(
      Buffer.from(
        `--${boundary}\r\nContent-Disposition: form-data; name="${name}"; filename="${name}.csv"\r\nContent-Type: text/csv\r\n\r\n`,
      ),
      bytes,
      Buffer.from('\r\n'),
    );
  }
  out.push(Buffer.from(`--${boundary}--\r\n`));
  return out;
}

// A responsiveness check, not a speed budget: the server must keep answering while a worker computes. The worst
// health round trip is compared with the bound; the calculation itself may take as long as it takes.
describe('the built server stays responsive while the largest allowed calculation runs', () => {
  it('keeps /api/health answering throughout a two-million-point surface upload and calculation (p99 within 50 ms over idle)', async () => {
    const server = await startServerProcess(dataDir, await freePort(), { SEED_DEMO: 'always' }, [SERVER_BUNDLE]);
    try {
      const cookie = await signInCookie(server.url, 'sub@tallyard.test', DEMO_PASSWORD);
      const body = multipart('tallyard-survey-boundary', 'ft', {
        existing: surveyCsv(1, (x, y) => 20 + 3 * Math.sin(x / 90) * Math.cos(y / 70)),
        design: surveyCsv(7, (x, y) => 19.5 + 0.004 * x - 0.002 * y),
      });
      const { port, hostname } = new URL(server.url);
      const agent = new Agent({ keepAlive: true, maxSockets: 1 });
      const health = () =>
        new Promise<number>((resolve, reject) => {
          const start = performance.now();
          httpRequest({ host: hostname, port, path: '/api/health', agent }, (res) => {
            res.resume();
            res.on('end', () =>
              res.statusCode === 200
                ? resolve(performance.now() - start)
                : reject(new Error(`health ${res.statusCode}`)),
            );
          }).end();
        });
      await health(); // the keep-alive connection is open before timing starts
      const probe = async (while_: () => boolean) => {
        const out: number[] = [];
        while (while_()) {
          out.push(await health());
          await new Promise((r) => setTimeout(r, 25));
        }
        return out.sort((a, b) => a - b);
      };
      // What this machine gives an idle server: its scheduling delays are not the server's doing.
      const idleUntil = performance.now() + 3000;
      const idle = await probe(() => performance.now() < idleUntil);

      let done = false;
      const calc = new Promise<{ status: number; text: string }>((resolve, reject) => {
        const req = httpRequest(
          {
            host: hostname,
            port,
            method: 'POST',
            path: '/api/calc/surface',
            headers: {
              cookie,
              'content-type': 'multipart/form-data; boundary=tallyard-survey-boundary',
              'content-length': String(body.reduce((s, b) => s + b.length, 0)),
            },
          },
          (res) => {
            let text = '';
            res.on('data', (d) => (text += d));
            res.on('end', () => resolve({ status: res.statusCode!, text }));
          },
        );
        req.on('error', reject);
        for (const part of body) req.write(part);
        req.end();
      }).finally(() => (done = true));

      const during = await probe(() => !done);
      const answer = await calc;
      agent.destroy();
      expect(answer.status, answer.text.slice(0, 500)).toBe(200);
      const result = JSON.parse(answer.text);
      expect(result.existingPoints).toBe(CALC_LIMITS.surfacePoints);
      expect(result.designPoints).toBe(CALC_LIMITS.surfacePoints);
      // The calculation ran for a while (many probes). The 99th percentile stays within the bound over what the same
      // server answers idle on this machine (a loaded CI machine delays any process now and then; on a quiet one the
      // idle figure is a few ms). No probe waits anywhere near as long as a held request thread would make it: the
      // smallest step of this calculation (reading one survey) takes over a second on one core.
      const p99 = (l: number[]) => l[Math.floor(l.length * 0.99)]!;
      const summary = (l: number[]) =>
        `worst ${l.at(-1)!.toFixed(1)} ms, p99 ${p99(l).toFixed(1)} ms of ${l.length} probes`;
      const report = `health while computing: ${summary(during)}; idle: ${summary(idle)}`;
      console.log(report);
      expect(during.length).toBeGreaterThan(20);
      expect(p99(during), report).toBeLessThan(HEALTH_BOUND_MS + p99(idle));
      expect(during.at(-1)!, report).toBeLessThan(HELD_THREAD_MS);
    } finally {
      server.child.kill('SIGTERM');
      await server.exited;
    }
  }, 240_000);
});
