import { createServer, request as httpRequest, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCalc } from '../../src/shared/domain/calc';
import { createComputePool, type ComputePool } from '../../server/lib/compute/compute-pool';
import { INLINE_BODY_BYTES } from '../../server/modules/calc/calc-bodies';
import { makeBidItem, makeWorld } from '../setup/factories';
import { createTestApp, signedInAgent, TEST_ORIGIN, type TestApp } from '../setup/test-app';

/**
 * The compute pool behind POST /api/calc/* and tally saves: large bodies and survey files are computed in worker
 * threads with the same answers as on the request thread; a full queue and a calculation past its time limit answer
 * 503 with Retry-After (RFC 9110 section 10.2.3) instead of holding the server.
 */
let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
let runs = 0;
let pool: ComputePool;
beforeAll(async () => {
  pool = createComputePool({ threads: 1, queue: 1, timeLimitMs: 20_000 });
  const counted: ComputePool = { ...pool, run: (task, options) => (runs++, pool.run(task, options)) };
  t = await createTestApp({ compute: counted });
  w = await makeWorld(t.database.db, t.auth);
});
afterAll(async () => {
  await t.close();
  await pool.close();
});

const as = (who: keyof typeof w.people) => signedInAgent(t.app, w.people[who].email);

/** An n x n grid of depths, smooth with cut and fill (invented, deterministic). */
const bigGrid = (n: number) => ({
  unit: 'ft',
  spacingX: 10,
  spacingY: 10,
  depths: Array.from({ length: n }, (_, i) =>
    Array.from({ length: n }, (_, j) => Math.round(300 * Math.sin(i / 9) * Math.cos(j / 7)) / 100),
  ),
});

/** Two surveys of one site, 40 x 40 shots each on offset rows (invented, deterministic). */
function surveys() {
  const rows = (seed: number, height: (x: number, y: number) => number) =>
    Array.from({ length: 1600 }, (_, k) => {
      const x = 100 + (k % 40) * 5 + 0.7 * Math.sin(k + seed);
      const y = 200 + Math.floor(k / 40) * 5 + 0.7 * Math.cos(k * 3 + seed);
      return [x, y, Math.round(height(x, y) * 1000) / 1000] as [number, number, number];
    });
  return { existing: rows(1, (x, y) => 50 + 0.02 * x + 0.5 * Math.sin(y / 30)), design: rows(2, () => 52) };
}
const csv = (points: [number, number, number][]) => `x,y,z\n${points.map((p) => p.join(',')).join('\n')}\n`;

describe('POST /api/calc/:method through the compute pool', () => {
  it('computes a body over the inline size in a worker, with the same answer as the engine on this thread', async () => {
    const body = bigGrid(120);
    expect(JSON.stringify(body).length).toBeGreaterThan(INLINE_BODY_BYTES);
    const before = runs;
    const res = await (await as('subcontractor')).post('/api/calc/grid').send(body);
    expect(res.status).toBe(200);
    expect(runs).toBe(before + 1);
    expect(res.body).toEqual(JSON.parse(JSON.stringify(runCalc('grid', body))));
  });

  it('answers a bad large body with 400 and the field path, from the worker', async () => {
    const body = bigGrid(120);
    body.depths[7]![3] = 'deep' as unknown as number;
    const res = await (await as('subcontractor')).post('/api/calc/grid').send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('VALIDATION_FAILED');
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toContain('depths.7.3');
    const broken = await (
      await as('subcontractor')
    )
      .post('/api/calc/grid')
      .set('content-type', 'application/json')
      .send(`${JSON.stringify(body).slice(0, 70_000)}`);
    expect(broken.status).toBe(400);
    expect(broken.body.error.code).toBe('MALFORMED_JSON');
  });

  it('holds each method to its own body limit (413): a pit body of 100 kB is refused', async () => {
    const res = await (
      await as('subcontractor')
    )
      .post('/api/calc/pit')
      .set('content-type', 'application/json')
      .send(
        JSON.stringify({ unit: 'ft', length: 10, width: 10, cornerDepths: [1, 1, 1, 1], pad: 'x'.repeat(100_000) }),
      );
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('BODY_TOO_LARGE');
  });

  it('takes the two surveys of a surface calculation as uploaded CSV files, with the same answer as the JSON body', async () => {
    const { existing, design } = surveys();
    const agent = await as('subcontractor');
    const res = await agent
      .post('/api/calc/surface')
      .field('unit', 'ft')
      .attach('existing', Buffer.from(csv(existing)), { filename: 'existing.csv', contentType: 'text/csv' })
      .attach('design', Buffer.from(csv(design)), { filename: 'design.csv', contentType: 'text/csv' });
    expect(res.status).toBe(200);
    const engine = runCalc('surface', { unit: 'ft', existing, design });
    expect(res.body.cut).toBeCloseTo(engine.cut, 9);
    expect(res.body.fill).toBeCloseTo(engine.fill, 9);
    expect(res.body.existingPoints).toBe(1600);
  });

  it('names the file and line of a bad survey row, and the missing file or unit', async () => {
    const { existing, design } = surveys();
    const agent = await as('subcontractor');
    const bad = csv(existing).replace(/\n([^\n]*)\n/, '\n$1\n12.5,oops,3\n');
    const res = await agent
      .post('/api/calc/surface')
      .field('unit', 'ft')
      .attach('existing', Buffer.from(bad), { filename: 'existing.csv', contentType: 'text/csv' })
      .attach('design', Buffer.from(csv(design)), { filename: 'design.csv', contentType: 'text/csv' });
    expect(res.status).toBe(400);
    expect(res.body.error.details).toContainEqual({
      path: 'existing.line 3',
      message: expect.stringContaining('12.5,oops,3'),
    });
    const missing = await agent
      .post('/api/calc/surface')
      .field('unit', 'ft')
      .attach('existing', Buffer.from(csv(existing)), { filename: 'e.csv', contentType: 'text/csv' });
    expect(missing.status).toBe(400);
    expect(missing.body.error.details).toEqual([{ path: 'design', message: 'Required' }]);
    const noUnit = await agent
      .post('/api/calc/surface')
      .attach('existing', Buffer.from(csv(existing)), { filename: 'e.csv', contentType: 'text/csv' })
      .attach('design', Buffer.from(csv(design)), { filename: 'd.csv', contentType: 'text/csv' });
    expect(noUnit.status).toBe(400);
    expect(noUnit.body.error.details[0].path).toBe('unit');
  });

  it('saves a tally with a large worksheet through the pool, with the engine quantity', async () => {
    const item = await makeBidItem(t.database.db, w.home.id, {
      itemNumber: 'CP-1',
      payUnit: 'CY',
      // A pond of this size is within its contract quantity, so no sanity reason is asked for.
      contractQuantity: 20_000,
      basis: 'bank',
      method: 'grid',
    });
    const inputs = bigGrid(80);
    const before = runs;
    const res = await (await as('subcontractor')).post(`/api/projects/${w.home.id}/tallies`).send({
      bidItemId: item.id,
      measuredOn: '2026-10-20',
      title: 'Pond grid',
      method: 'grid',
      inputs,
      component: 'cut',
    });
    expect(res.status).toBe(201);
    expect(runs).toBe(before + 1);
    expect(res.body.tally.quantity).toBeCloseTo(runCalc('grid', inputs).cut, 4);
  });
});

describe('the compute pool under load: 503 with Retry-After, never a held server', () => {
  let server: Server;
  let port: number;
  let cookie: string;
  beforeAll(async () => {
    server = createServer(t.app);
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    port = (server.address() as AddressInfo).port;
    const res = await request(t.app)
      .post('/api/auth/sign-in/email')
      .set('Origin', TEST_ORIGIN)
      .send({ email: w.people.subcontractor.email, password: 'correct-horse-battery' });
    cookie = (res.headers['set-cookie'] as unknown as string[]).map((c: string) => c.split(';')[0]).join('; ');
  });
  afterAll(() => new Promise<void>((resolve) => server.close(() => resolve())));

  /** A large body that starts and then stalls: it holds a worker (or a queue place) until it is cut off. */
  function stalledCalc() {
    const req = httpRequest({
      host: '127.0.0.1',
      port,
      method: 'POST',
      path: '/api/calc/grid',
      headers: { cookie, 'content-type': 'application/json', 'content-length': String(10_000_000) },
    });
    const answered = new Promise<{ status: number; retryAfter?: string; body: string }>((resolve) => {
      req.on('response', (res) => {
        let body = '';
        res.on('data', (d) => (body += d));
        res.on('end', () =>
          resolve({ status: res.statusCode!, retryAfter: res.headers['retry-after'] as string | undefined, body }),
        );
      });
      req.on('error', () => resolve({ status: 0, body: '' }));
    });
    req.write('{"unit":"ft","spacingX":10,"spacingY":10,"depths":[[1,2');
    return { req, answered };
  }
  const post = () =>
    fetch(`http://127.0.0.1:${port}/api/calc/grid`, {
      method: 'POST',
      headers: { cookie, 'content-type': 'application/json' },
      body: JSON.stringify(bigGrid(120)),
    });

  it('refuses a calculation at once with 503 COMPUTE_BUSY and Retry-After when the thread and the queue are taken', async () => {
    const running = stalledCalc();
    const queued = stalledCalc();
    await new Promise((r) => setTimeout(r, 200));
    const res = await post();
    expect(res.status).toBe(503);
    expect(res.headers.get('retry-after')).toMatch(/^\d+$/);
    expect((await res.json()).error.code).toBe('COMPUTE_BUSY');
    const health = await fetch(`http://127.0.0.1:${port}/api/health`);
    expect(health.status).toBe(200);
    running.req.destroy();
    queued.req.destroy();
    await Promise.all([running.answered, queued.answered]);
    // The places free up once the stalled clients are gone.
    await expect.poll(async () => (await post()).status, { timeout: 10_000, interval: 200 }).toBe(200);
  });

  it('stops a calculation past its time limit and answers 503 COMPUTE_TIMED_OUT with Retry-After', async () => {
    const short = createComputePool({ threads: 1, queue: 0, timeLimitMs: 300 });
    const quick = await createTestApp({ compute: short });
    try {
      const srv = createServer(quick.app);
      await new Promise<void>((resolve) => srv.listen(0, '127.0.0.1', resolve));
      const world = await makeWorld(quick.database.db, quick.auth);
      const signIn = await request(quick.app)
        .post('/api/auth/sign-in/email')
        .set('Origin', TEST_ORIGIN)
        .send({ email: world.people.subcontractor.email, password: 'correct-horse-battery' });
      const c = (signIn.headers['set-cookie'] as unknown as string[]).map((x: string) => x.split(';')[0]).join('; ');
      const p = (srv.address() as AddressInfo).port;
      const req = httpRequest({
        host: '127.0.0.1',
        port: p,
        method: 'POST',
        path: '/api/calc/grid',
        headers: { cookie: c, 'content-type': 'application/json', 'content-length': '5000000' },
      });
      const answer = new Promise<{ status: number; retryAfter?: string; body: string }>((resolve) => {
        req.on('response', (res) => {
          let body = '';
          res.on('data', (d) => (body += d));
          res.on('end', () =>
            resolve({ status: res.statusCode!, retryAfter: res.headers['retry-after'] as string | undefined, body }),
          );
        });
      });
      req.write('{"unit":"ft","depths":[[1,');
      const got = await answer;
      req.destroy();
      expect(got.status).toBe(503);
      expect(got.retryAfter).toMatch(/^\d+$/);
      expect(JSON.parse(got.body).error.code).toBe('COMPUTE_TIMED_OUT');
      await new Promise<void>((resolve) => srv.close(() => resolve()));
    } finally {
      await quick.close();
      await short.close();
    }
  });
});
