import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { emailOutbox, payApps, payments, projects } from '../../server/db/schema';
import { DEFAULT_FEE_RATES, feeQuote } from '../../src/shared/domain/payment-fees';
import { makeWorld } from '../setup/factories';
import { makeCertifiedPayApp } from '../setup/payment-factories';
import { confirm, eventsOf, hook, startPayment, waitForMail } from '../setup/payment-flow';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

// Test values: Stripe's testing documentation (reference.md section 8). Due on the factory's default lines:
// $13,621.90 (worked by hand in tests/api/payments.test.ts). Fees: the default schedule, the processor's published
// standard US pricing from memory (2.9 % + 30 cents per card charge; ACH 0.8 % capped at $5.00).
const CARD_OK = '4242 4242 4242 4242';
const CARD_DECLINED = '4000 0000 0000 0002';
const ACH_OK = '000123456789';
const DUE = 1_362_190;
// The payer bearing the card fee, by hand: the least charge T with T - (2.9 % of T, rounded, + 30) >= DUE is
// $14,029.04: 2.9 % of 1,402,904 = 40,684.216 -> 40,684, + 30 = 40,714 = 1,402,904 - 1,362,190; one cent less
// (1,402,903: fee 40,714 again) nets 1,362,189, short by a cent.
const CARD_PAYER = { feeCents: 40_714, chargeCents: 1_402_904 };

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

const newApp = () =>
  makeCertifiedPayApp(t.database.db, world.home.id, world.people.subcontractor.id, { number: ++number });
const paymentRow = async (id: string) => (await t.database.db.select().from(payments).where(eq(payments.id, id)))[0]!;
const payAppRow = async (id: string) => (await t.database.db.select().from(payApps).where(eq(payApps.id, id)))[0]!;
const bearer = (who: 'payer' | 'payee') =>
  t.database.db.update(projects).set({ processingFeeBearer: who }).where(eq(projects.id, world.home.id));
/** What the processor charged: the payment intent's amount, as the stand-in's own events carry it. */
async function chargedByProcessor(paymentIntent: string) {
  const events = await eventsOf(t.standin, paymentIntent);
  return events.find((e) => e.type.startsWith('payment_intent.'))!.object.amount as number;
}

describe('the fee schedule behind the charge', () => {
  it('worked figure: the payer bearing the card fee on $13,621.90 is charged $14,029.04 (fee $407.14)', () => {
    expect(feeQuote(DUE, 'card', 'payer')).toMatchObject({ ...CARD_PAYER, netCents: DUE });
  });
});

describe('who bears the processing fee (project setting)', () => {
  it('the payee absorbing: the charge is the application amount; the fee is on the record and the receipt', async () => {
    await bearer('payee');
    const app = await newApp();
    const view = await owner.get(`/api/pay-apps/${app.id}/payments`);
    expect(view.body.payApp).toMatchObject({
      feeBearer: 'payee',
      feeQuotes: { card: { chargeCents: DUE, feeCents: 39_534 } },
    });
    const { paymentId, sessionId } = await startPayment(owner, app.id, { method: 'card' });
    expect(await paymentRow(paymentId)).toMatchObject({
      amountCents: DUE,
      feeCents: 39_534,
      feeBearer: 'payee',
      method: 'card',
    });
    const { paymentIntent } = await confirm(t.standin, sessionId, { card: CARD_OK });
    expect(await chargedByProcessor(paymentIntent)).toBe(DUE);
    expect(await payAppRow(app.id)).toMatchObject({ status: 'paid', paidCents: DUE });
    const list = await owner.get(`/api/pay-apps/${app.id}/payments`);
    expect(list.body.payments[0]).toMatchObject({
      amountCents: DUE,
      feeCents: 39_534,
      reportedFeeCents: 39_534,
      feeBearer: 'payee',
      chargedCents: DUE,
    });
    const receipt = await waitForMail(t.mailbox, (m) => m.subject.includes(`Receipt: pay application ${app.number},`));
    expect(receipt.text).toContain('Processing fee: $395.34, absorbed by the payee; total charged $13,621.90.');
    expect(receipt.text).not.toContain('The processor reported');
  });

  it('keeps the fee the processor reported apart from the quote, and the receipt names both where they differ', async () => {
    await bearer('payee');
    const app = await newApp();
    const { paymentId, sessionId } = await startPayment(owner, app.id, { method: 'card' });
    // As if this server were configured with rates below the processor's: 2.86 % + 30 cents on $13,621.90 quotes
    // $389.89 (by hand: 38,958.634 cents -> 38,959 + 30); the payee absorbs it, so the charge is the amount either way.
    await t.database.db.update(payments).set({ feeCents: 38_989 }).where(eq(payments.id, paymentId));
    await confirm(t.standin, sessionId, { card: CARD_OK });
    expect(await paymentRow(paymentId)).toMatchObject({
      status: 'succeeded',
      feeCents: 38_989,
      reportedFeeCents: 39_534,
    });
    const list = await owner.get(`/api/pay-apps/${app.id}/payments`);
    expect(list.body.payments[0]).toMatchObject({ feeCents: 38_989, reportedFeeCents: 39_534, chargedCents: DUE });
    const receipt = await waitForMail(t.mailbox, (m) => m.subject.includes(`Receipt: pay application ${app.number},`));
    expect(receipt.text).toContain('Processing fee: $389.89, absorbed by the payee');
    expect(receipt.text).toContain('The processor reported a fee of $395.34 on this charge (quoted $389.89)');
  });

  it('the payer bearing it, by card: charged = application amount + fee, the application is paid the amount only', async () => {
    await bearer('payer');
    const app = await newApp();
    const { paymentId, sessionId } = await startPayment(owner, app.id, { method: 'card' });
    expect(await paymentRow(paymentId)).toMatchObject({
      amountCents: DUE,
      feeCents: CARD_PAYER.feeCents,
      feeBearer: 'payer',
    });
    const { paymentIntent } = await confirm(t.standin, sessionId, { card: CARD_OK });
    expect(await chargedByProcessor(paymentIntent)).toBe(DUE + CARD_PAYER.feeCents);
    expect((await paymentRow(paymentId)).status).toBe('succeeded');
    expect(await payAppRow(app.id)).toMatchObject({ status: 'paid', paidCents: DUE });
    const receipt = await waitForMail(t.mailbox, (m) => m.subject.includes(`Receipt: pay application ${app.number},`));
    expect(receipt.text).toContain(
      'Processing fee: $407.14, paid by the payer under this contract; total charged $14,029.04.',
    );
  });

  it('the payer bearing it, by ACH: the capped $5.00 is added, and a card cannot be used on that checkout', async () => {
    await bearer('payer');
    const app = await newApp();
    const { paymentId, sessionId } = await startPayment(owner, app.id, { method: 'us_bank_account' });
    expect(await paymentRow(paymentId)).toMatchObject({ feeCents: 500, feeBearer: 'payer', method: 'us_bank_account' });
    expect((await confirm(t.standin, sessionId, { card: CARD_OK })).outcome).toBe('invalid');
    const { paymentIntent } = await confirm(t.standin, sessionId, { account: ACH_OK });
    await hook(t.standin, `/payment_intents/${paymentIntent}/settle`, {});
    await t.standin.idle();
    expect(await chargedByProcessor(paymentIntent)).toBe(DUE + 500);
    expect(await payAppRow(app.id)).toMatchObject({ status: 'paid', paidCents: DUE });
  });

  it('the payer bearing it, a payment without a chosen method is refused at `method`, and nothing is started', async () => {
    await bearer('payer');
    const app = await newApp();
    const res = await owner.post(`/api/pay-apps/${app.id}/payments`).send({});
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].path).toBe('method');
    expect(await t.database.db.select().from(payments).where(eq(payments.payAppId, app.id))).toHaveLength(0);
    const bad = await owner.post(`/api/pay-apps/${app.id}/payments`).send({ method: 'cash' });
    expect([bad.status, bad.body.error.details[0].path]).toEqual([400, 'method']);
  });

  it('a failed payment tells the payer and the subcontractor', async () => {
    await bearer('payee');
    const app = await newApp();
    const { sessionId } = await startPayment(owner, app.id, { method: 'card' });
    await confirm(t.standin, sessionId, { card: CARD_DECLINED });
    const notice = await waitForMail(t.mailbox, (m) =>
      m.subject.includes(`Payment failed: pay application ${app.number},`),
    );
    expect(notice.to).toEqual(expect.arrayContaining([world.people.owner.email, world.people.subcontractor.email]));
    const queued = await t.database.db.select().from(emailOutbox).where(eq(emailOutbox.template, 'payment.failed'));
    expect(queued.some((m) => m.toAddresses.includes(world.people.subcontractor.email))).toBe(true);
  });
});

describe('the setting itself', () => {
  it('only the general contractor’s side changes it; the others are refused, another company’s person sees nothing', async () => {
    const patch = async (role: keyof typeof world.people | 'outsider', who: 'payer' | 'payee') => {
      const email = role === 'outsider' ? world.outsider.email : world.people[role].email;
      return (await signedInAgent(t.app, email))
        .patch(`/api/projects/${world.home.id}`)
        .send({ processingFeeBearer: who });
    };
    const gc = await patch('general_contractor', 'payer');
    expect(gc.status).toBe(200);
    expect(gc.body.project.processingFeeBearer).toBe('payer');
    for (const role of ['subcontractor', 'owner', 'subcontractor_admin', 'owner_admin'] as const)
      expect((await patch(role, 'payee')).status, role).toBe(403);
    expect((await patch('outsider', 'payee')).status).toBe(404);
    const bad = await patch('general_contractor', 'nobody' as 'payer');
    expect([bad.status, bad.body.error.details[0].path]).toEqual([400, 'processingFeeBearer']);
    const [row] = await t.database.db.select().from(projects).where(eq(projects.id, world.home.id));
    expect(row!.processingFeeBearer).toBe('payer');
  });

  it('every person of the project reads the setting and the fee schedule the server charges by; another project’s person gets 404', async () => {
    await bearer('payer');
    for (const role of ['general_contractor', 'subcontractor', 'owner', 'owner_admin'] as const) {
      const res = await (
        await signedInAgent(t.app, world.people[role].email)
      ).get(`/api/projects/${world.home.id}/payments`);
      expect(res.status, role).toBe(200);
      expect(res.body, role).toMatchObject({ feeBearer: 'payer', feeRates: DEFAULT_FEE_RATES });
    }
    const outsider = await signedInAgent(t.app, world.outsider.email);
    expect((await outsider.get(`/api/projects/${world.home.id}/payments`)).status).toBe(404);
  });
});
