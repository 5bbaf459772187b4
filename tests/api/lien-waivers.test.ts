import { eq } from 'drizzle-orm';
import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { lienWaivers, projects, user } from '../../server/db/schema';
import { makeWorld } from '../setup/factories';
import { makeCertifiedPayApp } from '../setup/payment-factories';
import { confirm, startPayment } from '../setup/payment-flow';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

// Due on the factory's default lines: $13,621.90 (worked by hand in tests/api/payments.test.ts).
const DUE = 1_362_190;

let t: TestApp;
let world: Awaited<ReturnType<typeof makeWorld>>;
let sub: Awaited<ReturnType<typeof signedInAgent>>;
let owner: Awaited<ReturnType<typeof signedInAgent>>;
let number = 0;

beforeAll(async () => {
  t = await createTestApp();
  world = await makeWorld(t.database.db, t.auth);
  // A California job: its waivers must name Civil Code sections 8132 to 8138 (reference.md).
  await t.database.db.update(projects).set({ state: 'CA' }).where(eq(projects.id, world.home.id));
  // Waivers are signed under the signer's account name: the subcontractor's person is Dana Whitfield.
  await t.database.db.update(user).set({ name: 'Dana Whitfield' }).where(eq(user.id, world.people.subcontractor.id));
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
const issue = (payAppId: string, body: object) => sub.post(`/api/pay-apps/${payAppId}/lien-waivers`).send(body);

async function pdfText(agent: typeof sub, url: string) {
  const res = await agent
    .get(url)
    .buffer(true)
    .parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
  expect(res.status).toBe(200);
  expect(res.headers['content-type']).toBe('application/pdf');
  const parser = new PDFParse({ data: new Uint8Array(res.body as Buffer) });
  const { text } = await parser.getText();
  await parser.destroy();
  return text.replace(/\s+/g, ' ');
}

describe('lien waivers', () => {
  it('the subcontractor issues a conditional progress waiver for the amount due, through the period end, as a readable PDF', async () => {
    const app = await newApp();
    const res = await issue(app.id, { kind: 'conditional_progress', signedName: 'Dana Whitfield' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.waiver).toMatchObject({
      kind: 'conditional_progress',
      amountCents: DUE,
      throughDate: '2026-10-31',
      signedName: 'Dana Whitfield',
      signedByUserId: world.people.subcontractor.id,
      paymentId: null,
    });
    const text = await pdfText(owner, res.body.waiver.downloadUrl);
    expect(text).toContain('Conditional waiver on progress payment');
    expect(text).toContain('$13,621.90');
    expect(text).toContain('2026-10-31');
    expect(text).toContain('Dana Whitfield');
    expect(text).toContain('California Civil Code sections 8132 to 8138');
    expect(text).toContain('not legal advice');
    // The same form twice for one application is refused.
    expect((await issue(app.id, { kind: 'conditional_progress', signedName: 'Dana Whitfield' })).status).toBe(409);
  });

  it('refuses an unconditional waiver before the payment settles (409) and issues it after, for the payment', async () => {
    const app = await newApp();
    const early = await issue(app.id, { kind: 'unconditional_progress', signedName: 'Dana Whitfield' });
    expect(early.status).toBe(409);
    expect(early.body.error.code).toBe('WAIVER_PAYMENT_NOT_SETTLED');
    const { paymentId, sessionId } = await startPayment(owner, app.id);
    await confirm(t.standin, sessionId, { account: '000000000009' }); // stays processing (Stripe's test account)
    expect((await issue(app.id, { kind: 'unconditional_progress', signedName: 'Dana Whitfield' })).status).toBe(409);
    const paid = await newApp();
    const p2 = await startPayment(owner, paid.id);
    await confirm(t.standin, p2.sessionId, { card: '4242424242424242' });
    const res = await issue(paid.id, { kind: 'unconditional_progress', signedName: 'Dana Whitfield' });
    expect(res.status).toBe(201);
    expect(res.body.waiver).toMatchObject({ paymentId: p2.paymentId, amountCents: DUE });
    expect(paymentId).not.toBe(p2.paymentId);
  });

  it('a final application uses the final forms; the unconditional final one only once it is paid in full', async () => {
    const app = await newApp({ isFinal: true });
    expect((await issue(app.id, { kind: 'conditional_progress', signedName: 'Dana Whitfield' })).status).toBe(409);
    expect((await issue(app.id, { kind: 'conditional_final', signedName: 'Dana Whitfield' })).status).toBe(201);
    expect((await issue(app.id, { kind: 'unconditional_final', signedName: 'Dana Whitfield' })).status).toBe(409);
    const { sessionId } = await startPayment(owner, app.id);
    await confirm(t.standin, sessionId, { card: '4242424242424242' });
    const res = await issue(app.id, { kind: 'unconditional_final', signedName: 'Dana Whitfield' });
    expect(res.status).toBe(201);
    expect(await pdfText(sub, res.body.waiver.downloadUrl)).toContain('Unconditional waiver on final payment');
  });

  it('refuses an uncertified application, a missing name, and anyone but the subcontractor', async () => {
    const draft = await newApp({ status: 'submitted' });
    expect((await issue(draft.id, { kind: 'conditional_progress', signedName: 'Dana Whitfield' })).status).toBe(409);
    const app = await newApp();
    const noName = await issue(app.id, { kind: 'conditional_progress', signedName: ' ' });
    expect(noName.status).toBe(400);
    expect(noName.body.error.details[0].path).toBe('signedName');
    // The subcontractor company's admin holds no seat here: it does not sign either.
    for (const role of ['owner', 'general_contractor', 'admin', 'subcontractor_admin'] as const) {
      const agent = await signedInAgent(t.app, world.people[role].email);
      expect(
        (
          await agent
            .post(`/api/pay-apps/${app.id}/lien-waivers`)
            .send({ kind: 'conditional_progress', signedName: 'X Y' })
        ).status,
        role,
      ).toBe(403);
    }
    expect(await t.database.db.select().from(lienWaivers).where(eq(lienWaivers.payAppId, app.id))).toHaveLength(0);
  });

  it('lists waivers and options per project for its people; 404 off the project, for the list and the PDF', async () => {
    const app = await newApp();
    const made = await issue(app.id, { kind: 'conditional_progress', signedName: 'Dana Whitfield' });
    const list = await owner.get(`/api/projects/${world.home.id}/lien-waivers`);
    expect(list.status).toBe(200);
    expect(list.body.state).toBe('CA');
    expect(list.body.waivers.map((w: { id: string }) => w.id)).toContain(made.body.waiver.id);
    const entry = list.body.payApps.find((a: { id: string }) => a.id === app.id);
    expect(entry.options.map((o: { kind: string; allowed: boolean }) => [o.kind, o.allowed])).toEqual([
      ['conditional_progress', false],
      ['unconditional_progress', false],
    ]);
    const outsider = await signedInAgent(t.app, world.outsider.email);
    expect((await outsider.get(`/api/projects/${world.home.id}/lien-waivers`)).status).toBe(404);
    expect((await outsider.get(made.body.waiver.downloadUrl)).status).toBe(404);
  });
});
