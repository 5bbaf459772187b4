import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SESSION_IDLE_SECONDS, SESSION_REFRESH_SECONDS } from '../../server/auth';
import { companyMembers, session, user } from '../../server/db/schema';
import { VerifiedCookies } from '../../server/middleware/require-actor';
import { makeCompany, makeUser } from '../setup/factories';
import { createTestApp, TEST_ORIGIN, TEST_PASSWORD, type TestApp } from '../setup/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

async function signIn(email: string): Promise<string> {
  const res = await request(t.app)
    .post('/api/auth/sign-in/email')
    .set('Origin', TEST_ORIGIN)
    .send({ email, password: TEST_PASSWORD });
  expect(res.status).toBe(200);
  return (res.headers['set-cookie'] as unknown as string[]).map((c) => c.split(';')[0]).join('; ');
}

/** The session token inside the signed cookie (`token.signature`). */
const tokenOf = (cookie: string) =>
  decodeURIComponent(
    cookie
      .split('; ')
      .find((c) => c.includes('session_token'))!
      .split('=')[1]!,
  ).split('.')[0]!;

const me = (cookie: string) => request(t.app).get('/api/me').set('Cookie', cookie);

/** A person of a new company, signed in, whose cookie has already been seen (so the next request takes the short path). */
async function seenPerson(opts: { isAdmin?: boolean } = {}) {
  const company = await makeCompany(t.database.db, 'subcontractor');
  const person = await makeUser(t.database.db, t.auth, company.id, opts);
  const cookie = await signIn(person.email);
  expect((await me(cookie)).status).toBe(200);
  return { ...person, company, cookie };
}

// OWASP ASVS 4.0.3 3.3.1 (logout and expiry invalidate the session) and 3.3.2 (idle and absolute timeouts): each
// change below must hold on the very next request, with no window, even for a cookie requireActor has seen before.
describe('requireActor: a remembered cookie never outlives its session', () => {
  it('answers 401 to the same cookie right after sign-out', async () => {
    const p = await seenPerson();
    expect(
      (await request(t.app).post('/api/auth/sign-out').set('Origin', TEST_ORIGIN).set('Cookie', p.cookie)).status,
    ).toBe(200);
    expect((await me(p.cookie)).status).toBe(401);
  });

  it('answers 401 once the session row is revoked (deleted) elsewhere', async () => {
    const p = await seenPerson();
    await t.database.db.delete(session).where(eq(session.userId, p.id));
    expect((await me(p.cookie)).status).toBe(401);
  });

  it('answers 401 once the session is past its idle expiry', async () => {
    const p = await seenPerson();
    await t.database.db
      .update(session)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(session.userId, p.id));
    expect((await me(p.cookie)).status).toBe(401);
  });

  it('answers 401 when the person is deleted', async () => {
    const p = await seenPerson();
    await t.database.db.delete(user).where(eq(user.id, p.id));
    expect((await me(p.cookie)).status).toBe(401);
  });

  it('sees a change of company membership and admin flag on the next request', async () => {
    const p = await seenPerson();
    expect((await me(p.cookie)).body).toMatchObject({ company: { id: p.company.id }, isAdmin: false });
    await t.database.db.update(companyMembers).set({ isAdmin: true }).where(eq(companyMembers.userId, p.id));
    expect((await me(p.cookie)).body).toMatchObject({ company: { id: p.company.id }, isAdmin: true });
    await t.database.db.delete(companyMembers).where(eq(companyMembers.userId, p.id));
    expect((await me(p.cookie)).body).toMatchObject({ company: null, isAdmin: false });
  });

  it('refuses a cookie whose signature was altered, even when its token is a live session', async () => {
    const p = await seenPerson();
    const name = p.cookie
      .split('; ')
      .find((c) => c.includes('session_token'))!
      .split('=')[0]!;
    const forged = `${name}=${encodeURIComponent(`${tokenOf(p.cookie)}.AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA=`)}`;
    expect((await me(forged)).status).toBe(401);
    expect((await me(p.cookie)).status).toBe(200);
  });
});

describe('requireActor: session refresh', () => {
  it('renews the session and sends the cookie again once it is due (after the refresh age)', async () => {
    const p = await seenPerson();
    const dueAt = new Date(Date.now() + (SESSION_IDLE_SECONDS - SESSION_REFRESH_SECONDS - 5) * 1000);
    await t.database.db
      .update(session)
      .set({ expiresAt: dueAt })
      .where(eq(session.token, tokenOf(p.cookie)));
    const res = await me(p.cookie);
    expect(res.status).toBe(200);
    const setCookie = (res.headers['set-cookie'] as unknown as string[] | undefined) ?? [];
    expect(setCookie.some((c) => c.includes('session_token') && /Max-Age=\d+/i.test(c))).toBe(true);
    const [row] = await t.database.db
      .select({ expiresAt: session.expiresAt })
      .from(session)
      .where(eq(session.token, tokenOf(p.cookie)));
    expect(row!.expiresAt.getTime()).toBeGreaterThan(dueAt.getTime() + 60_000);
  });

  it('does not write the session on a request that is not due', async () => {
    const p = await seenPerson();
    const mine = eq(session.token, tokenOf(p.cookie));
    const [before] = await t.database.db.select({ updatedAt: session.updatedAt }).from(session).where(mine);
    const res = await me(p.cookie);
    expect(res.headers['set-cookie']).toBeUndefined();
    const [after] = await t.database.db.select({ updatedAt: session.updatedAt }).from(session).where(mine);
    expect(after!.updatedAt).toEqual(before!.updatedAt);
  });
});

describe('VerifiedCookies', () => {
  it('keeps at most its limit, dropping the oldest first', () => {
    const cookies = new VerifiedCookies(2);
    cookies.add('a', '1');
    cookies.add('b', '2');
    cookies.add('c', '3');
    expect([cookies.get('a'), cookies.get('b'), cookies.get('c'), cookies.size]).toEqual([undefined, '2', '3', 2]);
  });
});

// GET /api/session answers whether the browser is signed in without a failed request (the sign-in page and a
// signed-out visit log no 401); it must follow the same rules as requireActor, since the client trusts its answer.
describe('GET /api/session', () => {
  const session = (cookie?: string) => {
    const req = request(t.app).get('/api/session');
    return cookie ? req.set('Cookie', cookie) : req;
  };

  it('answers signed out, never 401, without a cookie or with a forged one', async () => {
    for (const res of [await session(), await session('better-auth.session_token=forged.sig')]) {
      expect(res.status).toBe(200);
      expect(res.body).toEqual({ signedIn: false });
      expect(res.headers['cache-control']).toContain('no-store');
    }
  });

  it('carries the same view as GET /api/me when signed in, and signed out after sign-out', async () => {
    const p = await seenPerson();
    const res = await session(p.cookie);
    expect(res.body).toEqual({ signedIn: true, me: (await me(p.cookie)).body });
    await request(t.app).post('/api/auth/sign-out').set('Origin', TEST_ORIGIN).set('Cookie', p.cookie).expect(200);
    expect((await session(p.cookie)).body).toEqual({ signedIn: false });
  });
});
