import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { emailOutbox } from '../../server/db/schema';
import { addMember, makeBidItem, makeUser, makeWorld } from '../setup/factories';
import { makeBillableProject } from '../setup/pay-cycle-factories';
import { confirm, startPayment } from '../setup/payment-flow';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

// Every mail of a pay application's life (submitted, returned with a dispute, certified, the conditional and
// unconditional waiver requests, the receipt, the signed waiver) goes to the people who hold the seat for its
// company today. Someone who left the company keeps an old seat row (access already ignores it); no mail may follow
// that row either. Card number: Stripe's testing documentation (reference.md section 8).

let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
let former: string[];
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
  const db = t.database.db;
  await makeBillableProject(db, w.home.id, w.people.subcontractor.id, (o) => makeBidItem(db, w.home.id, o));
  // Each one holds a seat on the job but works for another company now.
  const seats = [
    ['subcontractor', w.companies.otherSub.id],
    ['general_contractor', w.companies.otherGc.id],
    ['owner', w.companies.otherOwner.id],
  ] as const;
  former = [];
  for (const [role, companyId] of seats) {
    const person = await makeUser(db, t.auth, companyId);
    await addMember(db, w.home.id, person.id, role);
    former.push(person.email);
  }
});
afterAll(() => t.close());

const as = (who: keyof typeof w.people) => signedInAgent(t.app, w.people[who].email);
const flagKeys = async (agent: Awaited<ReturnType<typeof as>>, id: string) =>
  ((await agent.get(`/api/pay-apps/${id}`)).body.payApp.flags as { key: string }[]).map((f) => f.key);
type Line = { id: string; itemNumber: string };

describe('who a pay application’s mail reaches', () => {
  it('through submit, dispute, revision, certification, payment and waivers: the seat holders of today only', async () => {
    const sub = await as('subcontractor');
    const gc = await as('general_contractor');
    const compiled = await sub
      .post(`/api/projects/${w.home.id}/pay-apps`)
      .send({ periodStart: '2026-10-01', periodEnd: '2026-10-31' });
    expect(compiled.status, JSON.stringify(compiled.body)).toBe(201);
    const id = compiled.body.payApp.id as string;
    const lines = compiled.body.payApp.lines as Line[];
    const lineOf = (item: string) => lines.find((l) => l.itemNumber === item)!.id;

    expect((await sub.post(`/api/pay-apps/${id}/submit`).send({ expectedRevision: 0 })).status).toBe(200);
    const returned = await gc.post(`/api/pay-apps/${id}/review`).send({
      expectedRevision: 0,
      lines: [
        { lineId: lineOf('A-1'), decision: 'approve' },
        { lineId: lineOf('B-2'), decision: 'dispute', reason: 'Two runs were short', counterQuantity: 100 },
      ],
    });
    expect(returned.body.payApp?.status, JSON.stringify(returned.body)).toBe('returned');
    const revised = await sub.post(`/api/pay-apps/${id}/revise`).send({
      expectedRevision: 0,
      lines: [{ lineId: lineOf('B-2'), action: 'accept', comment: 'Agreed.' }],
    });
    expect(revised.status, JSON.stringify(revised.body)).toBe(200);
    expect((await sub.post(`/api/pay-apps/${id}/submit`).send({ expectedRevision: 1 })).status).toBe(200);
    await gc
      .post(`/api/pay-apps/${id}/review`)
      .send({ expectedRevision: 1, lines: [{ lineId: lineOf('B-2'), decision: 'approve' }] });
    const certified = await gc
      .post(`/api/pay-apps/${id}/certify`)
      .send({ expectedRevision: 1, acknowledgedFlags: await flagKeys(gc, id) });
    expect(certified.body.payApp?.status, JSON.stringify(certified.body)).toBe('certified');

    const owner = await as('owner');
    const { sessionId } = await startPayment(owner, id);
    expect((await confirm(t.standin, sessionId, { card: '4242 4242 4242 4242' })).outcome).toBe('succeeded');
    await t.outboxIdle();

    const mails = await t.database.db.select().from(emailOutbox);
    const templates = new Set(mails.map((m) => m.template));
    // The life above queued each of these; a template missing here means the test no longer covers it.
    for (const template of ['pay_app.submitted', 'pay_app.returned', 'pay_app.certified', 'payment.receipt'])
      expect([...templates]).toContain(template);
    for (const mail of mails) {
      for (const address of former) expect(mail.toAddresses, `${mail.template} to ${address}`).not.toContain(address);
      expect(mail.toAddresses, mail.template).not.toContain(w.outsider.email);
    }
    const receipt = mails.find((m) => m.template === 'payment.receipt')!;
    expect([...receipt.toAddresses].sort()).toEqual(
      [w.people.owner.email, w.people.general_contractor.email, w.people.subcontractor.email].sort(),
    );
  });
});
