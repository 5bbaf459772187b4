import { betterAuth } from 'better-auth';
import { drizzleAdapter } from 'better-auth/adapters/drizzle';
import type { Db } from './db/client';
import { account, rateLimit, session, user, verification } from './db/schema';
import { afterAuthHook, beforeAuthHook, CLIENT_IP_HEADER } from './lib/auth-hooks';
import { authLogger } from './lib/auth-logger';
import type { Logger } from './lib/logger';
import { MAX_PASSWORD_LENGTH, MIN_PASSWORD_LENGTH } from './lib/password-policy';
import { createSignInGuard, type SignInGuard } from './lib/sign-in-guard';
import { enqueueEmail } from './modules/notifications/outbox';
import { passwordResetMail, RESET_LINK_MINUTES } from './modules/accounts/password-reset-email';

export { MIN_PASSWORD_LENGTH } from './lib/password-policy';
export { CLIENT_IP_HEADER } from './lib/auth-hooks';

/**
 * Session lifetimes (OWASP ASVS 4.0.3 3.3.2, level 2: re-authenticate after 30 minutes idle or 12 hours).
 * A session expires SESSION_IDLE_SECONDS after it was last refreshed; it is refreshed when used and older than
 * SESSION_REFRESH_SECONDS, so the idle timeout is between 25 and 30 minutes. requireActor ends any session older
 * than SESSION_ABSOLUTE_SECONDS however active it is.
 */
export const SESSION_IDLE_SECONDS = 30 * 60;
export const SESSION_REFRESH_SECONDS = 5 * 60;
export const SESSION_ABSOLUTE_SECONDS = 12 * 60 * 60;

export type AuthOptions = {
  db: Db;
  secret: string;
  baseURL: string;
  trustedOrigins: string[];
  /** Secure cookies (and the __Secure- prefix): on whenever the app's address is https. */
  secureCookies: boolean;
  /** better-auth's own log lines go through this (pino, with its redaction); silent when absent. */
  logger?: Logger;
  /** better-auth's per-IP rate limit; on unless NODE_ENV is test (the API tests sign in many times a second). */
  rateLimit?: boolean;
  signInGuard?: SignInGuard;
  /**
   * Replaces better-auth's scrypt hashing. Only the test suite passes one (a fast hash), so the hundreds of
   * sign-ups and sign-ins in the API tests don't spend minutes in scrypt; production always uses scrypt.
   */
  passwordHasher?: {
    hash: (password: string) => Promise<string>;
    verify: (data: { hash: string; password: string }) => Promise<boolean>;
  };
};

export function createAuth({ db, secret, baseURL, trustedOrigins, secureCookies, ...opts }: AuthOptions) {
  const signInGuard = opts.signInGuard ?? createSignInGuard(db);
  return betterAuth({
    appName: 'Tallyard',
    secret,
    baseURL,
    basePath: '/api/auth',
    trustedOrigins,
    database: drizzleAdapter(db, { provider: 'pg', schema: { user, session, account, verification, rateLimit } }),
    emailAndPassword: {
      enabled: true,
      minPasswordLength: MIN_PASSWORD_LENGTH,
      maxPasswordLength: MAX_PASSWORD_LENGTH,
      // Accounts come only from accepted invitations, `npm run admin:create` and the demo seed
      // (server/modules/accounts): nobody can register themselves, so nobody can probe which addresses exist.
      disableSignUp: true,
      autoSignIn: false,
      // The reset link goes out through the outbox (app.ts flushes it after the answer) to our own page.
      resetPasswordTokenExpiresIn: RESET_LINK_MINUTES * 60,
      revokeSessionsOnPasswordReset: true,
      sendResetPassword: async ({ user, token }) => {
        await enqueueEmail(db, passwordResetMail({ email: user.email, name: user.name, token, appUrl: baseURL }));
      },
      ...(opts.passwordHasher ? { password: opts.passwordHasher } : {}),
    },
    session: {
      expiresIn: SESSION_IDLE_SECONDS,
      updateAge: SESSION_REFRESH_SECONDS,
      freshAge: 10 * 60,
    },
    rateLimit: {
      enabled: opts.rateLimit ?? process.env.NODE_ENV !== 'test',
      // Counted in the database (table rate_limit), so every app server sharing it counts the same requests.
      storage: 'database',
      window: 60,
      max: 100,
      customRules: {
        '/sign-in/email': { window: 60, max: 10 },
        '/request-password-reset': { window: 60, max: 5 },
        '/reset-password': { window: 60, max: 10 },
        '/change-password': { window: 60, max: 10 },
      },
    },
    hooks: { before: beforeAuthHook(signInGuard), after: afterAuthHook(signInGuard) },
    advanced: {
      useSecureCookies: secureCookies,
      defaultCookieAttributes: { httpOnly: true, sameSite: 'lax', secure: secureCookies },
      // Only the header app.ts writes from the socket address (or a proxy Express trusts), never a client's.
      ipAddress: { ipAddressHeaders: [CLIENT_IP_HEADER] },
    },
    logger: authLogger(opts.logger),
    telemetry: { enabled: false },
  });
}

export type Auth = ReturnType<typeof createAuth>;
