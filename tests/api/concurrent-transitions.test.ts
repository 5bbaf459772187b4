import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { disputes, payAppLines, payApps, payAppStatusHistory, payments, projects } from '../../server/db/schema';
import { addMember, makeBidItem, makeProject, makeUser, makeWorld } from '../setup/factories';
import { auditActions, makeTally } from '../setup/pay-cycle-factories';
import { makeCertifiedPayApp } from '../setup/payment-factories';
import { confirm } from '../setup/payment-flow';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

/** Every flag of the application, acknowledged: these tests certify after looking at them. */
const flagKeys = async (
  agent: { get: (url: string) => PromiseLike<{ body: { payApp: { flags: { key: string }[] } } }> },
  payAppId: string,
) => (await agent.get(`/api/pay-apps/${payAppId}`)).body.payApp.flags.map((f) => f.key);

// Concurrent transitions through real HTTP requests (supertest, Promise.all). On PostgreSQL
// (scripts/test-postgres.sh) the requests run on separate pooled connections, so the conditional updates and
// row locks are what decide; on PGlite they interleave between queries on one connection. Either way exactly
// one request may win a transition and the totals may never count twice.

let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
});
afterAll(() => t?.close());

type Role = 'subcontractor' | 'general_contractor' | 'owner';
const as = (role: Role) => signedInAgent(t.app, w.people[role].email);
const statusesOf = (results: { status: number }[]) => results.map((r) => r.status).sort();

/** A second person in the same role on the project, so two people act at once. */
async function colleague(projectId: string, role: Role) {
  const company = { subcontractor: w.companies.sub, general_contractor: w.companies.gc, owner: w.companies.owner }[
    role
  ];
  const person = await makeUser(t.database.db, t.auth, company.id);
  await addMember(t.database.db, projectId, person.id, role);
  return signedInAgent(t.app, person.email);
}

/** A project of its own with two bid items billed through the real routes; the application is left submitted. */
async function submittedPayApp() {
  const db = t.database.db;
  const p = await makeProject(db, {
    subcontractor: w.companies.sub.id,
    general_contractor: w.companies.gc.id,
    owner: w.companies.owner.id,
  });
  for (const role of ['subcontractor', 'general_contractor', 'owner'] as const)
    await addMember(db, p.id, w.people[role].id, role);
  for (const [itemNumber, quantity] of [
    ['C-1', 120],
    ['C-2', 45],
  ] as const) {
    const item = await makeBidItem(db, p.id, { itemNumber, unitPriceCents: 1250, contractQuantity: 1000 });
    await makeTally(db, {
      projectId: p.id,
      bidItemId: item.id,
      authorUserId: w.people.subcontractor.id,
      measuredOn: '2026-10-12',
      quantity,
    });
  }
  const sub = await as('subcontractor');
  const created = await sub
    .post(`/api/projects/${p.id}/pay-apps`)
    .send({ periodStart: '2026-10-01', periodEnd: '2026-10-31' });
  expect(created.status, JSON.stringify(created.body)).toBe(201);
  expect((await sub.post(`/api/pay-apps/${created.body.payApp.id}/submit`).send({})).status).toBe(200);
  const app = created.body.payApp as {
    id: string;
    currentDueCents: number;
    lines: { id: string; itemNumber: string }[];
  };
  const lineOf = (itemNumber: string) => app.lines.find((l) => l.itemNumber === itemNumber)!.id;
  return { project: p, app, lineOf, sub };
}

const history = async (payAppId: string) =>
  (await t.database.db.select().from(payAppStatusHistory).where(eq(payAppStatusHistory.payAppId, payAppId))).map(
    (h) => h.toStatus,
  );

describe('two or more certifications at once', () => {
  it('three general contractors certify one application at once: one 200, two 409, certified and counted once', async () => {
    const { project, app, lineOf } = await submittedPayApp();
    const gc = await as('general_contractor');
    const review = await gc
      .post(`/api/pay-apps/${app.id}/review`)
      .send({ expectedRevision: 0, lines: ['C-1', 'C-2'].map((n) => ({ lineId: lineOf(n), decision: 'approve' })) });
    expect(review.status).toBe(200);
    // Fresh sessions: each certifier has just signed in, which counts as a recent sign-in.
    const certifiers = [
      await as('general_contractor'),
      await colleague(project.id, 'general_contractor'),
      await colleague(project.id, 'general_contractor'),
    ];
    const results = await Promise.all(
      certifiers.map(async (c) =>
        c
          .post(`/api/pay-apps/${app.id}/certify`)
          .send({ expectedRevision: 0, acknowledgedFlags: await flagKeys(c, app.id) }),
      ),
    );
    expect(statusesOf(results)).toEqual([200, 409, 409]);
    for (const lost of results.filter((r) => r.status === 409))
      expect(lost.body.error.code).toMatch(/^PAY_APP_(STALE|WRONG_STATUS)$/);
    expect((await auditActions(t.database.db, app.id)).filter((a) => a === 'pay_app.certified')).toHaveLength(1);
    expect((await history(app.id)).filter((s) => s === 'certified')).toHaveLength(1);
    // The next period's "less previous certified" counts this application's current due once.
    const item = (
      await t.database.db
        .select()
        .from(payAppLines)
        .where(eq(payAppLines.id, lineOf('C-1')))
    )[0]!;
    await makeTally(t.database.db, {
      projectId: project.id,
      bidItemId: item.bidItemId,
      authorUserId: w.people.subcontractor.id,
      measuredOn: '2026-11-10',
      quantity: 10,
    });
    const next = await (
      await as('subcontractor')
    )
      .post(`/api/projects/${project.id}/pay-apps`)
      .send({ periodStart: '2026-11-01', periodEnd: '2026-11-30' });
    expect(next.status).toBe(201);
    expect(next.body.payApp.previousCertifiedCents).toBe(app.currentDueCents);
  });
});

describe('a review racing another transition', () => {
  it('a dispute and a certification at once: exactly one wins, the other gets 409, and the loser leaves no trace', async () => {
    const { project, app, lineOf } = await submittedPayApp();
    const gc = await as('general_contractor');
    // Approve both lines (submitted -> in_review), so the application could be certified.
    await gc
      .post(`/api/pay-apps/${app.id}/review`)
      .send({ expectedRevision: 0, lines: ['C-1', 'C-2'].map((n) => ({ lineId: lineOf(n), decision: 'approve' })) });
    const reviewer = await colleague(project.id, 'general_contractor');
    const certifier = await as('general_contractor');
    const [review, certify] = await Promise.all([
      reviewer.post(`/api/pay-apps/${app.id}/review`).send({
        expectedRevision: 0,
        lines: [{ lineId: lineOf('C-2'), decision: 'dispute', reason: 'Recount the loads', counterQuantity: 40 }],
      }),
      flagKeys(certifier, app.id).then((acknowledgedFlags) =>
        certifier.post(`/api/pay-apps/${app.id}/certify`).send({ expectedRevision: 0, acknowledgedFlags }),
      ),
    ]);
    expect(statusesOf([review, certify])).toEqual([200, 409]);
    const [row] = await t.database.db.select().from(payApps).where(eq(payApps.id, app.id));
    const opened = await t.database.db.select().from(disputes).where(eq(disputes.payAppId, app.id));
    const actions = await auditActions(t.database.db, app.id);
    if (certify.status === 200) {
      expect(row).toMatchObject({ status: 'certified' });
      expect(opened).toHaveLength(0);
      const [disputedLine] = await t.database.db
        .select()
        .from(payAppLines)
        .where(eq(payAppLines.id, lineOf('C-2')));
      expect(disputedLine!.reviewStatus).toBe('approved');
      expect(actions.filter((a) => a === 'pay_app.reviewed')).toHaveLength(1); // only the earlier approval
    } else {
      expect(row).toMatchObject({ status: 'returned', certifiedAt: null });
      expect(opened).toHaveLength(1);
      expect(actions).not.toContain('pay_app.certified');
    }
  });

  it('a stale review and the revision of a returned application at once: the revision wins, the review gets 409', async () => {
    const { app, lineOf, sub } = await submittedPayApp();
    const gc = await as('general_contractor');
    const returned = await gc.post(`/api/pay-apps/${app.id}/review`).send({
      expectedRevision: 0,
      lines: [
        {
          lineId: lineOf('C-1'),
          decision: 'dispute',
          reason: 'Station 12+00 to 14+00 was billed last month',
          counterQuantity: 100,
        },
      ],
    });
    expect(returned.body.payApp.status).toBe('returned');
    // The reviewer's screen still shows revision 0 in review; the subcontractor answers the dispute meanwhile.
    const [review, revise] = await Promise.all([
      (await as('general_contractor')).post(`/api/pay-apps/${app.id}/review`).send({
        expectedRevision: 0,
        lines: [{ lineId: lineOf('C-2'), decision: 'dispute', reason: 'Haul tickets missing', counterQuantity: 30 }],
      }),
      sub
        .post(`/api/pay-apps/${app.id}/revise`)
        .send({ expectedRevision: 0, lines: [{ lineId: lineOf('C-1'), action: 'accept' }] }),
    ]);
    expect(revise.status, JSON.stringify(revise.body)).toBe(200);
    expect(review.status).toBe(409);
    expect(review.body.error.code).toMatch(/^PAY_APP_(STALE|WRONG_STATUS)$/);
    const [row] = await t.database.db.select().from(payApps).where(eq(payApps.id, app.id));
    expect(row).toMatchObject({ status: 'draft', revision: 1 });
    // 100 CY accepted on C-1 + 45 CY on C-2 at $12.50 = $1,812.50 earned (by hand), recomputed once.
    expect(row!.earnedToDateCents).toBe(181_250);
    const opened = await t.database.db.select().from(disputes).where(eq(disputes.payAppId, app.id));
    expect(opened.map((d) => [d.lineId, d.status])).toEqual([[lineOf('C-1'), 'resolved']]);
    const actions = await auditActions(t.database.db, app.id);
    expect(actions.filter((a) => a === 'pay_app.reviewed')).toHaveLength(1);
    expect(actions.filter((a) => a === 'pay_app.revised')).toHaveLength(1);
  });

  it('two revisions of one returned application at once: one 200, one 409, the revision number moves once', async () => {
    const { project, app, lineOf, sub } = await submittedPayApp();
    await (await as('general_contractor')).post(`/api/pay-apps/${app.id}/review`).send({
      expectedRevision: 0,
      lines: [{ lineId: lineOf('C-2'), decision: 'dispute', reason: 'Recount', counterQuantity: 40 }],
    });
    const other = await colleague(project.id, 'subcontractor');
    const results = await Promise.all([
      sub
        .post(`/api/pay-apps/${app.id}/revise`)
        .send({ expectedRevision: 0, lines: [{ lineId: lineOf('C-2'), action: 'accept' }] }),
      other.post(`/api/pay-apps/${app.id}/revise`).send({
        expectedRevision: 0,
        lines: [{ lineId: lineOf('C-2'), action: 'answer', comment: 'The tickets are attached' }],
      }),
    ]);
    expect(statusesOf(results)).toEqual([200, 409]);
    const [row] = await t.database.db.select().from(payApps).where(eq(payApps.id, app.id));
    expect(row).toMatchObject({ status: 'draft', revision: 1 });
    expect((await auditActions(t.database.db, app.id)).filter((a) => a === 'pay_app.revised')).toHaveLength(1);
  });
});

describe('two payments of the same balance at once', () => {
  // Default factory lines: 1,200 CY x $7.25 + 340.5 CY x $18.90 = $15,135.45, less 10 % retainage per line
  // ($870.00 + $643.55) = $13,621.90 due (by hand, as in payments.test.ts).
  const DUE = 1_362_190;
  const CARD_OK = '4242 4242 4242 4242'; // Stripe's testing documentation: a card that succeeds

  it('the owner and a colleague start paying at once: one 201, the other 409, and the balance is paid once', async () => {
    const app = await makeCertifiedPayApp(t.database.db, w.home.id, w.people.subcontractor.id, { number: 901 });
    const payers = [await as('owner'), await colleague(w.home.id, 'owner')];
    const results = await Promise.all(payers.map((p) => p.post(`/api/pay-apps/${app.id}/payments`).send({})));
    expect(statusesOf(results)).toEqual([201, 409]);
    expect(results.find((r) => r.status === 409)!.body.error.code).toMatch(/^PAY(MENT|_APP)_/);
    // Try to pay through every checkout that was handed out, and any attempt still open.
    const urls = results.filter((r) => r.status === 201).map((r) => r.body.url as string);
    for (const url of urls) await confirm(t.standin, new URL(url).pathname.split('/').pop()!, { card: CARD_OK });
    const [row] = await t.database.db.select().from(payApps).where(eq(payApps.id, app.id));
    expect(row).toMatchObject({ status: 'paid', paidCents: DUE });
    const succeeded = await t.database.db
      .select()
      .from(payments)
      .where(and(eq(payments.payAppId, app.id), eq(payments.status, 'succeeded')));
    expect(succeeded.map((p) => p.amountCents)).toEqual([DUE]);
  });

  it('five starts at once with partial payments allowed: still one open attempt, never more than the balance', async () => {
    await t.database.db.update(projects).set({ allowPartialPayments: true }).where(eq(projects.id, w.home.id));
    try {
      const app = await makeCertifiedPayApp(t.database.db, w.home.id, w.people.subcontractor.id, { number: 902 });
      const payers = [
        await as('owner'),
        await as('owner'),
        await colleague(w.home.id, 'owner'),
        await as('owner'),
        await as('owner'),
      ];
      const results = await Promise.all(
        payers.map((p, i) => p.post(`/api/pay-apps/${app.id}/payments`).send({ partialAmountCents: 1_000_000 + i })),
      );
      expect(results.filter((r) => r.status === 201)).toHaveLength(1);
      expect(results.filter((r) => r.status === 409)).toHaveLength(4);
      const open = await t.database.db
        .select()
        .from(payments)
        .where(and(eq(payments.payAppId, app.id), eq(payments.status, 'created')));
      expect(open).toHaveLength(1);
      const url = results.find((r) => r.status === 201)!.body.url as string;
      await confirm(t.standin, new URL(url).pathname.split('/').pop()!, { card: CARD_OK });
      const [row] = await t.database.db.select().from(payApps).where(eq(payApps.id, app.id));
      expect(row!.paidCents).toBe(open[0]!.amountCents);
      expect(row!.paidCents).toBeLessThanOrEqual(DUE);
    } finally {
      await t.database.db.update(projects).set({ allowPartialPayments: false }).where(eq(projects.id, w.home.id));
    }
  });

  it('an attempt cut off before its checkout opened blocks a second one for two minutes, then is ended', async () => {
    const app = await makeCertifiedPayApp(t.database.db, w.home.id, w.people.subcontractor.id, { number: 903 });
    const cutOff = { projectId: w.home.id, payAppId: app.id, amountCents: DUE, createdByUserId: w.people.owner.id };
    const [recent] = await t.database.db
      .insert(payments)
      .values({ ...cutOff, idempotencyKey: `test-recent-${app.id}` })
      .returning();
    const owner = await as('owner');
    const blocked = await owner.post(`/api/pay-apps/${app.id}/payments`).send({});
    expect(blocked.status).toBe(409);
    expect(blocked.body.error.code).toBe('PAYMENT_IN_PROGRESS');
    // Three minutes later nobody will open it any more.
    await t.database.db
      .update(payments)
      .set({ createdAt: new Date(Date.now() - 3 * 60_000) })
      .where(eq(payments.id, recent!.id));
    const started = await owner.post(`/api/pay-apps/${app.id}/payments`).send({});
    expect(started.status, JSON.stringify(started.body)).toBe(201);
    const [ended] = await t.database.db.select().from(payments).where(eq(payments.id, recent!.id));
    expect(ended!.status).toBe('canceled');
    expect(await auditActions(t.database.db, recent!.id)).toEqual(['payment.canceled']);
  });

  it('keeps an open checkout for its payer: a colleague is refused for fifteen minutes, the payer for one', async () => {
    // The race seen under load: the colleague's start came after the owner's checkout had opened, ended it and
    // opened a second one; the owner was filling in an expired checkout. Times are ours (common practice).
    const app = await makeCertifiedPayApp(t.database.db, w.home.id, w.people.subcontractor.id, { number: 904 });
    const owner = await as('owner');
    const first = await owner.post(`/api/pay-apps/${app.id}/payments`).send({});
    expect(first.status).toBe(201);
    const other = await colleague(w.home.id, 'owner');
    const refused = await other.post(`/api/pay-apps/${app.id}/payments`).send({});
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('PAYMENT_IN_PROGRESS');
    expect(refused.body.error.message).toMatch(
      /^Another payment of pay application 904 is under way \(started at \d\d:\d\d UTC on \d{4}-\d\d-\d\d\)\. Finish that checkout, or start again after \d\d:\d\d UTC on /,
    );
    // The owner's own second click a moment later is refused too, not a second checkout.
    const again = await owner.post(`/api/pay-apps/${app.id}/payments`).send({});
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/^Your payment of pay application 904 is under way/);
    const firstId = first.body.paymentId as string;
    const [kept] = await t.database.db.select().from(payments).where(eq(payments.id, firstId));
    expect(kept!.status).toBe('created');
    // Sixteen minutes on, the colleague may take over: the owner's checkout is ended and a new one opened.
    await t.database.db
      .update(payments)
      .set({ createdAt: new Date(Date.now() - 16 * 60_000) })
      .where(eq(payments.id, firstId));
    const takeOver = await other.post(`/api/pay-apps/${app.id}/payments`).send({});
    expect(takeOver.status, JSON.stringify(takeOver.body)).toBe(201);
    const [ended] = await t.database.db.select().from(payments).where(eq(payments.id, firstId));
    expect(ended!.status).toBe('canceled');
    await confirm(t.standin, new URL(takeOver.body.url).pathname.split('/').pop()!, { card: CARD_OK });
    const [row] = await t.database.db.select().from(payApps).where(eq(payApps.id, app.id));
    expect(row).toMatchObject({ status: 'paid', paidCents: DUE });
  });
});
