import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { tallies } from '../../server/db/schema';
import { addMember, makeBidItem, makeProject, makeUser, makeWorld } from '../setup/factories';
import { auditActions, makeBillableProject, makeTally } from '../setup/pay-cycle-factories';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';
import { waitForMail as waitForMailIn } from '../setup/mail';

/** Every flag of the application, acknowledged: these tests certify after looking at them. */
const flagKeys = async (
  agent: { get: (url: string) => PromiseLike<{ body: { payApp: { flags: { key: string }[] } } }> },
  payAppId: string,
) => (await agent.get(`/api/pay-apps/${payAppId}`)).body.payApp.flags.map((f) => f.key);

let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
let billable: Awaited<ReturnType<typeof makeBillableProject>>;
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
  billable = await makeBillableProject(t.database.db, w.home.id, w.people.subcontractor.id, (o) =>
    makeBidItem(t.database.db, w.home.id, o),
  );
});
afterAll(() => t.close());

type Who = keyof typeof w.people | 'outsider';
const as = (who: Who) => signedInAgent(t.app, who === 'outsider' ? w.outsider.email : w.people[who].email);
const october = { periodStart: '2026-10-01', periodEnd: '2026-10-31' };
const mailTo = (email: string) => t.mailbox.messages().filter((m) => m.to.includes(email));
const waitForMail = (email: string, subject: RegExp) =>
  waitForMailIn(t.mailbox, (m) => m.to.includes(email) && subject.test(m.subject));
type Line = { id: string; itemNumber: string };
const line = (app: { lines: Line[] }, item: string) => app.lines.find((l) => l.itemNumber === item)!;

describe('pay applications: the October period, step by step', () => {
  let id: string;

  it('refuses creation by the general contractor (403) and an outsider (404), and a period ending before it starts (400)', async () => {
    expect(
      (await (await as('general_contractor')).post(`/api/projects/${w.home.id}/pay-apps`).send(october)).status,
    ).toBe(403);
    expect((await (await as('outsider')).post(`/api/projects/${w.home.id}/pay-apps`).send(october)).status).toBe(404);
    const bad = await (
      await as('subcontractor')
    )
      .post(`/api/projects/${w.home.id}/pay-apps`)
      .send({ periodStart: '2026-10-31', periodEnd: '2026-10-01' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0].path).toBe('periodEnd');
  });

  it('compiles number 1 from the ready tallies of the period, with hand-checked money', async () => {
    const res = await (await as('subcontractor')).post(`/api/projects/${w.home.id}/pay-apps`).send(october);
    expect(res.status).toBe(201);
    const app = res.body.payApp;
    id = app.id;
    expect(app).toMatchObject({ number: 1, revision: 0, status: 'draft', retainageBps: 1000 });
    // 400 CY x $7.25 = $2,900.00; B-2: 120.25 LF x $42.10 = $5,062.525 -> $5,062.53 (rounded once, half away from zero)
    expect(line(app, 'A-1')).toMatchObject({
      previousQuantity: 0,
      thisPeriodQuantity: 400,
      toDateQuantity: 400,
      amountToDateCents: 290000,
      retainageCents: 29000,
    });
    expect(line(app, 'B-2')).toMatchObject({
      thisPeriodQuantity: 120.25,
      amountToDateCents: 506253,
      retainageCents: 50625,
    });
    // 10 % retainage per line: $290.00 + $506.25 = $796.25; current due = $7,962.53 - $796.25 - $0 = $7,166.28
    expect(app).toMatchObject({
      earnedToDateCents: 796253,
      thisPeriodCents: 796253,
      retainageCents: 79625,
      previousCertifiedCents: 0,
      currentDueCents: 716628,
    });
    const sum = (k: 'amountToDateCents' | 'retainageCents') =>
      app.lines.reduce((s: number, l: Record<string, number>) => s + l[k]!, 0);
    expect(sum('amountToDateCents')).toBe(app.earnedToDateCents);
    expect(sum('retainageCents')).toBe(app.retainageCents);
    const billed = await t.database.db.select().from(tallies).where(eq(tallies.payAppId, id));
    expect(billed.map((x) => x.id).sort()).toEqual(billable.tallies.map((x) => x.id).sort());
    expect(billed.every((x) => x.status === 'billed')).toBe(true);
    expect(app.tallies).toHaveLength(3);
  });

  it('lists it with the fields of the issue, hides a draft from the owner (404), and refuses a second open period (409)', async () => {
    const list = await (await as('general_contractor')).get(`/api/projects/${w.home.id}/pay-apps`);
    expect(Object.keys(list.body.payApps[0])).toEqual(
      expect.arrayContaining([
        'id',
        'number',
        'revision',
        'status',
        'periodStart',
        'periodEnd',
        'earnedToDateCents',
        'retainageCents',
        'currentDueCents',
      ]),
    );
    expect((await (await as('owner')).get(`/api/projects/${w.home.id}/pay-apps`)).body.payApps).toEqual([]);
    expect((await (await as('owner')).get(`/api/pay-apps/${id}`)).status).toBe(404);
    expect((await (await as('outsider')).get(`/api/pay-apps/${id}`)).status).toBe(404);
    const again = await (
      await as('subcontractor')
    )
      .post(`/api/projects/${w.home.id}/pay-apps`)
      .send({ periodStart: '2026-11-01', periodEnd: '2026-11-30' });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('PAY_APP_OPEN');
  });

  it('refuses review and certify of a draft (409 PAY_APP_WRONG_STATUS) and submit by the general contractor (403)', async () => {
    const gc = await as('general_contractor');
    const review = await gc.post(`/api/pay-apps/${id}/review`).send({
      expectedRevision: 0,
      lines: [{ lineId: (await gc.get(`/api/pay-apps/${id}`)).body.payApp.lines[0].id, decision: 'approve' }],
    });
    expect(review.status).toBe(409);
    expect(review.body.error.code).toBe('PAY_APP_WRONG_STATUS');
    expect((await gc.post(`/api/pay-apps/${id}/certify`).send({})).body.error.code).toBe('PAY_APP_WRONG_STATUS');
    expect((await gc.post(`/api/pay-apps/${id}/submit`).send({})).status).toBe(403);
    expect((await (await as('owner')).post(`/api/pay-apps/${id}/submit`).send({})).status).toBe(404);
  });

  it('tells each reader what it may do now (`can`): submit for the subcontractor only, review for nobody yet', async () => {
    const sub = (await (await as('subcontractor')).get(`/api/pay-apps/${id}`)).body.payApp.can;
    const gc = (await (await as('general_contractor')).get(`/api/pay-apps/${id}`)).body.payApp.can;
    expect(sub).toMatchObject({ submit: true, review: false, certify: false, answer: false, comment: true });
    expect(gc).toMatchObject({ submit: false, review: false, certify: false, pay: false, comment: true });
  });

  it('submits: a stale revision is 409 PAY_APP_STALE, then the general contractor gets the e-mail with the link', async () => {
    const sub = await as('subcontractor');
    const stale = await sub.post(`/api/pay-apps/${id}/submit`).send({ expectedRevision: 3 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('PAY_APP_STALE');
    const res = await sub.post(`/api/pay-apps/${id}/submit`).send({ expectedRevision: 0 });
    expect(res.status).toBe(200);
    expect(res.body.payApp.status).toBe('submitted');
    expect(res.body.payApp.can).toMatchObject({ submit: false, review: false });
    expect((await (await as('general_contractor')).get(`/api/pay-apps/${id}`)).body.payApp.can).toMatchObject({
      review: true,
      certify: true,
    });
    expect((await sub.post(`/api/pay-apps/${id}/submit`).send({})).status).toBe(409);
    const mail = await waitForMail(w.people.general_contractor.email, /ready for review/);
    expect(mail.text).toContain(`/projects/${w.home.id}/pay-apps/${id}`);
    expect(mail.html).toContain(`/projects/${w.home.id}/pay-apps/${id}`);
    expect(mailTo(w.people.owner.email)).toHaveLength(0);
  });

  it('review with a dispute: submitted -> in_review -> returned, e-mail to the subcontractor; the subcontractor may not review', async () => {
    const gc = await as('general_contractor');
    const app = (await gc.get(`/api/pay-apps/${id}`)).body.payApp;
    expect(
      (
        await (
          await as('subcontractor')
        )
          .post(`/api/pay-apps/${id}/review`)
          .send({ expectedRevision: 0, lines: [{ lineId: line(app, 'A-1').id, decision: 'approve' }] })
      ).status,
    ).toBe(403);
    const noReason = await gc
      .post(`/api/pay-apps/${id}/review`)
      .send({ expectedRevision: 0, lines: [{ lineId: line(app, 'B-2').id, decision: 'dispute' }] });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.details.map((d: { path: string }) => d.path)).toEqual([
      'lines.0.reason',
      'lines.0.counterQuantity',
    ]);
    const res = await gc.post(`/api/pay-apps/${id}/review`).send({
      expectedRevision: 0,
      lines: [
        { lineId: line(app, 'A-1').id, decision: 'approve' },
        { lineId: line(app, 'B-2').id, decision: 'dispute', reason: 'Run 3 was paid last month', counterQuantity: 100 },
      ],
    });
    expect(res.status).toBe(200);
    expect(res.body.payApp.status).toBe('returned');
    expect(res.body.payApp.history.map((h: { toStatus: string }) => h.toStatus)).toEqual([
      'draft',
      'submitted',
      'in_review',
      'returned',
    ]);
    expect(res.body.payApp.disputes[0]).toMatchObject({
      reason: 'Run 3 was paid last month',
      counterQuantity: 100,
      status: 'open',
      revision: 0,
    });
    const mail = await waitForMail(w.people.subcontractor.email, /returned with 1 disputed/);
    expect(mail.text).toContain('Item B-2: Run 3 was paid last month');
  });

  it('keeps a dispute thread between the contractors', async () => {
    const dispute = (await (await as('general_contractor')).get(`/api/pay-apps/${id}`)).body.payApp.disputes[0];
    expect(
      (
        await (
          await as('subcontractor')
        )
          .post(`/api/disputes/${dispute.id}/comments`)
          .send({ body: 'Run 3 is the new lateral.' })
      ).status,
    ).toBe(201);
    expect(
      (
        await (
          await as('general_contractor')
        )
          .post(`/api/disputes/${dispute.id}/comments`)
          .send({ body: 'Show the as-built.' })
      ).status,
    ).toBe(201);
    expect((await (await as('owner')).post(`/api/disputes/${dispute.id}/comments`).send({ body: 'x' })).status).toBe(
      404,
    );
    expect(
      (await (await as('subcontractor')).post(`/api/disputes/${dispute.id}/comments`).send({ body: ' ' })).status,
    ).toBe(400);
    const after = (await (await as('subcontractor')).get(`/api/pay-apps/${id}`)).body.payApp.disputes[0];
    expect(after.comments.map((c: { body: string }) => c.body)).toEqual([
      'Run 3 is the new lateral.',
      'Show the as-built.',
    ]);
  });

  it('revises: every open dispute must be answered; accepting the counter recomputes the line, revision 1, back to draft', async () => {
    const sub = await as('subcontractor');
    const app = (await sub.get(`/api/pay-apps/${id}`)).body.payApp;
    expect(
      (
        await (
          await as('general_contractor')
        )
          .post(`/api/pay-apps/${id}/revise`)
          .send({ expectedRevision: 0, lines: [] })
      ).status,
    ).toBe(403);
    const missing = await sub.post(`/api/pay-apps/${id}/revise`).send({ expectedRevision: 0, lines: [] });
    expect(missing.status).toBe(400);
    const res = await sub.post(`/api/pay-apps/${id}/revise`).send({
      expectedRevision: 0,
      lines: [{ lineId: line(app, 'B-2').id, action: 'accept', comment: 'Agreed, run 3 moves to November.' }],
    });
    expect(res.status).toBe(200);
    const revised = res.body.payApp;
    expect(revised).toMatchObject({ status: 'draft', revision: 1 });
    // B-2: 100 LF x $42.10 = $4,210.00, retainage $421.00; A-1 unchanged and still approved
    expect(line(revised, 'B-2')).toMatchObject({
      thisPeriodQuantity: 100,
      amountToDateCents: 421000,
      retainageCents: 42100,
      reviewStatus: 'pending',
    });
    expect(line(revised, 'A-1')).toMatchObject({ reviewStatus: 'approved' });
    // $7,110.00 earned - $711.00 retainage = $6,399.00 due
    expect(revised).toMatchObject({ earnedToDateCents: 711000, retainageCents: 71100, currentDueCents: 639900 });
    expect(revised.disputes[0]).toMatchObject({ status: 'resolved', resolution: 'counter_accepted' });
    expect(
      (await sub.post(`/api/pay-apps/${id}/revise`).send({ expectedRevision: 1, lines: [] })).body.error.code,
    ).toBe('PAY_APP_WRONG_STATUS');
  });

  it('certifies only when every line is approved, e-mails the owner, and is frozen afterwards', async () => {
    const sub = await as('subcontractor');
    const gc = await as('general_contractor');
    expect((await sub.post(`/api/pay-apps/${id}/submit`).send({ expectedRevision: 0 })).body.error.code).toBe(
      'PAY_APP_STALE',
    );
    expect((await sub.post(`/api/pay-apps/${id}/submit`).send({ expectedRevision: 1 })).status).toBe(200);
    const early = await gc.post(`/api/pay-apps/${id}/certify`).send({ expectedRevision: 1 });
    expect(early.status).toBe(409);
    expect(early.body.error.code).toBe('PAY_APP_LINES_NOT_APPROVED');
    const app = (await gc.get(`/api/pay-apps/${id}`)).body.payApp;
    const reviewed = await gc
      .post(`/api/pay-apps/${id}/review`)
      .send({ expectedRevision: 1, lines: [{ lineId: line(app, 'B-2').id, decision: 'approve' }] });
    expect(reviewed.body.payApp.status).toBe('in_review');
    expect((await sub.post(`/api/pay-apps/${id}/certify`).send({})).status).toBe(403);
    const res = await gc
      .post(`/api/pay-apps/${id}/certify`)
      .send({ expectedRevision: 1, acknowledgedFlags: await flagKeys(gc, id) });
    expect(res.status).toBe(200);
    expect(res.body.payApp).toMatchObject({ status: 'certified', currentDueCents: 639900 });
    expect(res.body.payApp.certifiedAt).toBeTruthy();
    const mail = await waitForMail(w.people.owner.email, /certified: \$6,399\.00 due/);
    expect(mail.text).toContain('not legal advice');
    expect((await (await as('owner')).get(`/api/pay-apps/${id}`)).status).toBe(200);
    for (const action of ['submit', 'certify'] as const)
      expect((await (action === 'submit' ? sub : gc).post(`/api/pay-apps/${id}/${action}`).send({})).status).toBe(409);
    expect(
      (
        await gc.post(`/api/pay-apps/${id}/review`).send({
          expectedRevision: 1,
          lines: [{ lineId: line(app, 'A-1').id, decision: 'dispute', reason: 'late', counterQuantity: 1 }],
        })
      ).status,
    ).toBe(409);
    expect((await sub.post(`/api/pay-apps/${id}/revise`).send({ expectedRevision: 1, lines: [] })).status).toBe(409);
  });

  it('wrote one audit event per step', async () => {
    expect(await auditActions(t.database.db, id)).toEqual([
      'pay_app.created',
      'pay_app.submitted',
      'pay_app.reviewed',
      'pay_app.revised',
      'pay_app.submitted',
      'pay_app.reviewed',
      'pay_app.certified',
    ]);
  });

  it('bills November on top of the certified October: previous, to date and less previous certified', async () => {
    const sub = await as('subcontractor');
    expect((await sub.post(`/api/projects/${w.home.id}/pay-apps`).send(october)).body.error.code).toBe(
      'PERIOD_OVERLAP',
    );
    const res = await sub
      .post(`/api/projects/${w.home.id}/pay-apps`)
      .send({ periodStart: '2026-11-01', periodEnd: '2026-11-30' });
    expect(res.status).toBe(201);
    const app = res.body.payApp;
    expect(app.number).toBe(2);
    // 400 previous + 100 = 500 CY, $3,625.00 to date, $725.00 this period; B-2 100 LF previous, nothing new
    expect(line(app, 'A-1')).toMatchObject({
      previousQuantity: 400,
      thisPeriodQuantity: 100,
      toDateQuantity: 500,
      previousAmountCents: 290000,
      thisPeriodAmountCents: 72500,
      amountToDateCents: 362500,
    });
    expect(line(app, 'B-2')).toMatchObject({ previousQuantity: 100, thisPeriodQuantity: 0, amountToDateCents: 421000 });
    // earned $7,835.00 - retainage $783.50 - previous certified $6,399.00 = $652.50 (= $725.00 x 90 %)
    expect(app).toMatchObject({
      earnedToDateCents: 783500,
      retainageCents: 78350,
      previousCertifiedCents: 639900,
      currentDueCents: 65250,
    });
  });
});

describe('pay applications: retainage reduction and concurrency', () => {
  async function project(settings: object = {}) {
    const db = t.database.db;
    const p = await makeProject(db, {
      subcontractor: w.companies.sub.id,
      general_contractor: w.companies.gc.id,
      owner: w.companies.owner.id,
    });
    const { projects } = await import('../../server/db/schema');
    if (Object.keys(settings).length) await db.update(projects).set(settings).where(eq(projects.id, p.id));
    for (const role of ['subcontractor', 'general_contractor', 'owner'] as const)
      await addMember(db, p.id, w.people[role].id, role);
    const item = await makeBidItem(db, p.id, { itemNumber: 'X-1', unitPriceCents: 1000, contractQuantity: 1000 });
    return { p, item };
  }
  const bill = async (projectId: string, start: string, end: string) =>
    (
      await (
        await as('subcontractor')
      )
        .post(`/api/projects/${projectId}/pay-apps`)
        .send({ periodStart: start, periodEnd: end })
    ).body.payApp;
  async function approveAndCertify(app: { id: string; lines: { id: string }[] }) {
    const sub = await as('subcontractor');
    const gc = await as('general_contractor');
    await sub.post(`/api/pay-apps/${app.id}/submit`).send({});
    await gc
      .post(`/api/pay-apps/${app.id}/review`)
      .send({ expectedRevision: 0, lines: app.lines.map((l) => ({ lineId: l.id, decision: 'approve' })) });
    return gc
      .post(`/api/pay-apps/${app.id}/certify`)
      .send({ expectedRevision: 0, acknowledgedFlags: await flagKeys(gc, app.id) });
  }

  it('takes the reduced rate once the work reaches the reduction point (10 % -> 5 % at 50 % complete)', async () => {
    // Retainage at most 10 % (FAR 52.232-5 / 32.103); a reduction after a percent complete as in Hawaii HRS 103-32.1 (reference.md section 6).
    const { p, item } = await project({ retainageBps: 1000, retainageReducedBps: 500, retainageReductionAtBps: 5000 });
    await makeTally(t.database.db, {
      projectId: p.id,
      bidItemId: item.id,
      authorUserId: w.people.subcontractor.id,
      measuredOn: '2026-09-10',
      quantity: 400,
    });
    const first = await bill(p.id, '2026-09-01', '2026-09-30');
    // 400 x $10 = $4,000 (40 % of $10,000): 10 % = $400 held, $3,600 due
    expect(first).toMatchObject({
      earnedToDateCents: 400000,
      retainageCents: 40000,
      currentDueCents: 360000,
      retainageBps: 1000,
    });
    expect((await approveAndCertify(first)).status).toBe(200);
    await makeTally(t.database.db, {
      projectId: p.id,
      bidItemId: item.id,
      authorUserId: w.people.subcontractor.id,
      measuredOn: '2026-10-10',
      quantity: 100,
    });
    const second = await bill(p.id, '2026-10-01', '2026-10-31');
    // 500 x $10 = $5,000 = exactly 50 %: 5 % = $250 held; due $5,000 - $250 - $3,600 = $1,150
    expect(second).toMatchObject({
      earnedToDateCents: 500000,
      retainageCents: 25000,
      currentDueCents: 115000,
      retainageBps: 500,
    });
  });

  it('two simultaneous reviews of a submitted application: exactly one moves it, the other gets 409', async () => {
    const { p, item } = await project();
    await makeTally(t.database.db, {
      projectId: p.id,
      bidItemId: item.id,
      authorUserId: w.people.subcontractor.id,
      measuredOn: '2026-10-10',
      quantity: 10,
    });
    const app = await bill(p.id, '2026-10-01', '2026-10-31');
    await (await as('subcontractor')).post(`/api/pay-apps/${app.id}/submit`).send({});
    const [a, b] = [await as('general_contractor'), await as('general_contractor')];
    const body = {
      expectedRevision: 0,
      lines: [{ lineId: app.lines[0].id, decision: 'dispute', reason: 'Count again', counterQuantity: 8 }],
    };
    const results = await Promise.all([
      a.post(`/api/pay-apps/${app.id}/review`).send(body),
      b.post(`/api/pay-apps/${app.id}/review`).send(body),
    ]);
    expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
    expect(results.find((r) => r.status === 409)!.body.error.code).toMatch(/^PAY_APP_(STALE|WRONG_STATUS)$/);
    const detail = (await a.get(`/api/pay-apps/${app.id}`)).body.payApp;
    expect(detail.disputes).toHaveLength(1);
    expect(detail.history.filter((h: { toStatus: string }) => h.toStatus === 'returned')).toHaveLength(1);
  });

  it('two simultaneous certifies: exactly one succeeds, the other 409, one audit event', async () => {
    const { p, item } = await project();
    await makeTally(t.database.db, {
      projectId: p.id,
      bidItemId: item.id,
      authorUserId: w.people.subcontractor.id,
      measuredOn: '2026-10-10',
      quantity: 10,
    });
    const app = await bill(p.id, '2026-10-01', '2026-10-31');
    const gc = await as('general_contractor');
    await (await as('subcontractor')).post(`/api/pay-apps/${app.id}/submit`).send({});
    await gc
      .post(`/api/pay-apps/${app.id}/review`)
      .send({ expectedRevision: 0, lines: [{ lineId: app.lines[0].id, decision: 'approve' }] });
    const other = await signedInAgent(t.app, (await makeOtherGc(p.id)).email);
    const acknowledgedFlags = await flagKeys(gc, app.id);
    const results = await Promise.all([
      gc.post(`/api/pay-apps/${app.id}/certify`).send({ expectedRevision: 0, acknowledgedFlags }),
      other.post(`/api/pay-apps/${app.id}/certify`).send({ expectedRevision: 0, acknowledgedFlags }),
    ]);
    expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
    expect((await auditActions(t.database.db, app.id)).filter((x) => x === 'pay_app.certified')).toHaveLength(1);
  });

  async function makeOtherGc(projectId: string) {
    const person = await makeUser(t.database.db, t.auth, w.companies.gc.id);
    await addMember(t.database.db, projectId, person.id, 'general_contractor');
    return person;
  }
});
