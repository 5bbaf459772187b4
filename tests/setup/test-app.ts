import type { Express } from 'express';
import request from 'supertest';
import { createApp } from '../../server/app';
import { createAuth, type Auth } from '../../server/auth';
import type { Database } from '../../server/db/client';
import { smtpMailer } from '../../server/integrations/mailer/mailer';
import { startSmtpSink, type SmtpSink } from '../../server/integrations/mailer/smtp-sink';
import { startLocalPayments } from '../../server/integrations/payments/local-payments';
import type { Standin } from '../../stripe-standin/src/index';
import { memoryStorage, type Storage } from '../../server/integrations/storage/storage';
import { createLogger } from '../../server/lib/logger';
import { fastPasswordHasher } from './fast-password';
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
  close: () => Promise<void>;
};

/** The real app on a fresh test database, driven in-process by supertest. */
export async function createTestApp(): Promise<TestApp> {
  const database = await createTestDatabase();
  const auth = createAuth({
    db: database.db,
    secret: 'test-secret-test-secret-test-secret-0123',
    baseURL: TEST_ORIGIN,
    trustedOrigins: [TEST_ORIGIN],
    production: false,
    passwordHasher: fastPasswordHasher,
  });
  const mailbox = await startSmtpSink();
  const storage = memoryStorage();
  const target: { app?: Express } = {};
  const { payments, standin } = await startLocalPayments({
    webhookTarget: async (payload, headers) => (await request(target.app!).post('/api/webhooks/stripe').set(headers).send(payload)).status,
    achSettleMs: Number.POSITIVE_INFINITY,
    retryDelaysMs: [50, 200],
  });
  const app = createApp({
    database,
    auth,
    logger: createLogger('silent'),
    mailer: smtpMailer(mailbox.url, 'Tallyard <no-reply@tallyard.test>'),
    storage,
    mailbox,
    payments,
    appUrl: TEST_ORIGIN,
  });
  target.app = app;
  const close = async () => {
    await standin.close();
    await mailbox.close();
    await database.close();
  };
  return { app, auth, database, mailbox, storage, standin, close };
}

/** A supertest agent signed in as this person: it keeps the session cookie and sends our Origin. */
export async function signedInAgent(app: Express, email: string, password = TEST_PASSWORD) {
  const agent = request.agent(app);
  agent.set('Origin', TEST_ORIGIN);
  const res = await agent.post('/api/auth/sign-in/email').send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}
