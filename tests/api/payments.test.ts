import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { emailOutbox, payApps, paymentStatusHistory, payments } from '../../server/db/schema';
import { makeWorld } from '../setup/factories';
import { allowPartialPayments, makeCertifiedPayApp } from '../setup/payment-factories';
import { confirm, eventsOf, hook, startPayment, waitForMail } from '../setup/payment-flow';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

// Test values and webhook rules: Stripe's testing documentation (reference.md section 8).
const CARD_OK = '4242 4242 4242 4242';
const CARD_DECLINED = '4000 0000 0000 0002';
const CARD_NO_FUNDS = '4000 0000 0000 9995';
const ACH_OK = '000123456789';
const ACH_NO_FUNDS = '000222222227';
const ACH_STAYS = '000000000009';
// Default factory lines: 1,200 CY x $7.25 = $8,700.00; 340.5 CY x $18.90 = $6,435.45; retainage 10% per line
// $870.00 + $643.55 (643.545 rounded half away from zero); due $15,135.45 - $1,513.55 = $13,621.90 (by hand).
const DUE = 1_362_190;

let t: TestApp;
let world: Awaited<ReturnType<typeof makeWorld>>;
let owner: Awaited<ReturnType<typeof signedInAgent>>;
let number = 0;

beforeAll(async () => {
  t = await createTestApp();
  world = await makeWorld(t.database.db, t.auth);
  owner = await signedInAgent(t.app, world.people.owner.email);
});
afterAll(() => t?.close());

const newApp = (opts: Parameters<typeof makeCertifiedPayApp>[3] = {}) =>
  makeCertifiedPayApp(t.database.db, world.home.id, world.people.subcontractor.id, { number: ++number, ...opts });
const payAppRow = async (id: string) => (await t.database.db.select().from(payApps).where(eq(payApps.id, id)))[0]!;
const paymentRow = async (id: string) => (await t.database.db.select().from(payments).where(eq(payments.id, id)))[0]!;
const historyOf = async (id: string) =>
  (await t.database.db.select().from(paymentStatusHistory).where(eq(paymentStatusHistory.paymentId, id))).map((h) => h.toStatus);
const mailTo = async (template: string) =>
  (await t.database.db.select().from(emailOutbox).where(eq(emailOutbox.template, template))).flatMap((m) => m.toAddresses);

describe('card payments through the stand-in', () => {
  it('4242 4242 4242 4242 succeeds: the payment settles at once and the application is paid, with receipts', async () => {
    const app = await newApp();
    const { paymentId, sessionId } = await startPayment(owner, app.id);
    expect((await paymentRow(paymentId)).amountCents).toBe(DUE);
    const result = await confirm(t.standin, sessionId, { card: CARD_OK });
    expect(result.outcome).toBe('succeeded');
    const payment = await paymentRow(paymentId);
    expect(payment).toMatchObject({ status: 'succeeded', method: 'card', stripeCheckoutSessionId: sessionId, stripePaymentIntentId: result.paymentIntent });
    // The stand-in's illustrative card fee: 2.9% + 30 cents of $13,621.90 = $395.04 + $0.30.
    expect(payment.feeCents).toBe(39_534);
    expect(await payAppRow(app.id)).toMatchObject({ status: 'paid', paidCents: DUE });
    expect(await historyOf(paymentId)).toEqual(['created', 'succeeded']);
    const receipts = await mailTo('payment.receipt');
    for (const role of ['owner', 'general_contractor', 'subcontractor'] as const) expect(receipts).toContain(world.people[role].email);
    const seen = await waitForMail(t.mailbox, (m) => m.subject.includes(`Receipt: pay application ${app.number}`));
    expect(seen.text).toContain('$13,621.90');
  });

  it.each([
    [CARD_DECLINED, 'declined'],
    [CARD_NO_FUNDS, 'insufficient_funds'],
  ])('%s declines: the payment fails, the balance stays open and the owner is told', async (card, why) => {
    const app = await newApp();
    const { paymentId, sessionId } = await startPayment(owner, app.id);
    expect((await confirm(t.standin, sessionId, { card })).outcome).toBe('declined');
    const payment = await paymentRow(paymentId);
    expect(payment.status).toBe('failed');
    expect(payment.failureMessage).toContain(why);
    expect(await payAppRow(app.id)).toMatchObject({ status: 'certified', paidCents: 0 });
    expect(await mailTo('payment.failed')).toContain(world.people.owner.email);
    // The declined attempt's session is ended; paying again opens a new one for the whole balance.
    const again = await startPayment(owner, app.id);
    expect((await paymentRow(again.paymentId)).amountCents).toBe(DUE);
  });
});

describe('ACH bank debits through the stand-in', () => {
  it(`${ACH_OK} shows processing, then succeeded when the bank settles`, async () => {
    const app = await newApp();
    const { paymentId, sessionId } = await startPayment(owner, app.id);
    const { paymentIntent } = await confirm(t.standin, sessionId, { account: ACH_OK });
    expect(await paymentRow(paymentId)).toMatchObject({ status: 'processing', method: 'us_bank_account' });
    expect(await payAppRow(app.id)).toMatchObject({ status: 'payment_processing', paidCents: 0 });
    const session = (await eventsOf(t.standin, sessionId)).find((e) => e.type === 'checkout.session.completed')!;
    expect(session.object.payment_status).toBe('unpaid');
    // While processing, nothing is left to pay: a second attempt is refused.
    expect((await owner.post(`/api/pay-apps/${app.id}/payments`).send({})).status).toBe(409);
    expect((await hook(t.standin, `/payment_intents/${paymentIntent}/settle`, {})).status).toBe(200);
    await t.standin.idle();
    expect(await paymentRow(paymentId)).toMatchObject({ status: 'succeeded' });
    expect(await payAppRow(app.id)).toMatchObject({ status: 'paid', paidCents: DUE });
    expect(await historyOf(paymentId)).toEqual(['created', 'processing', 'succeeded']);
  });

  it(`${ACH_NO_FUNDS} goes processing then failed: the balance reopens and the owner is told`, async () => {
    const app = await newApp();
    const { paymentId, sessionId } = await startPayment(owner, app.id);
    const { paymentIntent } = await confirm(t.standin, sessionId, { account: ACH_NO_FUNDS });
    expect((await paymentRow(paymentId)).status).toBe('processing');
    await hook(t.standin, `/payment_intents/${paymentIntent}/settle`, {});
    await t.standin.idle();
    const payment = await paymentRow(paymentId);
    expect(payment.status).toBe('failed');
    expect(payment.failureMessage).toContain('insufficient_funds');
    expect(await payAppRow(app.id)).toMatchObject({ status: 'certified', paidCents: 0 });
    const notice = await waitForMail(t.mailbox, (m) => m.subject.includes(`Payment failed: pay application ${app.number}`));
    expect(notice.to).toContain(world.people.owner.email);
  });

  it(`${ACH_STAYS} stays processing: the bank never answers and the application is not paid`, async () => {
    const app = await newApp();
    const { paymentId, sessionId } = await startPayment(owner, app.id);
    const { paymentIntent } = await confirm(t.standin, sessionId, { account: ACH_STAYS });
    expect((await hook(t.standin, `/payment_intents/${paymentIntent}/settle`, {})).status).toBe(409);
    expect((await paymentRow(paymentId)).status).toBe('processing');
    expect(await payAppRow(app.id)).toMatchObject({ status: 'payment_processing', paidCents: 0 });
  });
});

describe('webhook events arrive more than once and out of order (Stripe: "Handle duplicate events", "Event ordering")', () => {
  it('100 replays of one event give one effect', async () => {
    const app = await newApp();
    const { paymentId, sessionId } = await startPayment(owner, app.id);
    await confirm(t.standin, sessionId, { card: CARD_OK });
    const completed = (await eventsOf(t.standin, sessionId)).find((e) => e.type === 'checkout.session.completed')!;
    const { body } = await hook<{ statuses: number[] }>(t.standin, `/events/${completed.id}/replay`, { times: 100 });
    expect(body.statuses).toEqual(Array(100).fill(200));
    expect(await payAppRow(app.id)).toMatchObject({ status: 'paid', paidCents: DUE });
    expect(await historyOf(paymentId)).toEqual(['created', 'succeeded']);
    const receipts = (await t.database.db.select().from(emailOutbox).where(eq(emailOutbox.template, 'payment.receipt'))).filter((m) => m.subject.includes(`pay application ${app.number},`));
    expect(receipts).toHaveLength(1);
  });

  it('completed-before-processing order never moves a payment back', async () => {
    const app = await newApp();
    const { paymentId, sessionId } = await startPayment(owner, app.id);
    await hook(t.standin, '/config', { holdEvents: true });
    const { paymentIntent } = await confirm(t.standin, sessionId, { account: ACH_OK });
    await hook(t.standin, `/payment_intents/${paymentIntent}/settle`, {});
    await hook(t.standin, '/config', { holdEvents: false });
    const events = await eventsOf(t.standin, paymentIntent);
    const byType = (type: string) => events.find((e) => e.type === type)!.id;
    // The success events first, then the late processing ones.
    const order = ['checkout.session.async_payment_succeeded', 'payment_intent.succeeded', 'payment_intent.processing', 'checkout.session.completed'];
    const { body } = await hook<{ statuses: number[] }>(t.standin, '/deliver', { ids: order.map(byType) });
    expect(body.statuses).toEqual([200, 200, 200, 200]);
    expect((await paymentRow(paymentId)).status).toBe('succeeded');
    expect(await historyOf(paymentId)).toEqual(['created', 'succeeded']);
    expect(await payAppRow(app.id)).toMatchObject({ status: 'paid', paidCents: DUE });
  });

  it('a bad signature gets 400 and changes nothing', async () => {
    const app = await newApp();
    const { paymentId, sessionId } = await startPayment(owner, app.id);
    await hook(t.standin, '/config', { holdEvents: true });
    await confirm(t.standin, sessionId, { card: CARD_OK });
    await hook(t.standin, '/config', { holdEvents: false });
    const event = (await eventsOf(t.standin, sessionId)).find((e) => e.type === 'checkout.session.completed')!;
    const payload = JSON.stringify({ id: event.id, object: 'event', type: event.type, created: 1, data: { object: event.object } });
    const forged = `t=${Math.floor(Date.now() / 1000)},v1=${'0'.repeat(64)}`;
    const bad = await owner.post('/api/webhooks/stripe').set('Content-Type', 'application/json').set('Stripe-Signature', forged).send(payload);
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('BAD_SIGNATURE');
    const unsigned = await owner.post('/api/webhooks/stripe').set('Content-Type', 'application/json').send(payload);
    expect(unsigned.status).toBe(400);
    expect((await paymentRow(paymentId)).status).toBe('created');
    expect(await payAppRow(app.id)).toMatchObject({ status: 'certified', paidCents: 0 });
  });
});

describe('who may pay, what, and how much', () => {
  it('ignores amounts the client sends: the server charges the certified balance', async () => {
    const app = await newApp();
    const { paymentId, sessionId } = await startPayment(owner, app.id, { amountCents: 1, amount: 1, currentDueCents: 1 });
    expect((await paymentRow(paymentId)).amountCents).toBe(DUE);
    const session = await t.database.db.select().from(payments).where(eq(payments.id, paymentId));
    expect(session[0]!.stripeCheckoutSessionId).toBe(sessionId);
  });

  it('answers 403 to the general contractor, the subcontractor and an admin, 404 off the project', async () => {
    const app = await newApp();
    for (const role of ['general_contractor', 'subcontractor', 'admin'] as const) {
      const agent = await signedInAgent(t.app, world.people[role].email);
      const res = await agent.post(`/api/pay-apps/${app.id}/payments`).send({});
      expect(res.status, role).toBe(403);
    }
    const outsider = await signedInAgent(t.app, world.outsider.email);
    expect((await outsider.post(`/api/pay-apps/${app.id}/payments`).send({})).status).toBe(404);
    expect((await outsider.get(`/api/pay-apps/${app.id}/payments`)).status).toBe(404);
    expect((await owner.post('/api/pay-apps/not-a-uuid/payments').send({})).status).toBe(404);
    expect(await t.database.db.select().from(payments).where(eq(payments.payAppId, app.id))).toHaveLength(0);
  });

  it.each(['paid'] as const)('refuses a %s application with 409 PAY_APP_NOT_PAYABLE', async (status) => {
    const app = await newApp({ status });
    const res = await owner.post(`/api/pay-apps/${app.id}/payments`).send({});
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('PAY_APP_NOT_PAYABLE');
  });

  // The owner sees an application only once certified: before that, paying it answers as for one that does not exist.
  it.each(['draft', 'submitted', 'in_review', 'returned'] as const)('answers the owner 404 for a %s application and charges nothing', async (status) => {
    const app = await newApp({ status });
    const res = await owner.post(`/api/pay-apps/${app.id}/payments`).send({});
    expect(res.status).toBe(404);
    expect(await t.database.db.select().from(payments).where(eq(payments.payAppId, app.id))).toHaveLength(0);
  });

  it('partial amounts: refused unless the project allows them, never above the balance, then the rest', async () => {
    const app = await newApp();
    const refused = await owner.post(`/api/pay-apps/${app.id}/payments`).send({ partialAmountCents: 500_000 });
    expect(refused.status).toBe(400);
    expect(refused.body.error.details[0].path).toBe('partialAmountCents');
    await allowPartialPayments(t.database.db, world.home.id);
    try {
      const tooMuch = await owner.post(`/api/pay-apps/${app.id}/payments`).send({ partialAmountCents: DUE + 1 });
      expect(tooMuch.status).toBe(400);
      expect((await owner.post(`/api/pay-apps/${app.id}/payments`).send({ partialAmountCents: 12.5 })).status).toBe(400);
      const part = await startPayment(owner, app.id, { partialAmountCents: 500_000 });
      await confirm(t.standin, part.sessionId, { card: CARD_OK });
      expect(await payAppRow(app.id)).toMatchObject({ status: 'partially_paid', paidCents: 500_000 });
      const view = await owner.get(`/api/pay-apps/${app.id}/payments`);
      expect(view.body.payApp).toMatchObject({ balanceCents: DUE - 500_000, payable: true, allowPartialPayments: true });
      const rest = await startPayment(owner, app.id);
      expect((await paymentRow(rest.paymentId)).amountCents).toBe(DUE - 500_000);
      await confirm(t.standin, rest.sessionId, { card: CARD_OK });
      expect(await payAppRow(app.id)).toMatchObject({ status: 'paid', paidCents: DUE });
    } finally {
      await allowPartialPayments(t.database.db, world.home.id, false);
    }
  });

  it('lists payments per application and per project for the owner, general contractor and subcontractor', async () => {
    const app = await newApp();
    const { paymentId, sessionId } = await startPayment(owner, app.id);
    await confirm(t.standin, sessionId, { account: ACH_STAYS });
    for (const role of ['owner', 'general_contractor', 'subcontractor'] as const) {
      const agent = await signedInAgent(t.app, world.people[role].email);
      const one = await agent.get(`/api/pay-apps/${app.id}/payments`);
      expect(one.status, role).toBe(200);
      expect(one.body.payApp).toMatchObject({ status: 'payment_processing', processingCents: DUE, balanceCents: 0, payable: false });
      expect(one.body.payments[0]).toMatchObject({ id: paymentId, status: 'processing', method: 'us_bank_account' });
      const all = await agent.get(`/api/projects/${world.home.id}/payments`);
      expect(all.body.payments.map((p: { id: string }) => p.id)).toContain(paymentId);
      expect(all.body.payApps.map((a: { id: string }) => a.id)).toContain(app.id);
    }
  });
});
