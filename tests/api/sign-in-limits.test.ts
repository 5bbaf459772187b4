import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { createAuth } from '../../server/auth';
import { smtpMailer } from '../../server/integrations/mailer/mailer';
import { createLogger } from '../../server/lib/logger';
import { createSignInGuard, FREE_FAILURES, MAX_FAILURES_PER_HOUR } from '../../server/lib/sign-in-guard';
import { makeCompany, makeUser } from '../setup/factories';
import { createTestApp, TEST_ORIGIN, TEST_PASSWORD, type TestApp } from '../setup/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

const signIn = (email: string, password: string, headers: Record<string, string> = {}) =>
  request(t.app).post('/api/auth/sign-in/email').set('Origin', TEST_ORIGIN).set(headers).send({ email, password });

describe('per-account limit on failed sign-ins (ASVS 4.0.3 2.2.1)', () => {
  it('backs off after five wrong passwords, even for the right one, with Retry-After', async () => {
    const company = await makeCompany(t.database.db, 'subcontractor');
    const { email } = await makeUser(t.database.db, t.auth, company.id);
    for (let i = 0; i < FREE_FAILURES; i++) expect((await signIn(email, 'wrong-password-here')).status).toBe(401);
    const res = await signIn(email, TEST_PASSWORD);
    expect(res.status).toBe(429);
    expect(res.body.code).toBe('SIGN_IN_BACKOFF');
    expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
    // Another account is not affected.
    const other = await makeUser(t.database.db, t.auth, company.id);
    expect((await signIn(other.email, TEST_PASSWORD)).status).toBe(200);
  });

  it('cannot be used to lock the real person out: the right password from another address still signs in', async () => {
    const company = await makeCompany(t.database.db, 'owner');
    const { email } = await makeUser(t.database.db, t.auth, company.id);
    // 'trust proxy' is loopback: supertest's requests come from loopback, so X-Forwarded-For names the client here.
    const attacker = { 'X-Forwarded-For': '203.0.113.66' };
    for (let i = 0; i < FREE_FAILURES + 3; i++)
      expect((await signIn(email, 'wrong-password-here', attacker)).status).toBeGreaterThanOrEqual(401);
    expect((await signIn(email, TEST_PASSWORD, attacker)).status).toBe(429);
    const res = await signIn(email, TEST_PASSWORD, { 'X-Forwarded-For': '198.51.100.23' });
    expect(res.status).toBe(200);
  });

  it('counts the same failures on every app server sharing the database (issue 16): one server backs off what another saw', async () => {
    const now = 1_000_000;
    const serverA = createSignInGuard(t.database.db, () => now);
    const serverB = createSignInGuard(t.database.db, () => now);
    const ip = '198.51.100.77';
    for (let i = 0; i < FREE_FAILURES; i++) await serverA.recordFailure('shared@x.test', ip);
    expect(await serverB.retryAfter('shared@x.test', ip)).toBe(1);
    await serverB.recordSuccess('shared@x.test', ip);
    expect(await serverA.retryAfter('shared@x.test', ip)).toBe(0);
  });

  it('doubles the wait per failure up to a minute and caps failures at 100 an hour', async () => {
    const now = 0;
    const guard = createSignInGuard(t.database.db, () => now);
    const ip = '198.51.100.1';
    for (let i = 0; i < FREE_FAILURES; i++) await guard.recordFailure('a@x.test', ip);
    expect(await guard.retryAfter('A@X.test', ip)).toBe(1);
    await guard.recordFailure('a@x.test', ip);
    expect(await guard.retryAfter('a@x.test', ip)).toBe(2);
    for (let i = 0; i < 20; i++) await guard.recordFailure('a@x.test', ip);
    expect(await guard.retryAfter('a@x.test', ip)).toBe(60);
    await guard.recordSuccess('a@x.test', ip);
    expect(await guard.retryAfter('a@x.test', ip)).toBe(0);
  });

  it('refuses the account for the rest of the hour at 100 failures in a rolling hour, from every address without a recent sign-in', async () => {
    let now = 0;
    const guard = createSignInGuard(t.database.db, () => now);
    const attacker = (i: number) => `203.0.113.${i % 200}`;
    for (let i = 0; i < MAX_FAILURES_PER_HOUR - 1; i++) {
      await guard.recordFailure('b@x.test', attacker(i));
      now += 1000;
    }
    expect(await guard.retryAfter('b@x.test', '192.0.2.50')).toBe(0);
    await guard.recordFailure('b@x.test', attacker(MAX_FAILURES_PER_HOUR));
    expect(await guard.retryAfter('b@x.test', '192.0.2.50')).toBe(3600 - (MAX_FAILURES_PER_HOUR - 1));
    now = 3600_001;
    expect(await guard.retryAfter('b@x.test', '192.0.2.50')).toBe(0);
  });

  it("keeps the owner's usual address open while the account is at its hourly ceiling", async () => {
    let now = 0;
    const guard = createSignInGuard(t.database.db, () => now);
    await guard.recordSuccess('c@x.test', '192.0.2.7'); // the owner signed in from here earlier
    for (let i = 0; i < MAX_FAILURES_PER_HOUR; i++) {
      await guard.recordFailure('c@x.test', `203.0.113.${i % 200}`);
      now += 10;
    }
    expect(await guard.retryAfter('c@x.test', '198.51.100.9')).toBeGreaterThan(0);
    expect(await guard.retryAfter('c@x.test', '192.0.2.7')).toBe(0);
  });
});

describe("better-auth's per-IP rate limit", () => {
  it('limits sign-ins per client address, keyed by the address Express derives and not a header the client sets', async () => {
    const auth = createAuth({
      db: t.database.db,
      secret: 'test-secret-test-secret-test-secret-0123',
      baseURL: TEST_ORIGIN,
      trustedOrigins: [TEST_ORIGIN],
      secureCookies: false,
      rateLimit: true,
    });
    const app = createApp({
      database: t.database,
      auth,
      logger: createLogger('silent'),
      mailer: smtpMailer(t.mailbox.url, 'Tallyard <no-reply@tallyard.test>'),
      storage: t.storage,
      appUrl: TEST_ORIGIN,
    });
    const statuses: number[] = [];
    for (let i = 0; i < 12; i++) {
      const res = await request(app)
        .post('/api/auth/sign-in/email')
        .set('Origin', TEST_ORIGIN)
        .set('X-Tallyard-Client-Ip', `203.0.113.${i}`) // replaced by req.ip (the socket; 'trust proxy' is loopback only)
        .send({ email: `nobody${i}@example.test`, password: 'not-the-password' });
      statuses.push(res.status);
    }
    expect(statuses.slice(0, 10).every((s) => s === 401)).toBe(true);
    expect(statuses.slice(10)).toEqual([429, 429]);
  });
});
