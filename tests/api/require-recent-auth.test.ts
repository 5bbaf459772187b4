import { eq } from 'drizzle-orm';
import express, { type Express } from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { session } from '../../server/db/schema';
import { errorHandler } from '../../server/middleware/error-handler';
import { requireActor } from '../../server/middleware/require-actor';
import { REAUTH_FIELD, requireRecentAuth } from '../../server/middleware/require-recent-auth';
import { createLogger } from '../../server/lib/logger';
import { makeCompany, makeUser } from '../setup/factories';
import { createTestApp, signedInAgent, TEST_PASSWORD, type TestApp } from '../setup/test-app';

let t: TestApp;
let app: Express;
let email: string;
let userId: string;
beforeAll(async () => {
  t = await createTestApp();
  const company = await makeCompany(t.database.db, 'owner');
  ({ email, id: userId } = await makeUser(t.database.db, t.auth, company.id));
  // A stand-in for a sensitive route: certify, or pay above a threshold (amountCents > 1,000,000).
  const guarded = express.Router();
  guarded.use(express.json(), requireActor(t.auth, t.database.db));
  guarded.post('/certify', requireRecentAuth({ auth: t.auth, db: t.database.db }), (req, res) =>
    res.json({ ok: true, body: req.body }),
  );
  guarded.post(
    '/pay',
    requireRecentAuth({
      auth: t.auth,
      db: t.database.db,
      when: (req) => Number((req.body as { amountCents?: number }).amountCents) > 1_000_000,
    }),
    (_req, res) => res.json({ ok: true }),
  );
  // Sign-in goes through the real app.
  app = express()
    .use('/t', guarded)
    .use(t.app)
    .use(errorHandler(createLogger('silent')));
});
afterAll(() => t.close());

async function ageSession(minutes: number) {
  await t.database.db
    .update(session)
    .set({ createdAt: new Date(Date.now() - minutes * 60_000) })
    .where(eq(session.userId, userId));
}

// OWASP ASVS 4.0.3 3.7.1: re-authentication before sensitive transactions.
describe('requireRecentAuth', () => {
  it('passes within ten minutes of signing in', async () => {
    const agent = await signedInAgent(app, email);
    const res = await agent.post('/t/certify').send({ note: 'ok' });
    expect(res.status).toBe(200);
  });

  it('answers 403 REAUTH_REQUIRED once the sign-in is older, naming the field', async () => {
    const agent = await signedInAgent(app, email);
    await ageSession(11);
    const res = await agent.post('/t/certify').send({});
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('REAUTH_REQUIRED');
    expect(res.body.error.details[0].path).toBe(REAUTH_FIELD);
  });

  it('accepts a freshly typed password, checked by better-auth, and strips it from the body', async () => {
    const agent = await signedInAgent(app, email);
    await ageSession(30);
    const res = await agent.post('/t/certify').send({ note: 'x', [REAUTH_FIELD]: TEST_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.body).toEqual({ note: 'x' });
  });

  it('refuses a wrong password with 403 REAUTH_FAILED, and backs off after five', async () => {
    const agent = await signedInAgent(app, email);
    await ageSession(30);
    for (let i = 0; i < 5; i++) {
      const res = await agent.post('/t/certify').send({ [REAUTH_FIELD]: 'not-my-password-at-all' });
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('REAUTH_FAILED');
    }
    const locked = await agent.post('/t/certify').send({ [REAUTH_FIELD]: TEST_PASSWORD });
    expect(locked.status).toBe(429);
    expect(locked.body.error.code).toBe('REAUTH_BACKOFF');
  });

  it('asks only above the threshold when given `when`', async () => {
    const agent = await signedInAgent(app, email);
    await ageSession(30);
    expect((await agent.post('/t/pay').send({ amountCents: 500_00 })).status).toBe(200);
    expect((await agent.post('/t/pay').send({ amountCents: 2_000_000 })).status).toBe(403);
  });

  it('answers 401 without a session', async () => {
    expect((await request(app).post('/t/certify').send({})).status).toBe(401);
  });
});
