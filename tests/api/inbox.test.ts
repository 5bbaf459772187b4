import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { PayAppStatus } from '../../src/shared/constants';
import type { InboxEntryView, InboxView } from '../../src/shared/schemas/inbox';
import {
  changeOrders,
  disputes,
  invitations,
  lienWaivers,
  payAppLines,
  payApps,
  payments,
  projects,
  companyMembers,
  user,
} from '../../server/db/schema';
import { makeWorld } from '../setup/factories';
import { makeCertifiedPayApp } from '../setup/payment-factories';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

// What waits on whom comes from the product brief's pay application life and roles (shared/design/product.md):
// the subcontractor submits, revises and answers disputes and signs waivers; the general contractor reviews,
// certifies and decides change orders; the owner pays; the admin manages invitations. Payment is due the
// project's payment terms after certification (common practice for a pay-when-certified contract).
let t: TestApp;
let world: Awaited<ReturnType<typeof makeWorld>>;
type Key =
  | 'draft'
  | 'submitted'
  | 'inReview'
  | 'returned'
  | 'overdue'
  | 'certified'
  | 'paid'
  | 'payment'
  | 'foreignSubmitted'
  | 'changeOrder'
  | 'foreignChangeOrder'
  | 'invitation'
  | 'expiredInvitation'
  | 'foreignInvitation';
const ids = {} as Record<Key, string>;
const DAY = 86_400_000;

type Agent = Awaited<ReturnType<typeof signedInAgent>>;
const agents: Record<'subcontractor' | 'general_contractor' | 'owner' | 'admin' | 'outsider', Agent> = {} as never;

async function inboxOf(agent: Agent): Promise<InboxView> {
  const res = await agent.get('/api/inbox');
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body as InboxView;
}
const titles = (v: InboxView) => v.entries.map((e) => e.title);
const find = (v: InboxView, id: string) => v.entries.find((e) => e.id.endsWith(id));

beforeAll(async () => {
  t = await createTestApp();
  const db = t.database.db;
  world = await makeWorld(t.database.db, t.auth);
  const sub = world.people.subcontractor.id;
  const gc = world.people.general_contractor.id;
  const app = (number: number, status: PayAppStatus, projectId = world.home.id) =>
    makeCertifiedPayApp(db, projectId, sub, { number, status });
  // Waivers are signed under the account's own name; the outsider administers its general contractor company, so it
  // follows the invitations to that company's seat on its own job.
  await db.update(user).set({ name: 'Dana Whitfield' }).where(eq(user.id, sub));
  await db.update(companyMembers).set({ isAdmin: true }).where(eq(companyMembers.userId, world.outsider.id));
  ids.draft = (await app(1, 'draft')).id;
  ids.submitted = (await app(2, 'submitted')).id;
  ids.inReview = (await app(3, 'in_review')).id;
  ids.returned = (await app(4, 'returned')).id;
  ids.overdue = (await app(5, 'certified')).id;
  ids.certified = (await app(6, 'certified')).id;
  ids.paid = (await app(7, 'paid')).id;
  ids.foreignSubmitted = (await app(1, 'submitted', world.foreign.id)).id;
  // Pay application 5 was certified 40 days ago: past the 30-day terms of the project defaults.
  await db
    .update(payApps)
    .set({ certifiedAt: new Date(Date.now() - 40 * DAY) })
    .where(eq(payApps.id, ids.overdue));
  const [line] = await db.select().from(payAppLines).where(eq(payAppLines.payAppId, ids.returned)).limit(1);
  await db.insert(disputes).values({
    payAppId: ids.returned,
    lineId: line!.id,
    revision: 0,
    reason: 'Short',
    counterQuantity: 1,
    openedByUserId: gc,
  });
  // Pay application 7 was paid by a settled payment; its unconditional waiver is not issued yet.
  const [payment] = await db
    .insert(payments)
    .values({
      projectId: world.home.id,
      payAppId: ids.paid,
      amountCents: 1_362_190,
      status: 'succeeded',
      idempotencyKey: 'inbox-paid',
      settledAt: new Date(),
      createdByUserId: world.people.owner.id,
    })
    .returning();
  ids.payment = payment!.id;
  const [co] = await db
    .insert(changeOrders)
    .values({ projectId: world.home.id, number: 1, title: 'Extra rock', proposedByUserId: sub })
    .returning();
  ids.changeOrder = co!.id;
  const [foreignCo] = await db
    .insert(changeOrders)
    .values({ projectId: world.foreign.id, number: 1, title: 'Foreign', proposedByUserId: world.outsider.id })
    .returning();
  ids.foreignChangeOrder = foreignCo!.id;
  const invite = (email: string, projectId: string, expiresAt: Date) =>
    db
      .insert(invitations)
      .values({
        projectId,
        email,
        role: 'general_contractor',
        tokenHash: `inbox-${email}`,
        invitedByUserId: gc,
        expiresAt,
      })
      .returning();
  ids.invitation = (await invite('new.owner@example.test', world.home.id, new Date(Date.now() + 7 * DAY)))[0]!.id;
  ids.expiredInvitation = (await invite('late.owner@example.test', world.home.id, new Date(Date.now() - DAY)))[0]!.id;
  ids.foreignInvitation = (await invite('foreign@example.test', world.foreign.id, new Date(Date.now() + DAY)))[0]!.id;

  for (const role of ['subcontractor', 'general_contractor', 'owner', 'admin'] as const)
    agents[role] = await signedInAgent(t.app, world.people[role].email);
  agents.outsider = await signedInAgent(t.app, world.outsider.email);
});
afterAll(() => t?.close());

describe('GET /api/inbox', () => {
  it('answers 401 without a session', async () => {
    const { default: request } = await import('supertest');
    expect((await request(t.app).get('/api/inbox')).status).toBe(401);
  });

  it('the subcontractor: submit the draft, answer the disputes, sign waivers; nothing the others do', async () => {
    const v = await inboxOf(agents.subcontractor);
    expect(find(v, ids.draft)).toMatchObject({
      kind: 'pay_app_submit',
      title: 'Submit pay application 1',
      href: `/projects/${world.home.id}/pay-apps/${ids.draft}`,
    });
    expect(find(v, ids.returned)).toMatchObject({
      kind: 'pay_app_answer',
      title: 'Answer the disputes on pay application 4',
      detail: '1 disputed line, returned at revision 0',
    });
    // Conditional waivers on the two certified applications, the unconditional one on the paid application.
    const waivers = v.entries.filter((e) => e.kind === 'waiver_sign').map((e) => e.title);
    expect(waivers.sort()).toEqual([
      'Sign the conditional progress waiver on pay application 5',
      'Sign the conditional progress waiver on pay application 6',
      'Sign the unconditional progress waiver on pay application 7',
    ]);
    expect(find(v, `unconditional_progress:${ids.paid}`)).toMatchObject({
      amountCents: 1_362_190,
      href: `/projects/${world.home.id}/waivers`,
    });
    for (const kind of [
      'pay_app_review',
      'pay_app_certify',
      'payment_due',
      'change_order_decide',
      'invitation_pending',
      'waiver_request',
    ]) {
      expect(
        v.entries.filter((e) => e.kind === kind),
        kind,
      ).toEqual([]);
    }
    expect(v.counts.total).toBe(v.entries.length);
    expect(v.counts.byKind).toEqual({ pay_app_submit: 1, pay_app_answer: 1, waiver_sign: 3 });
  });

  it('the general contractor: review the submitted, certify the one in review, decide the change order', async () => {
    const v = await inboxOf(agents.general_contractor);
    expect(find(v, ids.submitted)).toMatchObject({ kind: 'pay_app_review', title: 'Review pay application 2' });
    expect(find(v, ids.inReview)).toMatchObject({ kind: 'pay_app_certify', title: 'Certify pay application 3' });
    expect(find(v, ids.changeOrder)).toMatchObject({
      kind: 'change_order_decide',
      title: 'Decide change order 1: Extra rock',
      href: `/projects/${world.home.id}/change-orders/${ids.changeOrder}`,
    });
    // Invitations are followed by the admin of the seat's company, not by a person of the seat (issue 10).
    expect(find(v, ids.invitation)).toBeUndefined();
    expect(find(v, `unconditional_progress:${ids.paid}`)).toMatchObject({
      kind: 'waiver_request',
      title: 'Ask for the unconditional progress waiver on pay application 7',
    });
    // Never the subcontractor's moves, never a payment.
    expect(
      v.entries.filter((e) =>
        ['pay_app_submit', 'pay_app_answer', 'pay_app_revise', 'waiver_sign', 'payment_due'].includes(e.kind),
      ),
    ).toEqual([]);
  });

  it('the owner: pay the certified applications, the one past the payment terms overdue and first; no uncertified application', async () => {
    const v = await inboxOf(agents.owner);
    const due = v.entries.filter((e) => e.kind === 'payment_due');
    expect(due.map((e) => e.title)).toEqual(['Payment due on pay application 5', 'Payment due on pay application 6']);
    expect(due[0]).toMatchObject({
      overdue: true,
      amountCents: 1_362_190,
    });
    // The owner pays from the application itself (its payment card).
    expect(due[0]!.href).toMatch(new RegExp(`^/projects/${world.home.id}/pay-apps/[0-9a-f-]{36}$`));
    expect(due[1]!.overdue).toBe(false);
    // Due 30 days after certification (project defaults' payment terms).
    expect(Date.parse(due[0]!.dueAt!) - Date.parse(due[0]!.since)).toBe(30 * DAY);
    expect(v.entries[0]!.id).toBe(due[0]!.id);
    expect(v.counts.overdue).toBe(1);
    // The owner does not see applications before certification, not even as a count.
    const seen = JSON.stringify(v);
    for (const hidden of [ids.draft, ids.submitted, ids.inReview, ids.returned]) expect(seen).not.toContain(hidden);
    // Change orders wait on the owner only where the project asks for the owner's approval.
    expect(find(v, ids.changeOrder)).toBeUndefined();
    expect(find(v, ids.invitation)).toBeUndefined();
  });

  it('the owner decides change orders where the project requires the owner’s approval, after or before the general contractor', async () => {
    const db = t.database.db;
    await db.update(projects).set({ ownerApprovesChangeOrders: true }).where(eq(projects.id, world.home.id));
    try {
      expect(find(await inboxOf(agents.owner), ids.changeOrder)).toMatchObject({ kind: 'change_order_decide' });
      await db
        .update(changeOrders)
        .set({ gcApprovedAt: new Date(), gcApprovedByUserId: world.people.general_contractor.id })
        .where(eq(changeOrders.id, ids.changeOrder));
      expect(find(await inboxOf(agents.general_contractor), ids.changeOrder)).toBeUndefined();
      expect(find(await inboxOf(agents.owner), ids.changeOrder)).toMatchObject({
        detail: expect.stringContaining('the general contractor has approved'),
      });
    } finally {
      await db
        .update(changeOrders)
        .set({ gcApprovedAt: null, gcApprovedByUserId: null })
        .where(eq(changeOrders.id, ids.changeOrder));
      await db.update(projects).set({ ownerApprovesChangeOrders: false }).where(eq(projects.id, world.home.id));
    }
  });

  it('the admin of the general contractor follows the invitations to its seat and takes no pay application step', async () => {
    const v = await inboxOf(agents.admin);
    expect(v.entries.map((e) => e.kind).sort()).toEqual(['invitation_pending', 'invitation_pending']);
    expect(find(v, ids.invitation)).toMatchObject({
      kind: 'invitation_pending',
      title: 'Invitation to new.owner@example.test not accepted yet',
      overdue: false,
    });
    expect(find(v, ids.expiredInvitation)).toMatchObject({
      title: 'Invitation to late.owner@example.test expired: send a new one',
      overdue: true,
    });
  });

  it("another company's admin does not follow the general contractor's invitations", async () => {
    const v = await inboxOf(await signedInAgent(t.app, world.people.owner_admin.email));
    expect(v.entries.filter((e) => e.kind === 'invitation_pending')).toEqual([]);
  });

  it('another job’s items never appear, and the outsider sees only its own job', async () => {
    for (const role of ['subcontractor', 'general_contractor', 'owner', 'admin'] as const) {
      const v = await inboxOf(agents[role]);
      expect(
        v.entries.every((e) => e.project.id === world.home.id),
        role,
      ).toBe(true);
      const text = JSON.stringify(v);
      for (const foreign of [ids.foreignSubmitted, ids.foreignChangeOrder, ids.foreignInvitation, world.foreign.id])
        expect(text).not.toContain(foreign);
    }
    const v = await inboxOf(agents.outsider);
    expect(titles(v).sort()).toEqual([
      'Decide change order 1: Foreign',
      'Invitation to foreign@example.test not accepted yet',
      'Review pay application 1',
    ]);
    expect(
      v.entries.every((e: InboxEntryView) => e.project.id === world.foreign.id && e.project.name === 'Foreign'),
    ).toBe(true);
  });

  it('an entry leaves the inbox once its step is taken: a payment under way, a waiver signed', async () => {
    const db = t.database.db;
    const [attempt] = await db
      .insert(payments)
      .values({
        projectId: world.home.id,
        payAppId: ids.certified,
        amountCents: 1,
        status: 'processing',
        idempotencyKey: 'inbox-processing',
        createdByUserId: world.people.owner.id,
      })
      .returning();
    expect(find(await inboxOf(agents.owner), `payment_due:${ids.certified}`)).toBeUndefined();
    await db.delete(payments).where(eq(payments.id, attempt!.id));
    const res = await agents.subcontractor
      .post(`/api/pay-apps/${ids.paid}/lien-waivers`)
      .send({ kind: 'unconditional_progress', signedName: 'Dana Whitfield' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(find(await inboxOf(agents.subcontractor), `unconditional_progress:${ids.paid}`)).toBeUndefined();
    expect(find(await inboxOf(agents.owner), `unconditional_progress:${ids.paid}`)).toBeUndefined();
    await db.delete(lienWaivers).where(eq(lienWaivers.payAppId, ids.paid));
  });
});
