import { eq, sql } from 'drizzle-orm';
import type { Response } from 'express';
import type { CompanyKind } from '../../src/shared/constants';
import type { Db } from '../db/client';
import { companies, companyMembers, session, user } from '../db/schema';
import { unauthorized } from './app-error';

/** The signed-in person a request acts for. */
export type Actor = {
  userId: string;
  name: string;
  email: string;
  companyId: string | null;
  companyKind: CompanyKind | null;
  companyName: string | null;
  isAdmin: boolean;
};

export function getActor(res: Response): Actor {
  const actor = res.locals.actor as Actor | undefined;
  if (!actor) throw unauthorized();
  return actor;
}

/** A company membership; every field is null when the person has none (a left join). */
type Membership = { companyId: string | null; kind: CompanyKind | null; name: string | null; isAdmin: boolean | null } | null | undefined;

export function actorOf(person: { id: string; name: string; email: string }, membership: Membership): Actor {
  return {
    userId: person.id,
    name: person.name,
    email: person.email,
    companyId: membership?.companyId ?? null,
    companyKind: membership?.kind ?? null,
    companyName: membership?.name ?? null,
    isAdmin: membership?.isAdmin ?? false,
  };
}

/**
 * Prepared reads behind requireActor: the person's company membership, and the whole actor (session row, person
 * and membership) from a session token in one statement.
 */
export function actorQueries(db: Db) {
  const membership = db
    .select({ companyId: companies.id, kind: companies.kind, name: companies.name, isAdmin: companyMembers.isAdmin })
    .from(companyMembers)
    .innerJoin(companies, eq(companies.id, companyMembers.companyId))
    .where(eq(companyMembers.userId, sql.placeholder('userId')))
    .limit(1)
    .prepare('actor_membership');
  const bySessionToken = db
    .select({
      session: { id: session.id, expiresAt: session.expiresAt, createdAt: session.createdAt },
      person: { id: user.id, name: user.name, email: user.email },
      membership: { companyId: companies.id, kind: companies.kind, name: companies.name, isAdmin: companyMembers.isAdmin },
    })
    .from(session)
    .innerJoin(user, eq(user.id, session.userId))
    .leftJoin(companyMembers, eq(companyMembers.userId, user.id))
    .leftJoin(companies, eq(companies.id, companyMembers.companyId))
    .where(eq(session.token, sql.placeholder('token')))
    .limit(1)
    .prepare('actor_by_session_token');
  return {
    membership: async (userId: string) => (await membership.execute({ userId }))[0],
    bySessionToken: async (token: string) => (await bySessionToken.execute({ token }))[0],
  };
}
