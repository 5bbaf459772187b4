import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { projects } from '../../server/db/schema';
import type { CaughtMail } from '../../server/integrations/mailer/smtp-sink';
import { quantityChange } from '../setup/change-order-factories';
import { addMember, makeBidItem, makeUser, makeWorld } from '../setup/factories';
import { waitForMail } from '../setup/mail';
import { makeBillableProject } from '../setup/pay-cycle-factories';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

// Who is told at each hand-off of a change order (issue 11, item 8), and that nobody else is: the proposer, a person
// without a seat, a former employee still holding an old seat, and the people of another project never are.
let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
type Person = { id: string; email: string };
let extra: { gc2: Person; formerGc: Person; formerSub: Person };
let item: { id: string };
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
  const db = t.database.db;
  const gc2 = await makeUser(db, t.auth, w.companies.gc.id);
  await addMember(db, w.home.id, gc2.id, 'general_contractor');
  // Holds a general contractor seat on the job but works for another company now: no power, and no mail.
  const formerGc = await makeUser(db, t.auth, w.companies.otherGc.id);
  await addMember(db, w.home.id, formerGc.id, 'general_contractor');
  // Likewise a former employee of the subcontractor on its old seat: no waiver request, no decision mail.
  const formerSub = await makeUser(db, t.auth, w.companies.otherSub.id);
  await addMember(db, w.home.id, formerSub.id, 'subcontractor');
  extra = { gc2, formerGc, formerSub };
  item = await makeBidItem(db, w.home.id, { itemNumber: 'E-7', unitPriceCents: 1250, contractQuantity: 800 });
});
afterAll(() => t.close());

type Who = keyof typeof w.people | 'gc2';
const email = (who: Who) => (who === 'gc2' ? extra.gc2.email : w.people[who].email);
const as = (who: Who) => signedInAgent(t.app, email(who));
const sorted = (list: readonly string[]) => [...list].sort();
const withSubject = (subject: string) => t.mailbox.messages().filter((m) => m.subject === subject);

/** The one message with this subject, once it arrived; a second one with the same subject fails the test. */
async function onlyMail(subject: string): Promise<CaughtMail> {
  const mail = await waitForMail(t.mailbox, (m) => m.subject === subject);
  expect(withSubject(subject)).toHaveLength(1);
  return mail;
}
const nobodyElse = (mail: CaughtMail) => {
  for (const never of [
    w.outsider.email,
    extra.formerGc.email,
    extra.formerSub.email,
    w.people.admin.email,
    w.people.owner_admin.email,
  ])
    expect(mail.to).not.toContain(never);
};

async function propose(who: Who, title: string, delta = 40) {
  const res = await (
    await as(who)
  )
    .post(`/api/projects/${w.home.id}/change-orders`)
    .send(quantityChange(item.id, delta, title));
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.changeOrder as { id: string; number: number };
}
const decide = async (who: Who, id: string, decision: 'approve' | 'reject', note: string) => {
  const res = await (await as(who)).post(`/api/change-orders/${id}/${decision}`).send({ note });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body.changeOrder as { status: string };
};
const setOwnerApproves = (on: boolean) =>
  t.database.db.update(projects).set({ ownerApprovesChangeOrders: on }).where(eq(projects.id, w.home.id));

describe('change order e-mails', () => {
  it('a proposal goes to those who decide it: the general contractor’s people, with the exact link', async () => {
    const co = await propose('subcontractor', 'Haul road widening');
    const mail = await onlyMail(`Change order ${co.number} proposed: Haul road widening, Home`);
    expect(sorted(mail.to)).toEqual(sorted([w.people.general_contractor.email, extra.gc2.email]));
    nobodyElse(mail);
    expect(mail.to).not.toContain(w.people.subcontractor.email); // the proposer
    expect(mail.to).not.toContain(w.people.owner.email); // does not decide on this project
    const link = `/projects/${w.home.id}/change-orders/${co.id}`;
    expect(mail.text).toContain(link);
    expect(mail.html).toContain(link);
    // 40 CY x $12.50 = $500.00 (by hand)
    expect(mail.text).toContain('Item E-7: quantity +40.00 CY');
    expect(mail.text).toContain('Net change to the contract sum: +$500.00.');
    expect(mail.text).toContain('Reason: Field conditions');
  });

  it('where the owner approves too, the owner is asked as well; the contract side’s approval alone tells nobody; the last approval tells the subcontractor and the general contractor', async () => {
    await setOwnerApproves(true);
    try {
      const co = await propose('subcontractor', 'Second outlet');
      const asked = await onlyMail(`Change order ${co.number} proposed: Second outlet, Home`);
      expect(sorted(asked.to)).toEqual(
        sorted([w.people.general_contractor.email, extra.gc2.email, w.people.owner.email]),
      );
      expect(asked.text).toContain('once both the general contractor and the owner approve it');
      nobodyElse(asked);
      expect((await decide('general_contractor', co.id, 'approve', 'Fine by us')).status).toBe('proposed');
      expect((await decide('owner', co.id, 'approve', 'Funded from contingency')).status).toBe('approved');
      const approved = await onlyMail(`Change order ${co.number} approved: Second outlet, Home`);
      expect(sorted(approved.to)).toEqual(
        sorted([w.people.subcontractor.email, w.people.general_contractor.email, extra.gc2.email]),
      );
      expect(approved.to).not.toContain(w.people.owner.email); // decided it
      nobodyElse(approved);
      expect(approved.text).toContain('Note: Funded from contingency');
      expect(approved.text).toContain(`/projects/${w.home.id}/change-orders/${co.id}`);
      // Only the final approval sends mail: the general contractor's half-way approval queued none.
      expect(t.mailbox.messages().filter((m) => m.subject.startsWith(`Change order ${co.number} `))).toHaveLength(2);
    } finally {
      await setOwnerApproves(false);
    }
  });

  it('the general contractor’s proposal rejected by a colleague: the proposer and the subcontractor hear why', async () => {
    const co = await propose('general_contractor', 'Extra topsoil', -25);
    const asked = await onlyMail(`Change order ${co.number} proposed: Extra topsoil, Home`);
    expect(asked.to).toEqual([extra.gc2.email]); // never the proposer
    expect(asked.text).toContain('Net change to the contract sum: -$312.50.'); // -25 CY x $12.50, by hand
    await decide('gc2', co.id, 'reject', 'Not in the owner’s scope');
    const rejected = await onlyMail(`Change order ${co.number} rejected: Extra topsoil, Home`);
    expect(sorted(rejected.to)).toEqual(sorted([w.people.general_contractor.email, w.people.subcontractor.email]));
    expect(rejected.to).not.toContain(extra.gc2.email);
    expect(rejected.to).not.toContain(w.people.owner.email);
    nobodyElse(rejected);
    expect(rejected.text).toContain('Note: Not in the owner’s scope');
    expect(rejected.text).toContain('The contract stays as it was.');
  });

  it('the subcontractor’s proposal approved by the general contractor: the subcontractor hears it, the approver does not', async () => {
    const co = await propose('subcontractor', 'Rock excavation', 15);
    await onlyMail(`Change order ${co.number} proposed: Rock excavation, Home`);
    await decide('gc2', co.id, 'approve', '');
    const approved = await onlyMail(`Change order ${co.number} approved: Rock excavation, Home`);
    expect(approved.to).toEqual([w.people.subcontractor.email]);
    expect(approved.text).toContain('The bid schedule and the contract sum now include it.');
  });

  it('a refused proposal or decision queues no mail', async () => {
    const before = t.mailbox.messages().length;
    const owner = await as('owner');
    expect(
      (await owner.post(`/api/projects/${w.home.id}/change-orders`).send(quantityChange(item.id, 5, 'Nope'))).status,
    ).toBe(403);
    const co = await propose('subcontractor', 'Undecided drainage');
    await onlyMail(`Change order ${co.number} proposed: Undecided drainage, Home`);
    expect((await owner.post(`/api/change-orders/${co.id}/approve`).send({ note: '' })).status).toBe(403);
    const outsider = await signedInAgent(t.app, w.outsider.email);
    expect((await outsider.post(`/api/change-orders/${co.id}/reject`).send({ note: 'x' })).status).toBe(404);
    expect(
      (await (await as('subcontractor')).post(`/api/change-orders/${co.id}/approve`).send({ note: '' })).status,
    ).toBe(403);
    // A later proposal as a marker: the outbox sends in order, so a stray message queued by a refusal would be in.
    const marker = await propose('subcontractor', 'Marker after refusals');
    await onlyMail(`Change order ${marker.number} proposed: Marker after refusals, Home`);
    expect(t.mailbox.messages().length).toBe(before + 2);
  });
});

describe('waiver request at certification', () => {
  it('certifying asks the subcontractor (only) for the conditional waiver of the amount due, deferring to the statute', async () => {
    const db = t.database.db;
    await makeBillableProject(db, w.home.id, w.people.subcontractor.id, (o) => makeBidItem(db, w.home.id, o));
    const sub = await as('subcontractor');
    const gc = await as('general_contractor');
    const created = await sub
      .post(`/api/projects/${w.home.id}/pay-apps`)
      .send({ periodStart: '2026-10-01', periodEnd: '2026-10-31' });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const id = created.body.payApp.id as string;
    expect((await sub.post(`/api/pay-apps/${id}/submit`).send({ expectedRevision: 0 })).status).toBe(200);
    const app = (await gc.get(`/api/pay-apps/${id}`)).body.payApp;
    const reviewed = await gc.post(`/api/pay-apps/${id}/review`).send({
      expectedRevision: 0,
      lines: app.lines.map((l: { id: string }) => ({ lineId: l.id, decision: 'approve' })),
    });
    expect(reviewed.status, JSON.stringify(reviewed.body)).toBe(200);
    const certified = await gc.post(`/api/pay-apps/${id}/certify`).send({
      expectedRevision: 0,
      acknowledgedFlags: reviewed.body.payApp.flags.map((f: { key: string }) => f.key),
    });
    expect(certified.status, JSON.stringify(certified.body)).toBe(200);
    const due = certified.body.payApp.currentDueCents as number;
    const asked = await onlyMail(`Conditional lien waiver requested: pay application ${app.number}, Home`);
    expect(asked.to).toEqual([w.people.subcontractor.email]);
    expect(asked.text).toContain('Conditional waiver on progress payment');
    expect(asked.text).toContain(
      `$${(due / 100).toLocaleString('en-US', { minimumFractionDigits: 2, maximumFractionDigits: 2 })}`,
    );
    expect(asked.text).toContain('governing statute');
    expect(asked.text).toContain(`/projects/${w.home.id}/waivers`);
  });
});
