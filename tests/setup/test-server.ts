import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { createApp } from '../../server/app';
import { createAuth } from '../../server/auth';
import { seedDemo } from '../../server/db/seed-demo';
import { createLogger } from '../../server/lib/logger';
import { appOrigins } from '../../server/lib/origins';
import { createTestDatabase } from './test-db';

/**
 * The whole app on an ephemeral port, for browser tests: a fresh test database seeded with the demo, and the
 * built client from dist/. The auth origin is set after listen so it matches the real port.
 */
export async function startTestServer(): Promise<{ url: string; close: () => Promise<void> }> {
  const database = await createTestDatabase();
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const port = (server.address() as AddressInfo).port;
  const { trustedOrigins } = appOrigins(port, undefined);
  const baseURL = `http://127.0.0.1:${port}`;
  const auth = createAuth({ db: database.db, secret: 'e2e-secret-e2e-secret-e2e-secret-0123456', baseURL, trustedOrigins, production: false });
  await seedDemo(database.db, auth);
  const app = createApp({ database, auth, logger: createLogger('silent'), clientDir: path.resolve('dist') });
  server.on('request', app);
  return {
    url: baseURL,
    close: async () => {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await database.close();
    },
  };
}
