import { and, eq, lt } from 'drizzle-orm';
import { parseCookies } from 'better-auth/cookies';
import type { RequestHandler } from 'express';
import { SESSION_ABSOLUTE_SECONDS, type Auth } from '../auth';
import type { Db } from '../db/client';
import { session } from '../db/schema';

/**
 * The 12-hour absolute session limit on better-auth's own routes (get-session, update-user, change-password...),
 * which requireActor does not see: before better-auth reads the cookie, a session older than the limit is deleted,
 * so better-auth finds none (OWASP ASVS 4.0.3 3.3.2). The cookie is `token.signature`; only the token is looked up,
 * and only a session past the limit is touched, so a forged signature gains nothing.
 */
export function endAgedSessions(auth: Auth, db: Db): RequestHandler {
  const cookieName = auth.$context.then((c) => c.authCookies.sessionToken.name);
  return async (req, _res, next) => {
    const header = req.headers.cookie;
    if (!header) return next();
    const value = parseCookies(header).get(await cookieName);
    if (!value) return next();
    let token: string;
    try {
      token = decodeURIComponent(value).split('.')[0]!;
    } catch {
      return next();
    }
    const cutoff = new Date(Date.now() - SESSION_ABSOLUTE_SECONDS * 1000);
    await db.delete(session).where(and(eq(session.token, token), lt(session.createdAt, cutoff)));
    next();
  };
}
