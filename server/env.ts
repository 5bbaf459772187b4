import { z } from 'zod';

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65_535).default(3000),
  HOST: z.string().default('0.0.0.0'),
  DATA_DIR: z.string().min(1).default('./data'),
  DATABASE_URL: z
    .string()
    .regex(/^postgres(ql)?:\/\//, 'must start with postgres:// or postgresql://')
    .optional(),
  BETTER_AUTH_SECRET: z.string().min(32, 'must be at least 32 characters').optional(),
  APP_URL: z.url().optional(),
  SMTP_URL: z
    .string()
    .regex(/^smtps?:\/\//, 'must start with smtp:// or smtps://')
    .optional(),
  MAIL_FROM: z.string().default('Tallyard <no-reply@tallyard.test>'),
  /** Uploads in this S3-compatible bucket instead of DATA_DIR/uploads (several app servers share it). */
  S3_BUCKET: z.string().min(3).max(63).optional(),
  /** An S3-compatible endpoint (MinIO and the like); AWS itself when unset. Credentials: AWS_ACCESS_KEY_ID etc. */
  S3_ENDPOINT: z.url().optional(),
  S3_REGION: z.string().default('us-east-1'),
  /** The proxies whose X-Forwarded-For is believed (Express 'trust proxy': names, addresses or CIDRs, comma-separated). */
  TRUST_PROXY: z.string().min(1).default('loopback'),
  /** Path-style addresses (endpoint/bucket/key): on by default with S3_ENDPOINT, as most compatible stores need. */
  S3_FORCE_PATH_STYLE: z.enum(['true', 'false']).optional(),
  STRIPE_SECRET_KEY: z.string().optional(),
  STRIPE_WEBHOOK_SECRET: z.string().optional(),
  STRIPE_PUBLISHABLE_KEY: z.string().optional(),
  /**
   * Development and tests only (refused in production): the Stripe SDK talks to this server instead of api.stripe.com,
   * such as one local stand-in (`npx tsx stripe-standin/src/cli.ts`) shared by several app servers.
   */
  STRIPE_API_URL: z.url().optional(),
  REAUTH_MINUTES: z.coerce.number().int().min(1).max(1440).default(10),
  /** How often each server looks for due mail (retries, mail another server queued, a dead server's leases). */
  OUTBOX_POLL_SECONDS: z.coerce.number().int().min(1).max(3600).default(10),
  /** How long a server keeps mail it claimed before another server may send it (a server that died mid-send). */
  OUTBOX_LEASE_SECONDS: z.coerce.number().int().min(1).max(3600).default(120),
  REAUTH_PAYMENT_ABOVE_CENTS: z.coerce.number().int().min(0).default(1_000_000),
  /**
   * The processor's fee rates as JSON (`{"card":{"percentBps":290,"fixedCents":30},"us_bank_account":{"percentBps":80,
   * "capCents":500}}`), for an account whose pricing differs from the defaults in src/shared/domain/payment-fees.ts.
   */
  PAYMENT_FEE_RATES: z.string().optional(),
  /**
   * The demo `npm start` runs on the embedded database (`npm start` sets it unless DATABASE_URL or SMTP_URL is
   * given): mail stays in the local sink (a labelled demo Mailbox), payments go to the local Stripe stand-in.
   */
  TALLYARD_DEMO: z.enum(['on', 'off']).default('off'),
  SEED_DEMO: z.enum(['auto', 'always', 'never']).default('auto'),
  /** Stored files per project (evidence), in bytes; 5 GiB unless set. */
  PROJECT_STORAGE_QUOTA_BYTES: z.coerce
    .number()
    .int()
    .min(1)
    .default(5 * 1024 * 1024 * 1024),
  /** All files of one upload request together, in bytes. */
  UPLOAD_REQUEST_MAX_BYTES: z.coerce
    .number()
    .int()
    .min(1)
    .default(100 * 1024 * 1024),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
});

export type Env = z.infer<typeof envSchema>;

/** Parses process.env once at boot; a bad value stops the process with a readable list. */
export function loadEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const cleaned = Object.fromEntries(Object.entries(source).filter(([, v]) => v !== ''));
  const parsed = envSchema.safeParse(cleaned);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  - ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Tallyard cannot start: the configuration has problems:\n${lines.join('\n')}`);
  }
  return parsed.data;
}

/** What production needs to be a real deployment, and why; listed together when missing. */
const PRODUCTION_NEEDS: [keyof Env, string][] = [
  ['APP_URL', 'the public https address people open (links in e-mails, the trusted origin, Secure cookies)'],
  ['SMTP_URL', 'the mail server for invitations and password reset links (without it nobody receives them)'],
  ['STRIPE_SECRET_KEY', "Stripe's secret key (the local Stripe stand-in moves no money and runs only in the demo)"],
  ['STRIPE_WEBHOOK_SECRET', "the signing secret of Stripe's webhook to /api/webhooks/stripe"],
];

/** True for the embedded-database demo `npm start` runs (mailbox, stand-in and no APP_URL allowed). */
export const isDemo = (env: Env) => env.TALLYARD_DEMO === 'on' && !env.DATABASE_URL;

/**
 * Refuses to start a production server that is not set up as a real deployment: every missing setting is
 * listed with what it is for. The demo (`npm start` on the embedded database) is exempt.
 */
export function assertDeployable(env: Env): void {
  if (env.TALLYARD_DEMO === 'on' && env.DATABASE_URL) {
    throw new Error(
      'Tallyard cannot start: TALLYARD_DEMO=on runs only on the embedded database; unset it (or DATABASE_URL).',
    );
  }
  if (env.NODE_ENV !== 'production' || isDemo(env)) return;
  const missing = PRODUCTION_NEEDS.filter(([key]) => !env[key]);
  if (missing.length === 0) return;
  const lines = missing.map(([key, why]) => `  - ${key}: ${why}`);
  throw new Error(
    `Tallyard cannot start in production: these settings are missing:\n${lines.join('\n')}\n` +
      'Set them (see README, "Configuration"), or run the demo with `npm start` on the embedded database.',
  );
}
