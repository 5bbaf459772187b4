import { eq } from 'drizzle-orm';
import { fromNodeHeaders } from 'better-auth/node';
import type { RequestHandler } from 'express';
import type { Auth } from '../auth';
import type { Db } from '../db/client';
import { companies, companyMembers } from '../db/schema';
import type { Actor } from '../lib/actor';
import { unauthorized } from '../lib/app-error';

/** Resolves the session cookie to an Actor (401 without one) before any route of the API runs. */
export function requireActor(auth: Auth, db: Db): RequestHandler {
  return async (req, res, next) => {
    const found = await auth.api.getSession({ headers: fromNodeHeaders(req.headers) });
    if (!found) throw unauthorized();
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
    next();
  };
}
