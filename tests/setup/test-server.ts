import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { createApp } from '../../server/app';
import { createAuth } from '../../server/auth';
import { seedDemo } from '../../server/db/seed-demo';
import { smtpMailer } from '../../server/integrations/mailer/mailer';
import { startSmtpSink, type SmtpSink } from '../../server/integrations/mailer/smtp-sink';
import { startLocalPayments } from '../../server/integrations/payments/local-payments';
import type { Database } from '../../server/db/client';
import { memoryStorage } from '../../server/integrations/storage/storage';
import { createLogger } from '../../server/lib/logger';
import { appOrigins } from '../../server/lib/origins';
import { fastPasswordHasher } from './fast-password';
import { createTestDatabase } from './test-db';

/**
 * The whole app on an ephemeral port, for browser tests: a fresh test database seeded with the demo, and the
 * built client from dist/. The auth origin is set after listen so it matches the real port. Payments go to the
 * local Stripe stand-in (`standinUrl`), whose bank debits settle after `achSettleMs`; `database` lets a browser
 * test add rows the demo does not have yet.
 */
export async function startTestServer(
  opts: { achSettleMs?: number } = {},
): Promise<{ url: string; mailbox: SmtpSink; database: Database; standinUrl: string; close: () => Promise<void> }> {
  const database = await createTestDatabase();
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const port = (server.address() as AddressInfo).port;
  const { trustedOrigins } = appOrigins(port, undefined);
  const baseURL = `http://127.0.0.1:${port}`;
  const auth = createAuth({ db: database.db, secret: 'e2e-secret-e2e-secret-e2e-secret-0123456', baseURL, trustedOrigins, production: false, passwordHasher: fastPasswordHasher });
  const storage = memoryStorage();
  await seedDemo(database.db, auth, storage);
  const mailbox = await startSmtpSink();
  const { payments, standin } = await startLocalPayments({
    webhookTarget: `${baseURL}/api/webhooks/stripe`,
    achSettleMs: opts.achSettleMs ?? Number.POSITIVE_INFINITY,
    retryDelaysMs: [100, 500],
  });
  const app = createApp({
    database,
    auth,
    logger: createLogger('silent'),
    mailer: smtpMailer(mailbox.url, 'Tallyard <no-reply@tallyard.test>'),
    storage,
    mailbox,
    payments,
    appUrl: baseURL,
    clientDir: path.resolve('dist'),
  });
  server.on('request', app);
  return {
    url: baseURL,
    mailbox,
    database,
    standinUrl: standin.url,
    close: async () => {
      await standin.close();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await mailbox.close();
      await database.close();
    },
  };
}
