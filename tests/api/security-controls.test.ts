import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { session } from '../../server/db/schema';
import { makeUser, makeWorld } from '../setup/factories';
import { createTestApp, signedInAgent, TEST_ORIGIN, TEST_PASSWORD, type TestApp } from '../setup/test-app';

let t: TestApp;
let world: Awaited<ReturnType<typeof makeWorld>>;
beforeAll(async () => {
  t = await createTestApp();
  world = await makeWorld(t.database.db, t.auth);
});
afterAll(() => t.close());

const newProject = () => ({
  name: 'Csrf check',
  subcontractorCompanyId: world.companies.sub.id,
  ownerCompanyId: world.companies.owner.id,
});

async function sessionCookie(email: string): Promise<string> {
  const res = await request(t.app)
    .post('/api/auth/sign-in/email')
    .set('Origin', TEST_ORIGIN)
    .send({ email, password: TEST_PASSWORD });
  expect(res.status).toBe(200);
  return (res.headers['set-cookie'] as unknown as string[]).map((c) => c.split(';')[0]).join('; ');
}

describe('security headers', () => {
  it('sends a CSP that allows only our origin, with form posts also to Stripe checkout (ASVS 4.0.3 14.4.3)', async () => {
    const res = await request(t.app).get('/api/health');
    const csp = res.headers['content-security-policy'] as string;
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("script-src 'self'");
    expect(csp).toContain("frame-ancestors 'none'");
    // Frames only of our own blobs (an evidence PDF read in the page), never another site.
    expect(csp).toContain('frame-src blob:');
    expect(csp).toMatch(/form-action 'self' https:\/\/checkout\.stripe\.com/);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
  });
});

describe('CSRF protection on the app routes (ASVS 4.0.3 4.2.2; OWASP CSRF cheat sheet, origin and fetch metadata)', () => {
  it('accepts a signed-in POST from our own origin', async () => {
    const gc = await signedInAgent(t.app, world.people.general_contractor.email);
    expect((await gc.post('/api/projects').send(newProject())).status).toBe(201);
  });

  it('refuses a POST with the session cookie from another origin with 403 CSRF_REJECTED', async () => {
    const cookie = await sessionCookie(world.people.general_contractor.email);
    const res = await request(t.app)
      .post('/api/projects')
      .set('Cookie', cookie)
      .set('Origin', 'https://evil.example')
      .send(newProject());
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('CSRF_REJECTED');
    expect(res.body.error.message).toMatch(/another site/);
  });

  it('refuses a DELETE with the cookie but no Origin or Referer, and a cross-site fetch-metadata request', async () => {
    const cookie = await sessionCookie(world.people.general_contractor.email);
    const bare = await request(t.app).patch(`/api/projects/${world.home.id}`).set('Cookie', cookie).send({ name: 'x' });
    expect(bare.status).toBe(403);
    expect(bare.body.error.code).toBe('CSRF_REJECTED');
    const cross = await request(t.app)
      .post('/api/projects')
      .set('Cookie', cookie)
      .set('Sec-Fetch-Site', 'cross-site')
      .set('Origin', 'null')
      .send(newProject());
    expect(cross.status).toBe(403);
  });

  it('lets GET through without an Origin, and a same-origin fetch-metadata POST', async () => {
    const cookie = await sessionCookie(world.people.general_contractor.email);
    expect((await request(t.app).get('/api/projects').set('Cookie', cookie)).status).toBe(200);
    const same = await request(t.app)
      .post('/api/projects')
      .set('Cookie', cookie)
      .set('Sec-Fetch-Site', 'same-origin')
      .send(newProject());
    expect(same.status).toBe(201);
  });

  it('refuses accepting an invitation from another site, before any session exists', async () => {
    const res = await request(t.app)
      .post('/api/invitations/some-token/accept')
      .set('Origin', 'https://evil.example')
      .send({ name: 'X', password: 'gravel-and-loam-2026' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('CSRF_REJECTED');
  });

  it('answers 401 first for a mutating request with neither cookie nor Origin', async () => {
    const res = await request(t.app).post('/api/projects').send(newProject());
    expect(res.status).toBe(401);
  });
});

describe('passwords (ASVS 4.0.3 2.1.1 length, 2.1.7 breached and common passwords)', () => {
  // Public sign-up is off: a new password is chosen by changing it (here), on reset, or accepting an invitation.
  let email: string;
  beforeAll(async () => {
    ({ email } = await makeUser(t.database.db, t.auth, world.companies.sub.id));
  });
  const changeTo = async (newPassword: string) =>
    (await signedInAgent(t.app, email))
      .post('/api/auth/change-password')
      .send({ currentPassword: TEST_PASSWORD, newPassword });

  it('refuses a password shorter than 12 characters', async () => {
    const res = await changeTo('short-pw-11');
    expect(res.status).toBe(400);
  });

  it('refuses a common password of 12 or more characters with a clear message', async () => {
    for (const pw of ['password1234', 'QWERTYUIOPAS', 'aaaaaaaaaaaaaa']) {
      const res = await changeTo(pw);
      expect(res.status).toBe(400);
      expect(res.body.code).toBe('PASSWORD_NOT_ALLOWED');
      expect(res.body.message).toMatch(/common passwords/);
    }
  });

  it('accepts a long uncommon password', async () => {
    expect((await changeTo('gravel-basin-quarry-71')).status).toBe(200);
  });
});

describe('session cookie and lifetimes (ASVS 4.0.3 3.4.1-3.4.3, 3.3.2)', () => {
  it('sets the session cookie HttpOnly and SameSite=Lax', async () => {
    const res = await request(t.app)
      .post('/api/auth/sign-in/email')
      .set('Origin', TEST_ORIGIN)
      .send({ email: world.people.owner.email, password: TEST_PASSWORD });
    const cookie = (res.headers['set-cookie'] as unknown as string[]).find((c) => c.includes('session_token'))!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
  });

  it('ends a session 12 hours after sign-in however active it is: 401 SESSION_EXPIRED', async () => {
    const agent = await signedInAgent(t.app, world.people.owner.email);
    const db = t.database.db;
    const mine = await db.select().from(session).where(eq(session.userId, world.people.owner.id));
    const thirteenHoursAgo = new Date(Date.now() - 13 * 3600_000);
    for (const s of mine) await db.update(session).set({ createdAt: thirteenHoursAgo }).where(eq(session.id, s.id));
    const res = await agent.get('/api/projects');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('SESSION_EXPIRED');
    expect((await agent.get('/api/projects')).status).toBe(401);
  });

  it('ends an idle session once its expiry passes', async () => {
    const agent = await signedInAgent(t.app, world.people.subcontractor.email);
    const db = t.database.db;
    await db
      .update(session)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(session.userId, world.people.subcontractor.id));
    expect((await agent.get('/api/projects')).status).toBe(401);
  });
});
