import { fromNodeHeaders } from 'better-auth/node';
import type { Request, RequestHandler, Response } from 'express';
import type { Auth } from '../auth';
import { getActor } from '../lib/actor';
import { AppError } from '../lib/app-error';
import type { Db } from '../db/client';
import { createSignInGuard, type SignInGuard } from '../lib/sign-in-guard';
import { getSessionInfo } from './require-actor';

/** The body field that carries a freshly typed password; removed from the body once checked. */
export const REAUTH_FIELD = 'reauthPassword';
export const DEFAULT_REAUTH_MINUTES = 10;

export type RecentAuthOptions = {
  auth: Auth;
  /** A sign-in this many minutes old or newer counts as recent; default 10. */
  withinMinutes?: number;
  /** Whether this request needs it at all (e.g. a payment above a threshold); default always. */
  when?: (req: Request, res: Response) => boolean | Promise<boolean>;
  /** Wrong re-entered passwords back off like failed sign-ins, per person. */
  /** The database the failed re-authentications are counted in (shared by every app server). */
  db: Db;
  guard?: SignInGuard;
  now?: () => number;
};

/** A deferred re-authentication check: run it after the route's own access checks and before the change. */
export type ConfirmRecentAuth = () => Promise<void>;

/**
 * Re-authentication before a sensitive step (OWASP ASVS 4.0.3 3.7.1; OWASP API Security Top 10 2023 API2,
 * broken authentication): passes when the session's password sign-in is at most `withinMinutes` old, or when
 * the body carries `reauthPassword` and better-auth confirms it is the person's password. Otherwise 403
 * REAUTH_REQUIRED (no password given) or REAUTH_FAILED (a wrong one). Mount after requireActor.
 */
export function requireRecentAuth(options: RecentAuthOptions): RequestHandler {
  const take = recentAuthCheck(options);
  return async (req, res, next) => {
    const confirm = take(req, res);
    if (!options.when || (await options.when(req, res))) await confirm();
    next();
  };
}

/**
 * The same check for a route that knows only inside its handler (after its access checks, or after reading the
 * amount): `take(req, res)` removes the typed password from the body at once, so the body's own schema never
 * sees it, and returns the check to run later. Run it outside any database transaction: better-auth reads the
 * password through its own connection.
 */
export function recentAuthCheck(options: RecentAuthOptions): (req: Request, res: Response) => ConfirmRecentAuth {
  const { auth, withinMinutes = DEFAULT_REAUTH_MINUTES, now = Date.now } = options;
  const guard = options.guard ?? createSignInGuard(options.db, now);
  return (req, res) => {
    const body = req.body as Record<string, unknown> | undefined;
    const typed = body && typeof body === 'object' ? body[REAUTH_FIELD] : undefined;
    if (body && typeof body === 'object') delete body[REAUTH_FIELD];
    return async () => {
      const actor = getActor(res);
      if (typeof typed === 'string' && typed.length > 0) {
        const wait = await guard.retryAfter(actor.userId, req.ip ?? 'unknown');
        if (wait > 0) {
          throw new AppError(429, 'REAUTH_BACKOFF', `Too many wrong passwords. Try again in ${wait} seconds.`);
        }
        const ok = await auth.api
          .verifyPassword({ body: { password: typed }, headers: fromNodeHeaders(req.headers) })
          .then((r) => r.status === true)
          .catch(() => false);
        if (!ok) {
          await guard.recordFailure(actor.userId, req.ip ?? 'unknown');
          throw new AppError(403, 'REAUTH_FAILED', 'That password is not right. Enter your Tallyard password.', [
            { path: REAUTH_FIELD, message: 'Wrong password.' },
          ]);
        }
        await guard.recordSuccess(actor.userId, req.ip ?? 'unknown');
        return;
      }
      const age = now() - getSessionInfo(res).createdAt.getTime();
      if (age <= withinMinutes * 60_000) return;
      throw new AppError(
        403,
        'REAUTH_REQUIRED',
        `Enter your password again to confirm this step (you signed in more than ${withinMinutes} minutes ago).`,
        [{ path: REAUTH_FIELD, message: 'Password required.' }],
      );
    };
  };
}
