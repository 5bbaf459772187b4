import { createServer, get, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import autocannon from 'autocannon';
import { desc, eq, sql } from 'drizzle-orm';
import express from 'express';
import { createApp } from '../../server/app';
import { createAuth } from '../../server/auth';
import { openDatabase } from '../../server/db/client';
import { DEMO_PASSWORD } from '../../server/db/demo/demo-data';
import { runMigrations } from '../../server/db/migrate';
import { bidItems, payAppLines, payApps, projects } from '../../server/db/schema';
import { seedDemo } from '../../server/db/seed-demo';
import { smtpMailer } from '../../server/integrations/mailer/mailer';
import { memoryStorage } from '../../server/integrations/storage/storage';
import { createLogger } from '../../server/lib/logger';
import { signInCookie } from '../../tests/setup/server-process';
import { fastPasswordHasher } from '../../tests/setup/fast-password';
import { check, type SelfMeasuredBench } from '../types';

const LINES = 200;
const P99_LIMIT_MS = 50;
const MIN_RATIO = 0.5;
const CONNECTIONS = 10;
const SECONDS = 10;

const listen = async (handler: express.Express): Promise<{ server: Server; url: string }> => {
  const server = createServer(handler);
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
  return { server, url: `http://127.0.0.1:${(server.address() as AddressInfo).port}` };
};

/**
 * The status of a conditional GET as a browser's cache sends it. Not through fetch: the Fetch standard turns a request
 * with If-None-Match into cache mode no-store and adds `Cache-Control: no-cache`, which Express rightly never answers 304.
 */
const revalidate = (url: string, headers: Record<string, string>) =>
  new Promise<number | undefined>((resolve, reject) => {
    get(url, { headers }, (res) => {
      res.resume();
      resolve(res.statusCode);
    }).on('error', reject);
  });

const load = (url: string, headers: Record<string, string> = {}) =>
  autocannon({ url, connections: CONNECTIONS, duration: SECONDS, headers });

/** Tops the demo's latest pay application up to LINES lines (each on a bid item of its own), as the seed left it otherwise. */
export async function payAppWithLines(db: Awaited<ReturnType<typeof openDatabase>>['db']): Promise<string> {
  const [app] = await db.select().from(payApps).orderBy(desc(payApps.createdAt)).limit(1);
  if (!app) throw new Error('the demo seed wrote no pay application');
  const lines = await db.select().from(payAppLines).where(eq(payAppLines.payAppId, app.id));
  const missing = LINES - lines.length;
  if (missing > 0) {
    const items = await db
      .insert(bidItems)
      .values(
        Array.from({ length: missing }, (_, i) => ({
          projectId: app.projectId,
          itemNumber: `Z-${i + 1}`,
          description: 'Bench excavation',
          payUnit: 'CY' as const,
          basis: 'bank' as const,
          unitPriceCents: 725,
          contractQuantity: 1000,
          isMajor: false,
          method: 'end-area' as const,
        })),
      )
      .returning({ id: bidItems.id, itemNumber: bidItems.itemNumber });
    await db.insert(payAppLines).values(
      items.map((item, i) => ({
        payAppId: app.id,
        bidItemId: item.id,
        sortOrder: lines.length + i,
        itemNumber: item.itemNumber,
        description: 'Bench excavation',
        payUnit: 'CY' as const,
        unitPriceCents: 725,
        contractQuantity: 1000,
        previousQuantity: 100,
        thisPeriodQuantity: 25.5,
        toDateQuantity: 125.5,
        previousAmountCents: 72_500,
        thisPeriodAmountCents: 18_488,
        amountToDateCents: 90_988,
        retainageCents: 9_099,
      })),
    );
  }
  return app.id;
}

/**
 * The first read after a write, alone: under load every read but the first is answered from the answer cache (at the
 * same read version), so this is what a reader pays after someone changed something. The write changes no value
 * (the project's name set to itself) but moves read_version like any other.
 */
async function firstReadsAfterWrite(
  db: Awaited<ReturnType<typeof openDatabase>>['db'],
  payAppId: string,
  target: string,
  cookie: string,
): Promise<{ medianMs: number; maxMs: number }> {
  const [app] = await db.select({ projectId: payApps.projectId }).from(payApps).where(eq(payApps.id, payAppId));
  const times: number[] = [];
  for (let i = 0; i < 15; i++) {
    await db
      .update(projects)
      .set({ name: sql`${projects.name}` })
      .where(eq(projects.id, app!.projectId));
    const start = performance.now();
    const res = await fetch(target, { headers: { cookie } });
    await res.arrayBuffer();
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  return { medianMs: Math.round(times[7]!), maxMs: Math.round(times[14]!) };
}

/**
 * GET of a 200-line pay application through the whole app (session, access checks, the read, the presenter) under
 * autocannon, against serving the very same JSON body from memory in the same process (issue 16: at least 0.5x).
 * Nothing is written during the load, so after the first request the app answers from its answer cache (the session
 * and the access checks still run on each request); the first read after a write is reported beside it.
 * BENCH_DATABASE_URL runs it on a PostgreSQL server (a throwaway database: it is migrated and seeded with the demo)
 * instead of the embedded database.
 */
export const apiThroughput: SelfMeasuredBench = {
  name: 'api-pay-app-200-lines',
  async measure() {
    const url = process.env.BENCH_DATABASE_URL;
    const database = await openDatabase(url ? { kind: 'postgres', url } : { kind: 'pglite-memory' });
    await runMigrations(database);
    const appServer = createServer();
    await new Promise<void>((r) => appServer.listen(0, '127.0.0.1', r));
    const appUrl = `http://127.0.0.1:${(appServer.address() as AddressInfo).port}`;
    // The app is attached once the auth origin knows the port. The fast hasher only shortens the seed's sign-ups.
    const auth = createAuth({
      db: database.db,
      secret: 'bench-secret-bench-secret-bench-secret-01',
      baseURL: appUrl,
      trustedOrigins: [appUrl],
      secureCookies: false,
      rateLimit: false,
      passwordHasher: fastPasswordHasher,
    });
    await seedDemo(database.db, auth, memoryStorage());
    const payAppId = await payAppWithLines(database.db);
    const app = createApp({
      database,
      auth,
      logger: createLogger('silent'),
      mailer: smtpMailer('smtp://127.0.0.1:1', 'x <x@x.test>'),
      storage: memoryStorage(),
      appUrl,
    });
    appServer.on('request', app);
    const cookie = await signInCookie(appUrl, 'gc@tallyard.test', DEMO_PASSWORD);
    const target = `${appUrl}/api/pay-apps/${payAppId}`;
    const probe = await fetch(target, { headers: { cookie } });
    const body = (await probe.json()) as { payApp?: { lines: unknown[] } };
    const tag = probe.headers.get('etag');
    const revalidated = await revalidate(target, { cookie, 'if-none-match': tag ?? '' });
    if (!tag || revalidated !== 304)
      throw new Error(`the pay application did not answer 304 to its own ETag: ${revalidated}`);
    if (probe.status !== 200 || body.payApp?.lines.length !== LINES)
      throw new Error(`the pay application did not answer with ${LINES} lines: ${probe.status}`);

    // The baseline: the same JSON body served from memory by a plain Express route in the same process.
    const bareApp = express();
    bareApp.get('/bare', (_req, res) => res.json(body));
    const bare = await listen(bareApp);
    try {
      const bareResult = await load(`${bare.url}/bare`);
      const appResult = await load(target, { cookie });
      if (appResult.non2xx > 0 || appResult.errors > 0)
        throw new Error(`${appResult.non2xx} answers were not 2xx, ${appResult.errors} failed`);
      const ratio = appResult.requests.average / bareResult.requests.average;
      const afterWrite = await firstReadsAfterWrite(database.db, payAppId, target, cookie);
      return {
        checks: [
          check('req/s / same body from memory', ratio, 'x', '>=', MIN_RATIO),
          check('p99 latency', appResult.latency.p99, 'ms', '<', P99_LIMIT_MS),
        ],
        baseline: `the same JSON body served from memory by Express in the same process; autocannon ${CONNECTIONS} connections x ${SECONDS} s each; ${database.kind}`,
        figures: {
          requestsPerSecond: Math.round(appResult.requests.average),
          bareRequestsPerSecond: Math.round(bareResult.requests.average),
          p99Ms: appResult.latency.p99,
          averageLatencyMs: appResult.latency.average,
          bareP99Ms: bareResult.latency.p99,
          responseBytes: Buffer.byteLength(JSON.stringify(body)),
          firstReadAfterWriteMedianMs: afterWrite.medianMs,
          firstReadAfterWriteMaxMs: afterWrite.maxMs,
        },
      };
    } finally {
      appServer.close();
      bare.server.close();
      await database.close();
    }
  },
};
