import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { createApp } from '../../server/app';
import { createAuth } from '../../server/auth';
import { seedDemo } from '../../server/db/seed-demo';
import { smtpMailer } from '../../server/integrations/mailer/mailer';
import { startSmtpSink, type SmtpSink } from '../../server/integrations/mailer/smtp-sink';
import { memoryStorage } from '../../server/integrations/storage/storage';
import { createLogger } from '../../server/lib/logger';
import { appOrigins } from '../../server/lib/origins';
import { createTestDatabase } from './test-db';

/**
 * The whole app on an ephemeral port, for browser tests: a fresh test database seeded with the demo, and the
 * built client from dist/. The auth origin is set after listen so it matches the real port.
 */
export async function startTestServer(): Promise<{ url: string; mailbox: SmtpSink; close: () => Promise<void> }> {
  const database = await createTestDatabase();
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const port = (server.address() as AddressInfo).port;
  const { trustedOrigins } = appOrigins(port, undefined);
  const baseURL = `http://127.0.0.1:${port}`;
  const auth = createAuth({ db: database.db, secret: 'e2e-secret-e2e-secret-e2e-secret-0123456', baseURL, trustedOrigins, production: false });
  await seedDemo(database.db, auth);
  const mailbox = await startSmtpSink();
  const app = createApp({
    database,
    auth,
    logger: createLogger('silent'),
    mailer: smtpMailer(mailbox.url, 'Tallyard <no-reply@tallyard.test>'),
    storage: memoryStorage(),
    mailbox,
    appUrl: baseURL,
    clientDir: path.resolve('dist'),
  });
  server.on('request', app);
  return {
    url: baseURL,
    mailbox,
    close: async () => {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await mailbox.close();
      await database.close();
    },
  };
}
