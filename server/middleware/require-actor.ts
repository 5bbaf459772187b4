import { eq } from 'drizzle-orm';
import { parseCookies } from 'better-auth/cookies';
import { fromNodeHeaders } from 'better-auth/node';
import type { Request, RequestHandler, Response } from 'express';
import { SESSION_ABSOLUTE_SECONDS, type Auth } from '../auth';
import type { Db } from '../db/client';
import { session } from '../db/schema';
import { actorOf, actorQueries, type Actor } from '../lib/actor';
import { AppError, unauthorized } from '../lib/app-error';

/** The session behind the request's actor: when it began (a password sign-in), for requireRecentAuth. */
export type SessionInfo = { id: string; createdAt: Date };

export function getSessionInfo(res: Response): SessionInfo {
  const info = res.locals.session as SessionInfo | undefined;
  if (!info) throw unauthorized();
  return info;
}

/** How many verified session cookies requireActor remembers (the oldest is dropped first). */
export const VERIFIED_COOKIES_MAX = 10_000;

/**
 * Signed session cookie values that better-auth's getSession has verified, each with its session token. A hit
 * proves only that the signature was checked before (the value is the same string): the session row itself is
 * read again on every request, so a revoked, expired or aged session ends on its next request.
 */
export class VerifiedCookies {
  private readonly tokens = new Map<string, string>();
  constructor(private readonly max = VERIFIED_COOKIES_MAX) {}
  get(cookie: string): string | undefined {
    return this.tokens.get(cookie);
  }
  add(cookie: string, token: string): void {
    this.tokens.delete(cookie);
    this.tokens.set(cookie, token);
    if (this.tokens.size > this.max) this.tokens.delete(this.tokens.keys().next().value!);
  }
  forget(cookie: string): void {
    this.tokens.delete(cookie);
  }
  get size(): number {
    return this.tokens.size;
  }
}

/** The session cookie's name and better-auth's session timing (expiresIn, updateAge, in seconds). */
export function sessionSettings(auth: Auth) {
  return auth.$context.then((c) => ({ cookieName: c.authCookies.sessionToken.name, ...c.sessionConfig }));
}

/** The signed session cookie's value, as sent. */
export function sessionCookieOf(req: Request, settings: { cookieName: string }): string | undefined {
  const header = req.headers.cookie;
  return header ? parseCookies(header).get(settings.cookieName) : undefined;
}

/**
 * Whether a session row read by token serves the short path: not expired and not due for better-auth's refresh
 * (its own rule: a session used `updateAge` after its last expiry was set is due for a new one). Otherwise the
 * request goes through better-auth.
 */
export function sessionRowIsCurrent(
  row: { expiresAt: Date },
  { expiresIn, updateAge }: { expiresIn: number; updateAge: number },
  now = Date.now(),
): boolean {
  const expiresAt = row.expiresAt.getTime();
  return expiresAt > now && expiresAt - expiresIn * 1000 + updateAge * 1000 > now;
}

/** Absolute lifetime (OWASP ASVS 4.0.3 3.3.2): however active, a session ends 12 hours after sign-in. */
export const isPastAbsoluteLifetime = (session: { createdAt: Date }, now = Date.now()) =>
  now - session.createdAt.getTime() > SESSION_ABSOLUTE_SECONDS * 1000;

type SessionRow = NonNullable<Awaited<ReturnType<ReturnType<typeof actorQueries>['bySessionToken']>>>;

export const actorOfRow = (row: Pick<SessionRow, 'person' | 'membership' | 'session'>) => ({
  actor: actorOf(row.person, row.membership),
  session: { id: row.session.id, createdAt: row.session.createdAt } satisfies SessionInfo,
});

/**
 * Resolves the session cookie to an Actor (401 without one) before any route of the API runs.
 *
 * The first request with a cookie goes through better-auth's getSession (signature, expiry, refresh), then the
 * person's company membership. Later requests with the same signed cookie read the session row, the person and
 * the membership in one prepared statement; better-auth is asked again whenever that row is gone, expired or due
 * for its refresh, so sign-out, revocation, the idle timeout and a membership change take effect on the very
 * next request (there is no cached state to go stale, only the fact that the signature was checked).
 */
export function requireActor(auth: Auth, db: Db, verified = new VerifiedCookies()): RequestHandler {
  const queries = actorQueries(db);
  const settings = sessionSettings(auth);

  async function throughBetterAuth(req: Request, res: Response, cookie: string | undefined) {
    const { headers, response: found } = await auth.api.getSession({
      headers: fromNodeHeaders(req.headers),
      returnHeaders: true,
    });
    // A refresh sends the cookie again with a new Max-Age: pass it on, or the browser drops the session early.
    const setCookies = headers.getSetCookie();
    if (setCookies.length > 0) res.append('Set-Cookie', setCookies);
    if (!found) {
      if (cookie) verified.forget(cookie);
      return undefined;
    }
    if (cookie) verified.add(cookie, found.session.token);
    const membership = await queries.membership(found.user.id);
    return {
      actor: actorOf(found.user, membership),
      session: { id: found.session.id, createdAt: new Date(found.session.createdAt) },
    };
  }

  async function fromRow(token: string) {
    const row = await queries.bySessionToken(token);
    return row && sessionRowIsCurrent(row.session, await settings) ? actorOfRow(row) : undefined;
  }

  return async (req, res, next) => {
    const cookie = sessionCookieOf(req, await settings);
    const token = cookie ? verified.get(cookie) : undefined;
    const found = (token ? await fromRow(token) : undefined) ?? (await throughBetterAuth(req, res, cookie));
    if (!found) throw unauthorized();
    if (isPastAbsoluteLifetime(found.session)) {
      await db.delete(session).where(eq(session.id, found.session.id));
      if (cookie) verified.forget(cookie);
      throw new AppError(401, 'SESSION_EXPIRED', 'Your session has ended after 12 hours. Sign in again.');
    }
    res.locals.actor = found.actor satisfies Actor;
    res.locals.session = found.session satisfies SessionInfo;
    next();
  };
}
