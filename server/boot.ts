import type { FeeRates } from '../src/shared/domain/payment-fees';
import { createServer } from 'node:http';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { createApp } from './app';
import { createAuth } from './auth';
import type { Database } from './db/client';
import { runMigrations } from './db/migrate';
import { DEMO_PASSWORD, DEMO_PEOPLE } from './db/demo/demo-data';
import { seedDemo } from './db/seed-demo';
import { smtpMailer } from './integrations/mailer/mailer';
import { startSmtpSink } from './integrations/mailer/smtp-sink';
import { configurePayments } from './integrations/payments/configure';
import { s3OptionsFromEnv, s3Storage } from './integrations/storage/s3-storage';
import { localStorage } from './integrations/storage/storage';
import { isDemo, type Env } from './env';
import { authSecret, type DataDirLayout } from './lib/data-dir';
import type { Logger } from './lib/logger';
import { appOrigins } from './lib/origins';

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

export type BootArgs = {
  env: Env;
  logger: Logger;
  layout: DataDirLayout;
  database: Database;
  unlock: () => Promise<void>;
};

/** migrate -> seed -> createApp -> listen, on a database server/index.ts has opened; SIGTERM and SIGINT close cleanly. */
export async function boot({ env, logger, layout, database, unlock }: BootArgs): Promise<void> {
  const usePostgres = database.kind === 'postgres';
  await runMigrations(database);

  const devOrigins = env.NODE_ENV === 'development' ? ['http://localhost:5173', 'http://127.0.0.1:5173'] : [];
  const { baseURL, trustedOrigins } = appOrigins(env.PORT, env.APP_URL, devOrigins);
  const auth = createAuth({
    db: database.db,
    secret: authSecret(layout, env.BETTER_AUTH_SECRET),
    baseURL,
    trustedOrigins,
    secureCookies: baseURL.startsWith('https:'),
    logger,
  });
  const shouldSeed = env.SEED_DEMO === 'always' || (env.SEED_DEMO === 'auto' && !usePostgres);
  const objects = s3OptionsFromEnv(env);
  const storage = objects ? await s3Storage(objects) : localStorage(layout.uploads);
  if (env.S3_BUCKET)
    logger.info({ bucket: env.S3_BUCKET, endpoint: env.S3_ENDPOINT }, 'uploads go to S3-compatible storage');
  if (shouldSeed && (await seedDemo(database.db, auth, storage))) logger.info('seeded the demo project');

  // Without SMTP_URL (development, tests, the demo: production refuses to start without it) a local sink
  // catches the mail; the Mailbox page shows each signed-in person their own, in development and the demo only.
  const demo = isDemo(env);
  const mailbox = env.SMTP_URL ? undefined : await startSmtpSink();
  const mailer = smtpMailer(env.SMTP_URL ?? mailbox!.url, env.MAIL_FROM);
  const showMailbox = mailbox && (env.NODE_ENV === 'development' || demo);
  if (demo)
    logger.warn(
      'demo mode: mail stays in the demo Mailbox and payments go to the local Stripe stand-in; not for real use',
    );
  else if (mailbox)
    logger.info(
      showMailbox
        ? 'no SMTP_URL: mail goes to the local sink (Mailbox page)'
        : 'no SMTP_URL: mail goes to the local sink',
    );
  const payments = await configurePayments(env, logger);
  const app = createApp({
    database,
    auth,
    logger,
    mailer,
    storage,
    mailbox: showMailbox ? mailbox : undefined,
    mailboxKind: demo ? 'demo' : 'development',
    payments: payments.payments,
    appUrl: baseURL,
    reauth: { withinMinutes: env.REAUTH_MINUTES, paymentAboveCents: env.REAUTH_PAYMENT_ABOVE_CENTS },
    ...(env.PAYMENT_FEE_RATES ? { feeRates: JSON.parse(env.PAYMENT_FEE_RATES) as FeeRates } : {}),
    clientDir: path.join(ROOT, 'dist'),
    uploads: {
      projectQuotaBytes: env.PROJECT_STORAGE_QUOTA_BYTES,
      requestMaxBytes: env.UPLOAD_REQUEST_MAX_BYTES,
      tempDir: path.join(layout.root, 'upload-temp'),
    },
    outboxPollMs: env.OUTBOX_POLL_SECONDS * 1000,
    outboxLeaseSeconds: env.OUTBOX_LEASE_SECONDS,
    trustProxy: env.TRUST_PROXY,
  });
  const server = createServer(app);
  server.listen(env.PORT, env.HOST, () => {
    logger.info({ url: baseURL, database: database.kind }, `Tallyard is listening on ${baseURL}`);
    // The demo's sign-ins, so a first start says where to go and who to be (same pino line format as the rest).
    if (demo) {
      const emails = DEMO_PEOPLE.map((p) => p.email);
      logger.info(
        { url: baseURL, signIns: emails },
        `Open ${baseURL} and sign in as ${emails.join(', ')} (password ${DEMO_PASSWORD})`,
      );
    }
  });

  let closing = false;
  const shutdown = async (signal: string) => {
    if (closing) return;
    closing = true;
    logger.info({ signal }, 'shutting down');
    server.close();
    server.closeAllConnections();
    (app.locals.stopOutbox as (() => void) | undefined)?.();
    await mailbox?.close();
    await payments.close();
    await database.close();
    await unlock();
    process.exit(0);
  };
  process.on('SIGTERM', () => void shutdown('SIGTERM'));
  process.on('SIGINT', () => void shutdown('SIGINT'));
}
