import { eq } from 'drizzle-orm';
import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { changeOrderItems, changeOrders, disputes, lienWaivers, payAppLines, user } from '../../server/db/schema';
import { makeWorld } from '../setup/factories';
import { allowPartialPayments, makeCertifiedPayApp } from '../setup/payment-factories';
import { confirm, startPayment, waitForMail } from '../setup/payment-flow';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

// Factory lines (tests/setup/payment-factories.ts): 1,200 CY x $7.25 and 340.5 CY x $18.90 at 10 % retainage:
// retainage to date $870.00 + $643.55 (643.545 rounded half away from zero) = $1,513.55, by hand.
const RETAINAGE = 151_355;
const CARD_OK = '4242 4242 4242 4242'; // Stripe's testing documentation
const NAME = 'Rowan Achterberg';

let t: TestApp;
let world: Awaited<ReturnType<typeof makeWorld>>;
let sub: Awaited<ReturnType<typeof signedInAgent>>;
let owner: Awaited<ReturnType<typeof signedInAgent>>;
let number = 0;

beforeAll(async () => {
  t = await createTestApp();
  world = await makeWorld(t.database.db, t.auth);
  await t.database.db.update(user).set({ name: NAME }).where(eq(user.id, world.people.subcontractor.id));
  sub = await signedInAgent(t.app, world.people.subcontractor.email);
  owner = await signedInAgent(t.app, world.people.owner.email);
});
afterAll(() => t?.close());

const newApp = (opts: Parameters<typeof makeCertifiedPayApp>[3] = {}) =>
  makeCertifiedPayApp(t.database.db, world.home.id, world.people.subcontractor.id, {
    number: ++number,
    periodEnd: '2026-10-31',
    ...opts,
  });
const issue = (payAppId: string, body: object) =>
  sub.post(`/api/pay-apps/${payAppId}/lien-waivers`).send({ signedName: NAME, ...body });
const listed = async (payAppId: string) =>
  (await owner.get(`/api/projects/${world.home.id}/lien-waivers`)).body.payApps.find(
    (a: { id: string }) => a.id === payAppId,
  );

async function pdfText(url: string) {
  const res = await owner
    .get(url)
    .buffer(true)
    .parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
  const parser = new PDFParse({ data: new Uint8Array(res.body as Buffer) });
  const { text } = await parser.getText();
  await parser.destroy();
  return text.replace(/\s+/g, ' ');
}

/** A resolved dispute on the application's first line (the factory certifies 1,200 CY there), claimed at 1,300 CY. */
async function resolvedDispute(
  payAppId: string,
  d: { counterQuantity: number; resolution: 'counter_accepted' | 'quantity_proposed' },
) {
  const [line] = await t.database.db
    .select()
    .from(payAppLines)
    .where(eq(payAppLines.payAppId, payAppId))
    .orderBy(payAppLines.sortOrder);
  await t.database.db.insert(disputes).values({
    payAppId,
    lineId: line!.id,
    revision: 0,
    reason: 'Over-excavation not authorised',
    claimedQuantity: 1300,
    status: 'resolved',
    openedByUserId: world.people.general_contractor.id,
    ...d,
  });
  return line!;
}

async function paid(app: { id: string }) {
  const { sessionId } = await startPayment(owner, app.id);
  await confirm(t.standin, sessionId, { card: CARD_OK });
}

describe('waiver exceptions', () => {
  it('carry the application’s held retainage to the cent, in the listing and on the signed waiver', async () => {
    const app = await newApp();
    expect((await listed(app.id)).exceptions).toEqual([
      { kind: 'retainage_held', description: expect.stringContaining('$1,513.55'), amountCents: RETAINAGE },
    ]);
    await paid(app);
    const res = await issue(app.id, { kind: 'unconditional_progress' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.waiver.exceptions).toEqual([
      expect.objectContaining({ kind: 'retainage_held', amountCents: RETAINAGE }),
    ]);
    const [row] = await t.database.db.select().from(lienWaivers).where(eq(lienWaivers.id, res.body.waiver.id));
    expect(row!.exceptions).toEqual(res.body.waiver.exceptions);
  });

  it('price a disputed line’s uncertified claim and an approved change order not yet billed, and take the signer’s own', async () => {
    const app = await newApp();
    // Claimed 1,300 CY, certified 1,200 CY: 100 CY x $7.25 = $725.00 in dispute.
    const line = await resolvedDispute(app.id, { counterQuantity: 1200, resolution: 'counter_accepted' });
    // A change order approved after the period (+40 CY on the line's item at $7.25 = $290.00), and one approved
    // inside the period (its work could be in the application, so it is no exception).
    for (const [decidedAt, delta, title] of [
      ['2026-11-15T10:00:00Z', 40, 'Ditch extension'],
      ['2026-10-10T10:00:00Z', 10, 'Inside the period'],
    ] as const) {
      const [co] = await t.database.db
        .insert(changeOrders)
        .values({
          projectId: world.home.id,
          number: 1000 + number * 10 + delta,
          title,
          reason: 'Field change',
          status: 'approved',
          proposedByUserId: world.people.subcontractor.id,
          decidedAt: new Date(decidedAt),
        })
        .returning();
      await t.database.db
        .insert(changeOrderItems)
        .values({ changeOrderId: co!.id, kind: 'change_quantity', bidItemId: line!.bidItemId, quantityDelta: delta });
    }
    const res = await issue(app.id, {
      kind: 'conditional_progress',
      exceptions: [{ description: 'Standby of the excavator, 2 days, by letter of 3 November', amountCents: 184_000 }],
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(
      res.body.waiver.exceptions.map((e: { kind: string; amountCents: number }) => [e.kind, e.amountCents]),
    ).toEqual([
      ['retainage_held', RETAINAGE],
      ['disputed', 72_500],
      ['change_order_unpaid', 29_000],
      ['signer_added', 184_000],
    ]);
    // $1,513.55 + $725.00 + $290.00 + $1,840.00 = $4,368.55, by hand.
    const text = await pdfText(res.body.waiver.downloadUrl);
    expect(text).toContain('does not waive or release the 4 amounts listed below ($4,368.55 in all)');
    for (const s of [
      '$1,513.55',
      '$725.00',
      'Ditch extension',
      '$290.00',
      'Standby of the excavator',
      '$1,840.00',
      'not legal advice',
    ])
      expect(text).toContain(s);
    expect(text).not.toContain('Inside the period');
    await t.database.db.delete(changeOrderItems);
    await t.database.db.delete(changeOrders);
  });

  it('keep nothing open on a line certified at a quantity the subcontractor proposed itself', async () => {
    const app = await newApp();
    // Claimed 1,300 CY, countered at 1,100 CY; the subcontractor proposed 1,200 CY, which was certified.
    await resolvedDispute(app.id, { counterQuantity: 1100, resolution: 'quantity_proposed' });
    const res = await issue(app.id, { kind: 'conditional_progress' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.waiver.exceptions.map((e: { kind: string }) => e.kind)).toEqual(['retainage_held']);
  });

  it('refuse a bad added exception with the field named, and save nothing', async () => {
    const app = await newApp();
    const res = await issue(app.id, {
      kind: 'conditional_progress',
      exceptions: [
        { description: 'Extra', amountCents: 10.5 },
        { description: 'ok', amountCents: 0 },
      ],
    });
    expect(res.status).toBe(400);
    const paths = res.body.error.details.map((d: { path: string }) => d.path);
    expect(paths).toEqual(
      expect.arrayContaining(['exceptions.0.amountCents', 'exceptions.1.description', 'exceptions.1.amountCents']),
    );
    expect(await t.database.db.select().from(lienWaivers).where(eq(lienWaivers.payAppId, app.id))).toHaveLength(0);
  });
});

describe('waiver timing', () => {
  it('a conditional waiver only while the payment has not settled: refused with WAIVER_PAYMENT_SETTLED after', async () => {
    const app = await newApp();
    expect((await listed(app.id)).options[0]).toMatchObject({
      kind: 'conditional_progress',
      allowed: true,
      code: null,
    });
    await paid(app);
    expect((await listed(app.id)).options[0]).toMatchObject({ allowed: false, code: 'WAIVER_PAYMENT_SETTLED' });
    const res = await issue(app.id, { kind: 'conditional_progress' });
    expect([res.status, res.body.error.code]).toEqual([409, 'WAIVER_PAYMENT_SETTLED']);
  });

  it('an unconditional one only after: WAIVER_PAYMENT_NOT_SETTLED before; a repeat is WAIVER_ALREADY_ISSUED', async () => {
    const app = await newApp();
    const early = await issue(app.id, { kind: 'unconditional_progress' });
    expect([early.status, early.body.error.code]).toEqual([409, 'WAIVER_PAYMENT_NOT_SETTLED']);
    expect((await issue(app.id, { kind: 'conditional_progress' })).status).toBe(201);
    const again = await issue(app.id, { kind: 'conditional_progress' });
    expect([again.status, again.body.error.code]).toEqual([409, 'WAIVER_ALREADY_ISSUED']);
  });

  it('a final waiver only with the final payment: final forms on a progress application and progress forms on the final one are refused', async () => {
    const progress = await newApp();
    const finalOnProgress = await issue(progress.id, { kind: 'conditional_final' });
    expect([finalOnProgress.status, finalOnProgress.body.error.code]).toEqual([409, 'WAIVER_NOT_FINAL_PAYMENT']);
    const last = await newApp({ isFinal: true });
    const progressOnFinal = await issue(last.id, { kind: 'unconditional_progress' });
    expect([progressOnFinal.status, progressOnFinal.body.error.code]).toEqual([409, 'WAIVER_FINAL_APPLICATION']);
    // Paid in part: the unconditional final waiver waits for the whole.
    await allowPartialPayments(t.database.db, world.home.id);
    const { sessionId } = await startPayment(owner, last.id, { partialAmountCents: 100_000 });
    await confirm(t.standin, sessionId, { card: CARD_OK });
    const partial = await issue(last.id, { kind: 'unconditional_final' });
    expect([partial.status, partial.body.error.code]).toEqual([409, 'WAIVER_FINAL_NOT_PAID_IN_FULL']);
    await allowPartialPayments(t.database.db, world.home.id, false);
  });

  it('an uncertified application is refused with WAIVER_NOT_CERTIFIED (for the subcontractor who can see it)', async () => {
    const app = await newApp({ status: 'submitted' });
    const res = await issue(app.id, { kind: 'conditional_progress' });
    expect([res.status, res.body.error.code]).toEqual([409, 'WAIVER_NOT_CERTIFIED']);
  });
});

describe('who may see and sign', () => {
  it('every role on the project reads the exceptions; only the subcontractor signs; another company’s person sees nothing', async () => {
    const app = await newApp();
    for (const role of ['owner', 'general_contractor', 'admin', 'subcontractor_admin', 'owner_admin'] as const) {
      const agent = await signedInAgent(t.app, world.people[role].email);
      const list = await agent.get(`/api/projects/${world.home.id}/lien-waivers`);
      expect(list.status, role).toBe(200);
      expect(list.body.payApps.find((a: { id: string }) => a.id === app.id).exceptions[0].amountCents, role).toBe(
        RETAINAGE,
      );
      const post = await agent.post(`/api/pay-apps/${app.id}/lien-waivers`).send({
        kind: 'conditional_progress',
        signedName: NAME,
        exceptions: [{ description: 'Not mine to add', amountCents: 100 }],
      });
      expect(post.status, role).toBe(403);
    }
    const outsider = await signedInAgent(t.app, world.outsider.email);
    expect((await outsider.get(`/api/projects/${world.home.id}/lien-waivers`)).status).toBe(404);
    expect(
      (
        await outsider
          .post(`/api/pay-apps/${app.id}/lien-waivers`)
          .send({ kind: 'conditional_progress', signedName: NAME })
      ).status,
    ).toBe(404);
    expect(await t.database.db.select().from(lienWaivers).where(eq(lienWaivers.payAppId, app.id))).toHaveLength(0);
  });
});

describe('waiver e-mails', () => {
  it('a settled payment asks the subcontractor for the unconditional waiver; signing tells the general contractor and the owner', async () => {
    const app = await newApp();
    await paid(app);
    const asked = await waitForMail(
      t.mailbox,
      (m) => m.subject === `Lien waiver requested: pay application ${app.number}, Home`,
    );
    expect(asked.to).toEqual([world.people.subcontractor.email]);
    expect(asked.text).toContain('Unconditional waiver on progress payment');
    expect(asked.text).toContain('$13,621.90');
    const res = await issue(app.id, { kind: 'unconditional_progress' });
    expect(res.status).toBe(201);
    const signed = await waitForMail(
      t.mailbox,
      (m) => m.subject === `Lien waiver signed: pay application ${app.number}, Home`,
    );
    expect([...signed.to].sort()).toEqual([world.people.general_contractor.email, world.people.owner.email].sort());
    expect(signed.text).toContain(`${NAME} signed the unconditional waiver on progress payment for $13,621.90`);
    expect(signed.text).toContain('It excepts $1,513.55');
    expect(signed.text).toContain(res.body.waiver.downloadUrl);
  });
});
