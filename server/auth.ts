import { betterAuth } from 'better-auth';
import { drizzleAdapter } from 'better-auth/adapters/drizzle';
import type { Db } from './db/client';
import { account, session, user, verification } from './db/schema';

export const MIN_PASSWORD_LENGTH = 12;

export type AuthOptions = {
  db: Db;
  secret: string;
  baseURL: string;
  trustedOrigins: string[];
  production: boolean;
};

export function createAuth({ db, secret, baseURL, trustedOrigins, production }: AuthOptions) {
  return betterAuth({
    appName: 'Tallyard',
    secret,
    baseURL,
    basePath: '/api/auth',
    trustedOrigins,
    database: drizzleAdapter(db, { provider: 'pg', schema: { user, session, account, verification } }),
    emailAndPassword: {
      enabled: true,
      minPasswordLength: MIN_PASSWORD_LENGTH,
      maxPasswordLength: 128,
      autoSignIn: true,
    },
    session: {
      expiresIn: 60 * 60 * 24 * 7,
      updateAge: 60 * 60 * 24,
    },
    advanced: {
      useSecureCookies: production,
      defaultCookieAttributes: { httpOnly: true, sameSite: 'lax' },
    },
    telemetry: { enabled: false },
  });
}

export type Auth = ReturnType<typeof createAuth>;
