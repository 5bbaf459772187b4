import type { UploadLimits } from '../../server/lib/upload';
import type { Express } from 'express';
import request from 'supertest';
import type { Auth } from '../../server/auth';
import type { Database } from '../../server/db/client';
import type { SmtpSink } from '../../server/integrations/mailer/smtp-sink';
import type { Standin } from '../../stripe-standin/src/index';
import type { Storage } from '../../server/integrations/storage/storage';
import type { ComputePool } from '../../server/lib/compute/compute-pool';
import type { Outbox } from '../../server/modules/notifications/outbox';
import { assembleTestApp } from './assemble-app';
import { createTestDatabase } from './test-db';

export const TEST_ORIGIN = 'http://localhost:3000';
export const TEST_PASSWORD = 'correct-horse-battery';

export type TestApp = {
  app: Express;
  auth: Auth;
  database: Database;
  mailbox: SmtpSink;
  storage: Storage;
  /** The local Stripe stand-in; webhooks reach the app in-process. Bank debits wait for its settle hook. */
  standin: Standin;
  /** Resolves once the outbox has sent (or given up on) everything due: mail goes out after the answer. */
  outboxIdle: () => Promise<void>;
  close: () => Promise<void>;
};

/** The real app on a fresh test database, driven in-process by supertest. */
export async function createTestApp(
  options: { storage?: Storage; compute?: ComputePool; uploads?: Partial<UploadLimits> } = {},
): Promise<TestApp> {
  const database = await createTestDatabase();
  const target: { app?: Express } = {};
  const built = await assembleTestApp({
    database,
    baseURL: TEST_ORIGIN,
    trustedOrigins: [TEST_ORIGIN],
    webhookTarget: async (payload, headers) =>
      (await request(target.app!).post('/api/webhooks/stripe').set(headers).send(payload)).status,
    achSettleMs: Number.POSITIVE_INFINITY,
    retryDelaysMs: [50, 200],
    storage: options.storage,
    compute: options.compute,
    uploads: options.uploads,
  });
  const { app, auth, mailbox, storage, standin } = built;
  target.app = app;
  // Mail goes out after the answer (server/modules/notifications/outbox.ts): wait for it before reading the tables
  // a send updates, and before closing the database under it.
  const outboxIdle = () => (app.locals.outbox as Outbox).flush();
  const close = async () => {
    await outboxIdle();
    await built.close();
    await database.close();
  };
  return { app, auth, database, mailbox, storage, standin, outboxIdle, close };
}

/** A supertest agent signed in as this person: it keeps the session cookie and sends our Origin. */
export async function signedInAgent(app: Express, email: string, password = TEST_PASSWORD) {
  const agent = request.agent(app);
  agent.set('Origin', TEST_ORIGIN);
  const res = await agent.post('/api/auth/sign-in/email').send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}
