import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEFAULT_REAUTH_PAYMENT_ABOVE_CENTS } from '../../server/app';
import { auditEvents, payApps, payments, projects, session } from '../../server/db/schema';
import { makeWorld } from '../setup/factories';
import { allowPartialPayments, makeCertifiedPayApp } from '../setup/payment-factories';
import { confirm, startPayment } from '../setup/payment-flow';
import { createTestApp, signedInAgent, TEST_PASSWORD, type TestApp } from '../setup/test-app';

/** Every flag of the application, acknowledged: these tests certify after looking at them. */
const flagKeys = async (
  agent: { get: (url: string) => PromiseLike<{ body: { payApp: { flags: { key: string }[] } } }> },
  payAppId: string,
) => (await agent.get(`/api/pay-apps/${payAppId}`)).body.payApp.flags.map((f) => f.key);

// OWASP ASVS 4.0.3 section 3.7.1: re-authentication before a sensitive transaction. Here: certifying a pay
// application, and paying more than the threshold. A sign-in older than ten minutes asks for the password again.
let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
let number = 0;

beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
});
afterAll(() => t?.close());

async function ageSessions(userId: string, minutes: number) {
  await t.database.db
    .update(session)
    .set({ createdAt: new Date(Date.now() - minutes * 60_000) })
    .where(eq(session.userId, userId));
}
const newApp = (status: 'in_review' | 'certified', lines?: { quantity: number; unitPriceCents: number }[]) =>
  makeCertifiedPayApp(t.database.db, w.home.id, w.people.subcontractor.id, { number: ++number, status, lines });
const statusOf = async (id: string) =>
  (await t.database.db.select().from(payApps).where(eq(payApps.id, id)))[0]!.status;
const auditCount = async () => (await t.database.db.select({ n: count() }).from(auditEvents))[0]!.n;
const paymentCount = async (payAppId: string) =>
  (await t.database.db.select({ n: count() }).from(payments).where(eq(payments.payAppId, payAppId)))[0]!.n;

describe('certifying a pay application', () => {
  it('goes through on a fresh sign-in', async () => {
    const gc = await signedInAgent(t.app, w.people.general_contractor.email);
    const app = await newApp('in_review');
    const res = await gc
      .post(`/api/pay-apps/${app.id}/certify`)
      .send({ expectedRevision: 0, acknowledgedFlags: await flagKeys(gc, app.id) });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.payApp.status).toBe('certified');
  });

  it('asks for the password again after ten minutes, and changes nothing until it is given', async () => {
    const gc = await signedInAgent(t.app, w.people.general_contractor.email);
    await ageSessions(w.people.general_contractor.id, 11);
    const app = await newApp('in_review');
    const before = await auditCount();

    const asked = await gc
      .post(`/api/pay-apps/${app.id}/certify`)
      .send({ expectedRevision: 0, acknowledgedFlags: await flagKeys(gc, app.id) });
    expect(asked.status).toBe(403);
    expect(asked.body.error).toMatchObject({ code: 'REAUTH_REQUIRED', details: [{ path: 'reauthPassword' }] });

    const wrong = await gc
      .post(`/api/pay-apps/${app.id}/certify`)
      .send({ expectedRevision: 0, acknowledgedFlags: await flagKeys(gc, app.id), reauthPassword: 'not-the-password' });
    expect(wrong.status).toBe(403);
    expect(wrong.body.error.code).toBe('REAUTH_FAILED');
    expect(await statusOf(app.id)).toBe('in_review');
    expect(await auditCount()).toBe(before);

    // The password field is taken out of the body before the body's own (strict) schema reads it.
    const ok = await gc
      .post(`/api/pay-apps/${app.id}/certify`)
      .send({ expectedRevision: 0, acknowledgedFlags: await flagKeys(gc, app.id), reauthPassword: TEST_PASSWORD });
    expect(ok.status, JSON.stringify(ok.body)).toBe(200);
    expect(await statusOf(app.id)).toBe('certified');
  });

  it('answers someone who may not certify with 403 FORBIDDEN, not a password prompt', async () => {
    const sub = await signedInAgent(t.app, w.people.subcontractor.email);
    await ageSessions(w.people.subcontractor.id, 30);
    const app = await newApp('in_review');
    const res = await sub.post(`/api/pay-apps/${app.id}/certify`).send({ expectedRevision: 0 });
    expect(res.status).toBe(403);
    expect(res.body.error.code).not.toMatch(/^REAUTH/);
  });

  it('answers a member of another project with 404 whatever the age of the sign-in', async () => {
    const outsider = await signedInAgent(t.app, w.outsider.email);
    await ageSessions(w.outsider.id, 30);
    const app = await newApp('in_review');
    const res = await outsider.post(`/api/pay-apps/${app.id}/certify`).send({ expectedRevision: 0 });
    expect(res.status).toBe(404);
  });
});

describe('paying a certified application', () => {
  // Factory lines: 1,200 x $7.25 + 340.5 x $18.90 less 10% retainage = $13,621.90 due (by hand), above $10,000.00.
  it('above the threshold, an old sign-in must give the password again before any payment row is written', async () => {
    const owner = await signedInAgent(t.app, w.people.owner.email);
    await ageSessions(w.people.owner.id, 11);
    const app = await newApp('certified');
    expect(app.currentDueCents).toBeGreaterThan(DEFAULT_REAUTH_PAYMENT_ABOVE_CENTS);

    const asked = await owner.post(`/api/pay-apps/${app.id}/payments`).send({});
    expect(asked.status).toBe(403);
    expect(asked.body.error.code).toBe('REAUTH_REQUIRED');
    expect(await paymentCount(app.id)).toBe(0);

    const ok = await owner.post(`/api/pay-apps/${app.id}/payments`).send({ reauthPassword: TEST_PASSWORD });
    expect(ok.status, JSON.stringify(ok.body)).toBe(201);
    expect(await paymentCount(app.id)).toBe(1);
  });

  it('at or below the threshold, an old sign-in pays without being asked', async () => {
    const owner = await signedInAgent(t.app, w.people.owner.email);
    await ageSessions(w.people.owner.id, 11);
    // 100 CY x $50.00 = $5,000.00, less 10% retainage = $4,500.00 due.
    const app = await newApp('certified', [{ quantity: 100, unitPriceCents: 5000 }]);
    expect(app.currentDueCents).toBe(450_000);
    const res = await owner.post(`/api/pay-apps/${app.id}/payments`).send({});
    expect(res.status, JSON.stringify(res.body)).toBe(201);
  });
  it('counts the total paid on the application within the window: two payments just under the threshold ask the second time', async () => {
    const owner = await signedInAgent(t.app, w.people.owner.email);
    await ageSessions(w.people.owner.id, 11);
    await allowPartialPayments(t.database.db, w.home.id);
    try {
      // 2,000 CY x $12.00 = $24,000.00, less 10% retainage = $21,600.00 due (by hand): room for two payments of $9,999.99.
      const app = await newApp('certified', [{ quantity: 2000, unitPriceCents: 1200 }]);
      expect(app.currentDueCents).toBe(2_160_000);
      // $9,999.99 is at or below the $10,000.00 threshold: no password the first time.
      const first = await startPayment(owner, app.id, { partialAmountCents: 999_999 });
      await confirm(t.standin, first.sessionId, { card: '4242 4242 4242 4242' });
      const asked = await owner.post(`/api/pay-apps/${app.id}/payments`).send({ partialAmountCents: 999_999 });
      expect(asked.status, JSON.stringify(asked.body)).toBe(403);
      expect(asked.body.error.code).toBe('REAUTH_REQUIRED');
      expect(await paymentCount(app.id)).toBe(1);
      const ok = await owner.post(`/api/pay-apps/${app.id}/payments`).send({ partialAmountCents: 999_999, reauthPassword: TEST_PASSWORD });
      expect(ok.status, JSON.stringify(ok.body)).toBe(201);
    } finally {
      await t.database.db.update(projects).set({ allowPartialPayments: false }).where(eq(projects.id, w.home.id));
    }
  });
});
