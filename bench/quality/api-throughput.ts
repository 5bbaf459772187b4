import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import autocannon from 'autocannon';
import express from 'express';
import { createApp } from '../../server/app';
import { createAuth } from '../../server/auth';
import { openDatabase } from '../../server/db/client';
import { DEMO_PASSWORD } from '../../server/db/demo/demo-data';
import { runMigrations } from '../../server/db/migrate';
import { seedDemo } from '../../server/db/seed-demo';
import { bidItems } from '../../server/db/schema';
import { smtpMailer } from '../../server/integrations/mailer/mailer';
import { memoryStorage } from '../../server/integrations/storage/storage';
import { createLogger } from '../../server/lib/logger';
import { withinLimit, type MeasuredBench } from './measured';

const LINES = 200;
const P99_LIMIT_MS = 50;
const MIN_RATIO = 0.5;

const listen = async (handler?: express.Express): Promise<{ server: Server; url: string }> => {
  const server = handler ? createServer(handler) : createServer();
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
  return { server, url: `http://127.0.0.1:${(server.address() as AddressInfo).port}` };
};

const load = (url: string, headers: Record<string, string> = {}) =>
  autocannon({ url, connections: 10, duration: 10, headers });

/** GET of a 200-line bid schedule through the whole app, against a bare Express JSON route in the same process. */
export const apiThroughput: MeasuredBench = {
  name: 'api-bid-items-200-lines',
  async measure() {
    const database = await openDatabase({ kind: 'pglite-memory' });
    await runMigrations(database);
    const { url: appUrl, server } = await listen(); // the app is attached once the auth origin knows the port
    const auth = createAuth({ db: database.db, secret: 'bench-secret-bench-secret-bench-secret-01', baseURL: appUrl, trustedOrigins: [appUrl], production: false, rateLimit: false });
    await seedDemo(database.db, auth, memoryStorage());
    const app = createApp({ database, auth, logger: createLogger('silent'), mailer: smtpMailer('smtp://127.0.0.1:1', 'x <x@x.test>'), storage: memoryStorage(), appUrl });
    server.on('request', app);
    const signIn = await fetch(`${appUrl}/api/auth/sign-in/email`, { method: 'POST', headers: { 'content-type': 'application/json', origin: appUrl }, body: JSON.stringify({ email: 'gc@tallyard.test', password: DEMO_PASSWORD }) });
    if (signIn.status !== 200) throw new Error(`sign-in failed: ${signIn.status} ${await signIn.text()}`);
    const cookie = signIn.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
    const projects = (await (await fetch(`${appUrl}/api/projects`, { headers: { cookie } })).json()) as { projects: { id: string }[] };
    const projectId = projects.projects[0]!.id;
    const existing = (await (await fetch(`${appUrl}/api/projects/${projectId}/bid-items`, { headers: { cookie } })).json()) as { bidItems: unknown[] };
    const extra = Array.from({ length: LINES - existing.bidItems.length }, (_, i) => ({ projectId, itemNumber: `B-${i}`, description: 'Bench excavation', payUnit: 'CY' as const, basis: 'bank' as const, unitPriceCents: 725, contractQuantity: 1000, isMajor: false, method: 'end-area' as const }));
    if (extra.length) await database.db.insert(bidItems).values(extra);

    const bareApp = express();
    bareApp.get('/bare', (_req, res) => res.json({ status: 'ok' }));
    const bare = await listen(bareApp);
    try {
      const bareResult = await load(`${bare.url}/bare`);
      const appResult = await load(`${appUrl}/api/projects/${projectId}/bid-items`, { cookie });
      if (appResult.non2xx > 0) throw new Error(`${appResult.non2xx} requests did not answer 2xx`);
      const ratio = appResult.requests.average / bareResult.requests.average;
      const p99 = appResult.latency.p99;
      const r = withinLimit(this.name, p99 / 1000, P99_LIMIT_MS / 1000, `p99 ${p99} ms (limit ${P99_LIMIT_MS}); ${Math.round(appResult.requests.average)} req/s = ${ratio.toFixed(2)}x the bare route's ${Math.round(bareResult.requests.average)} (limit ${MIN_RATIO}x)`);
      return { ...r, ok: r.ok && ratio >= MIN_RATIO };
    } finally {
      server.close();
      bare.server.close();
      await database.close();
    }
  },
};
