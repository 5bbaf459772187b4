import { eq } from 'drizzle-orm';
import { fromNodeHeaders } from 'better-auth/node';
import type { RequestHandler, Response } from 'express';
import { SESSION_ABSOLUTE_SECONDS, type Auth } from '../auth';
import type { Db } from '../db/client';
import { companies, companyMembers, session } from '../db/schema';
import type { Actor } from '../lib/actor';
import { AppError, unauthorized } from '../lib/app-error';

/** The session behind the request's actor: when it began (a password sign-in), for requireRecentAuth. */
export type SessionInfo = { id: string; createdAt: Date };

export function getSessionInfo(res: Response): SessionInfo {
  const info = res.locals.session as SessionInfo | undefined;
  if (!info) throw unauthorized();
  return info;
}

/** Resolves the session cookie to an Actor (401 without one) before any route of the API runs. */
export function requireActor(auth: Auth, db: Db): RequestHandler {
  return async (req, res, next) => {
    const found = await auth.api.getSession({ headers: fromNodeHeaders(req.headers) });
    if (!found) throw unauthorized();
    const createdAt = new Date(found.session.createdAt);
    if (Date.now() - createdAt.getTime() > SESSION_ABSOLUTE_SECONDS * 1000) {
      // Absolute lifetime (OWASP ASVS 4.0.3 3.3.2): however active, a session ends 12 hours after sign-in.
      await db.delete(session).where(eq(session.id, found.session.id));
      throw new AppError(401, 'SESSION_EXPIRED', 'Your session has ended after 12 hours. Sign in again.');
    }
    const [membership] = await db
      .select({ companyId: companies.id, kind: companies.kind, name: companies.name, isAdmin: companyMembers.isAdmin })
      .from(companyMembers)
      .innerJoin(companies, eq(companies.id, companyMembers.companyId))
      .where(eq(companyMembers.userId, found.user.id))
      .limit(1);
    const actor: Actor = {
      userId: found.user.id,
      name: found.user.name,
      email: found.user.email,
      companyId: membership?.companyId ?? null,
      companyKind: membership?.kind ?? null,
      companyName: membership?.name ?? null,
      isAdmin: membership?.isAdmin ?? false,
    };
    res.locals.actor = actor;
    res.locals.session = { id: found.session.id, createdAt } satisfies SessionInfo;
    next();
  };
}
