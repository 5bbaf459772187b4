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
  SMTP_URL: z.string().regex(/^smtps?:\/\//, 'must start with smtp:// or smtps://').optional(),
  MAIL_FROM: z.string().default('Tallyard <no-reply@tallyard.test>'),
  STRIPE_SECRET_KEY: z.string().optional(),
  STRIPE_WEBHOOK_SECRET: z.string().optional(),
  STRIPE_PUBLISHABLE_KEY: z.string().optional(),
  REAUTH_MINUTES: z.coerce.number().int().min(1).max(1440).default(10),
  REAUTH_PAYMENT_ABOVE_CENTS: z.coerce.number().int().min(0).default(1_000_000),
  /** The Mailbox page (every caught message, to any signed-in person): `auto` shows it outside production. */
  MAILBOX: z.enum(['auto', 'on', 'off']).default('auto'),
  SEED_DEMO: z.enum(['auto', 'always', 'never']).default('auto'),
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
