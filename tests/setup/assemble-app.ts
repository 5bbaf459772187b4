import type { UploadLimits } from '../../server/lib/upload';
import type { Express } from 'express';
import { createApp } from '../../server/app';
import { createAuth, type Auth } from '../../server/auth';
import type { Database } from '../../server/db/client';
import { seedDemo } from '../../server/db/seed-demo';
import { smtpMailer } from '../../server/integrations/mailer/mailer';
import { startSmtpSink, type SmtpSink } from '../../server/integrations/mailer/smtp-sink';
import { startLocalPayments } from '../../server/integrations/payments/local-payments';
import { memoryStorage, type Storage } from '../../server/integrations/storage/storage';
import type { ComputePool } from '../../server/lib/compute/compute-pool';
import { createLogger } from '../../server/lib/logger';
import type { Standin } from '../../stripe-standin/src/index';
import { fastPasswordHasher } from './fast-password';

type Options = {
  database: Database;
  baseURL: string;
  trustedOrigins: string[];
  webhookTarget: Parameters<typeof startLocalPayments>[0]['webhookTarget'];
  achSettleMs: number;
  retryDelaysMs: number[];
  seed?: boolean;
  /** Where uploads go; memory storage unless given (a test of the folder layout passes localStorage). */
  storage?: Storage;
  clientDir?: string;
  /** Worker threads for heavy calculations; the shared pool unless given (a test of the limits passes its own). */
  compute?: ComputePool;
  /** Upload limits (a test of the quota sets a tiny one). */
  uploads?: Partial<UploadLimits>;
};

export type AssembledApp = {
  app: Express;
  auth: Auth;
  mailbox: SmtpSink;
  storage: Storage;
  standin: Standin;
  close: () => Promise<void>;
};

/**
 * The real app with the test integrations: fast password hashing, memory storage, the local SMTP sink and the
 * Stripe stand-in. Shared by the in-process API tests and the browser tests' server.
 */
export async function assembleTestApp(o: Options): Promise<AssembledApp> {
  const logger = createLogger(process.env.TEST_LOG_LEVEL ?? 'silent');
  const auth = createAuth({
    logger,
    db: o.database.db,
    secret: 'test-secret-test-secret-test-secret-0123',
    baseURL: o.baseURL,
    trustedOrigins: o.trustedOrigins,
    secureCookies: false,
    passwordHasher: fastPasswordHasher,
  });
  const storage = o.storage ?? memoryStorage();
  if (o.seed) await seedDemo(o.database.db, auth, storage);
  const mailbox = await startSmtpSink();
  const { payments, standin } = await startLocalPayments({
    webhookTarget: o.webhookTarget,
    achSettleMs: o.achSettleMs,
    retryDelaysMs: o.retryDelaysMs,
  });
  const app = createApp({
    database: o.database,
    auth,
    logger,
    mailer: smtpMailer(mailbox.url, 'Tallyard <no-reply@tallyard.test>'),
    storage,
    mailbox,
    payments,
    appUrl: o.baseURL,
    clientDir: o.clientDir,
    compute: o.compute,
    uploads: o.uploads,
  });
  const close = async () => {
    await standin.close();
    await mailbox.close();
  };
  return { app, auth, mailbox, storage, standin, close };
}
