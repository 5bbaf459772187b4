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
  const settings = auth.$context.then((c) => ({ cookieName: c.authCookies.sessionToken.name, ...c.sessionConfig }));

  async function throughBetterAuth(req: Request, res: Response, cookie: string | undefined) {
    const { headers, response: found } = await auth.api.getSession({ headers: fromNodeHeaders(req.headers), returnHeaders: true });
    // A refresh sends the cookie again with a new Max-Age: pass it on, or the browser drops the session early.
    const setCookies = headers.getSetCookie();
    if (setCookies.length > 0) res.append('Set-Cookie', setCookies);
    if (!found) {
      if (cookie) verified.forget(cookie);
      return undefined;
    }
    if (cookie) verified.add(cookie, found.session.token);
    const membership = await queries.membership(found.user.id);
    return { actor: actorOf(found.user, membership), session: { id: found.session.id, createdAt: new Date(found.session.createdAt) } };
  }

  async function fromRow(token: string) {
    const row = await queries.bySessionToken(token);
    if (!row) return undefined;
    const { expiresIn, updateAge } = await settings;
    const expiresAt = row.session.expiresAt.getTime();
    // better-auth's own rule: a session used `updateAge` after its last expiry was set is due for a new one.
    if (expiresAt <= Date.now() || expiresAt - expiresIn * 1000 + updateAge * 1000 <= Date.now()) return undefined;
    return { actor: actorOf(row.person, row.membership), session: { id: row.session.id, createdAt: row.session.createdAt } };
  }

  return async (req, res, next) => {
    const header = req.headers.cookie;
    const cookie = header ? parseCookies(header).get((await settings).cookieName) : undefined;
    const token = cookie ? verified.get(cookie) : undefined;
    const found = (token ? await fromRow(token) : undefined) ?? (await throughBetterAuth(req, res, cookie));
    if (!found) throw unauthorized();
    if (Date.now() - found.session.createdAt.getTime() > SESSION_ABSOLUTE_SECONDS * 1000) {
      // Absolute lifetime (OWASP ASVS 4.0.3 3.3.2): however active, a session ends 12 hours after sign-in.
      await db.delete(session).where(eq(session.id, found.session.id));
      if (cookie) verified.forget(cookie);
      throw new AppError(401, 'SESSION_EXPIRED', 'Your session has ended after 12 hours. Sign in again.');
    }
    res.locals.actor = found.actor satisfies Actor;
    res.locals.session = found.session satisfies SessionInfo;
    next();
  };
}
