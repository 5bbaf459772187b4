import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import type { SmtpSink } from '../../server/integrations/mailer/smtp-sink';
import type { Database } from '../../server/db/client';
import { appOrigins } from '../../server/lib/origins';
import { assembleTestApp } from './assemble-app';
import { openDemoDatabase } from './demo-snapshot';
import { createTestDatabase } from './test-db';

/**
 * The whole app on an ephemeral port, for browser tests: a test database of its own with the demo, and the
 * built client from dist/. The auth origin is set after listen so it matches the real port. Payments go to the
 * local Stripe stand-in (`standinUrl`), whose bank debits settle after `achSettleMs`; `database` lets a browser
 * test add rows the demo does not have yet.
 */
export async function startTestServer(
  opts: { achSettleMs?: number } = {},
): Promise<{ url: string; mailbox: SmtpSink; database: Database; standinUrl: string; close: () => Promise<void> }> {
  // On PGlite the demo comes seeded from the run's snapshot; on a PostgreSQL server it is seeded here.
  const demo = process.env.TEST_DATABASE_URL ? undefined : await openDemoDatabase();
  const database = demo?.database ?? (await createTestDatabase());
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const port = (server.address() as AddressInfo).port;
  const { trustedOrigins } = appOrigins(port, undefined);
  const baseURL = `http://127.0.0.1:${port}`;
  const built = await assembleTestApp({
    database,
    baseURL,
    trustedOrigins,
    webhookTarget: `${baseURL}/api/webhooks/stripe`,
    achSettleMs: opts.achSettleMs ?? Number.POSITIVE_INFINITY,
    retryDelaysMs: [100, 500],
    seed: !demo,
    storage: demo?.storage,
    clientDir: path.resolve('dist'),
  });
  const { app, mailbox, standin } = built;
  server.on('request', app);
  return {
    url: baseURL,
    mailbox,
    database,
    standinUrl: standin.url,
    close: async () => {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await built.close();
      await database.close();
    },
  };
}
