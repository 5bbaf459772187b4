import { eq } from 'drizzle-orm';
import Papa from 'papaparse';
import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEvents } from '../../server/db/schema';
import { makeBidItem, makeWorld } from '../setup/factories';
import { makeBillableProject } from '../setup/pay-cycle-factories';
import { createTestApp, signedInAgent, TEST_PASSWORD, type TestApp } from '../setup/test-app';
import { waitForMail as waitForMailIn } from '../setup/mail';

// Invented figures (test data), worked by hand: A-1 1,000 CY at $7.25, B-2 500 LF at $42.10;
// October measures 400 CY of A-1 and 120.25 LF of B-2, November 100 CY of A-1.
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
type Line = { id: string; itemNumber: string; [k: string]: unknown };
const line = (app: { lines: Line[] }, item: string) => app.lines.find((l) => l.itemNumber === item)!;
async function pdfText(payAppId: string) {
  const res = await (
    await as('general_contractor')
  )
    .get(`/api/pay-apps/${payAppId}/export.pdf`)
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
async function csvRows(payAppId: string) {
  const res = await (await as('general_contractor')).get(`/api/pay-apps/${payAppId}/export.csv`);
  return Papa.parse<string[]>(res.text.trim()).data;
}

let october: { id: string; lines: Line[] };

describe('contract lock: set up until the first pay application is submitted', () => {
  it('lets the general contractor edit any field while the contract is set up', async () => {
    const gc = await as('general_contractor');
    const list = await gc.get(`/api/projects/${w.home.id}/bid-items`);
    expect(list.body.lock).toEqual({ locked: false, sincePayAppNumber: null });
    const res = await gc
      .patch(`/api/bid-items/${billable.b.id}`)
      .send({ contractQuantity: 500, description: 'Storm trench, 18 in' });
    expect(res.status).toBe(200);
    expect(res.body.bidItem).toMatchObject({
      contractQuantity: 500,
      originalQuantity: 500,
      description: 'Storm trench, 18 in',
    });
  });

  it('locks on submission: a contract field answers 409 CONTRACT_LOCKED naming it, for the general contractor and the admin', async () => {
    const sub = await as('subcontractor');
    october = (
      await sub.post(`/api/projects/${w.home.id}/pay-apps`).send({ periodStart: '2026-10-01', periodEnd: '2026-10-31' })
    ).body.payApp;
    expect((await sub.post(`/api/pay-apps/${october.id}/submit`).send({ expectedRevision: 0 })).status).toBe(200);
    for (const who of ['general_contractor', 'admin'] as const) {
      const agent = await as(who);
      for (const [field, value] of [
        ['unitPriceCents', 800],
        ['contractQuantity', 1200],
        ['payUnit', 'LF'],
        ['basis', 'loose'],
        ['itemNumber', 'A-9'],
      ] as const) {
        const res = await agent.patch(`/api/bid-items/${billable.a.id}`).send({ [field]: value });
        expect(res.status, `${who} ${field}`).toBe(409);
        expect(res.body.error.code).toBe('CONTRACT_LOCKED');
        expect(res.body.error.message).toMatch(/change order/);
        expect(res.body.error.details).toEqual([expect.objectContaining({ path: field })]);
      }
    }
    const list = await (await as('owner')).get(`/api/projects/${w.home.id}/bid-items`);
    expect(list.body.lock).toEqual({ locked: true, sincePayAppNumber: 1 });
    expect(list.body.bidItems.find((b: { id: string }) => b.id === billable.a.id)).toMatchObject({
      unitPriceCents: 725,
      contractQuantity: 1000,
    });
  });

  it('keeps 403 for the subcontractor and the owner and 404 for an outsider, before the lock is even considered', async () => {
    for (const who of ['subcontractor', 'owner'] as const) {
      expect((await (await as(who)).patch(`/api/bid-items/${billable.a.id}`).send({ unitPriceCents: 1 })).status).toBe(
        403,
      );
    }
    expect(
      (await (await as('outsider')).patch(`/api/bid-items/${billable.a.id}`).send({ unitPriceCents: 1 })).status,
    ).toBe(404);
  });

  it('refuses adding, importing and deleting bid items once locked (409 CONTRACT_LOCKED)', async () => {
    const gc = await as('general_contractor');
    const created = await gc.post(`/api/projects/${w.home.id}/bid-items`).send({
      itemNumber: 'Z-1',
      description: 'Late item',
      payUnit: 'CY',
      basis: 'bank',
      unitPriceCents: 100,
      contractQuantity: 1,
      method: 'manual',
    });
    expect(created.status).toBe(409);
    expect(created.body.error.code).toBe('CONTRACT_LOCKED');
    const csv =
      'item_number,description,pay_unit,basis,unit_price,contract_quantity,major,method\nZ-2,Late,CY,bank,1.00,1,no,manual\n';
    const imported = await gc
      .post(`/api/projects/${w.home.id}/bid-items/import`)
      .attach('file', Buffer.from(csv), 'late.csv');
    expect(imported.body.error?.code).toBe('CONTRACT_LOCKED');
    const deleted = await gc.delete(`/api/bid-items/${billable.b.id}`);
    expect(deleted.status).toBe(409);
    expect(deleted.body.error.code).toBe('CONTRACT_LOCKED');
  });

  it('corrects description, major flag and method only with a reason, one audit event each time', async () => {
    const gc = await as('general_contractor');
    const bare = await gc.patch(`/api/bid-items/${billable.b.id}`).send({ description: 'Storm trench, 18 in RCP' });
    expect(bare.status).toBe(400);
    expect(bare.body.error.details[0].path).toBe('reason');
    const res = await gc
      .patch(`/api/bid-items/${billable.b.id}`)
      .send({ description: 'Storm trench, 18 in RCP', isMajor: true, reason: 'Pipe material was missing' });
    expect(res.status).toBe(200);
    expect(res.body.bidItem).toMatchObject({
      description: 'Storm trench, 18 in RCP',
      isMajor: true,
      unitPriceCents: 4210,
    });
    const events = await t.database.db.select().from(auditEvents).where(eq(auditEvents.objectId, billable.b.id));
    const corrected = events.filter((e) => e.action === 'bid_item.corrected');
    expect(corrected).toHaveLength(1);
    expect(corrected[0]!.after).toMatchObject({
      description: 'Storm trench, 18 in RCP',
      isMajor: true,
      reason: 'Pipe material was missing',
    });
    expect(corrected[0]!.before).toMatchObject({ description: 'Storm trench, 18 in', isMajor: false });
  });
});

let nov: { id: string; lines: Line[]; contractSumCents: number; earnedToDateCents: number; thisPeriodCents: number };

describe('original beside current: a change order moves the contract everywhere', () => {
  let coNumber: number;
  let octoberBefore: unknown;

  it('certifies October at the original prices', async () => {
    const gc = await as('general_contractor');
    const lines = october.lines.map((l) => ({ lineId: l.id, decision: 'approve' }));
    expect((await gc.post(`/api/pay-apps/${october.id}/review`).send({ expectedRevision: 0, lines })).status).toBe(200);
    // The factory's tallies carry no evidence file: each billed line is flagged, and must be acknowledged.
    const flags = (await gc.get(`/api/pay-apps/${october.id}`)).body.payApp.flags as {
      key: string;
      kind: string;
      itemNumber: string;
    }[];
    expect(flags.map((f) => [f.kind, f.itemNumber]).sort()).toEqual([
      ['no_evidence', 'A-1'],
      ['no_evidence', 'B-2'],
    ]);
    const partly = await gc
      .post(`/api/pay-apps/${october.id}/certify`)
      .send({ expectedRevision: 0, reauthPassword: TEST_PASSWORD, acknowledgedFlags: [flags[0]!.key] });
    expect(partly.status).toBe(409);
    expect(partly.body.error.code).toBe('FLAGS_NOT_ACKNOWLEDGED');
    expect(partly.body.error.details).toEqual([
      expect.objectContaining({ path: `acknowledgedFlags.${flags[1]!.key}` }),
    ]);
    const res = await gc
      .post(`/api/pay-apps/${october.id}/certify`)
      .send({ expectedRevision: 0, reauthPassword: TEST_PASSWORD, acknowledgedFlags: flags.map((f) => f.key) });
    expect(res.status).toBe(200);
    const [event] = await t.database.db.select().from(auditEvents).where(eq(auditEvents.action, 'pay_app.certified'));
    expect(
      (event!.after as { acknowledgedFlags: { key: string }[] }).acknowledgedFlags.map((f) => f.key).sort(),
    ).toEqual(flags.map((f) => f.key).sort());
    // 400 CY x $7.25 = $2,900.00
    expect(line(res.body.payApp, 'A-1')).toMatchObject({
      unitPriceCents: 725,
      contractQuantity: 1000,
      amountToDateCents: 290000,
    });
    // As the owner reads it (what each reader may do, `can`, is part of the answer and differs by seat).
    octoberBefore = (await (await as('owner')).get(`/api/pay-apps/${october.id}`)).body.payApp;
  });

  it('approves +600 CY and $8.00 on A-1: bid items, project and watch show current beside original', async () => {
    const body = {
      title: 'North pad extension',
      reason: 'The pad grew 40 ft north',
      items: [
        { kind: 'change_quantity', bidItemId: billable.a.id, quantityDelta: 600 },
        { kind: 'change_price', bidItemId: billable.a.id, newUnitPriceCents: 800 },
      ],
    };
    const co = (await (await as('subcontractor')).post(`/api/projects/${w.home.id}/change-orders`).send(body)).body
      .changeOrder;
    coNumber = co.number;
    expect((await (await as('general_contractor')).post(`/api/change-orders/${co.id}/approve`).send({})).status).toBe(
      200,
    );

    const items = (await (await as('owner')).get(`/api/projects/${w.home.id}/bid-items`)).body;
    expect(items.bidItems.find((b: { id: string }) => b.id === billable.a.id)).toMatchObject({
      originalQuantity: 1000,
      originalUnitPriceCents: 725,
      contractQuantity: 1600,
      unitPriceCents: 800,
      changeOrderNumbers: [coNumber],
      originalAmountCents: 725000,
      // 1,600 CY x $8.00 = $12,800.00
      contractAmountCents: 1280000,
    });
    // Original $7,250.00 + $21,050.00 = $28,300.00; current $12,800.00 + $21,050.00 = $33,850.00
    expect(items.totals).toEqual({
      originalContractSumCents: 2830000,
      approvedChangesCents: 555000,
      contractSumCents: 3385000,
    });

    const project = (await (await as('owner')).get(`/api/projects/${w.home.id}`)).body.project;
    expect(project).toMatchObject({
      originalContractSumCents: 2830000,
      approvedChangesCents: 555000,
      contractSumCents: 3385000,
      contractLocked: true,
    });
    const listed = (await (await as('subcontractor')).get('/api/projects')).body.projects.find(
      (p: { id: string }) => p.id === w.home.id,
    );
    expect(listed).toMatchObject({ contractSumCents: 3385000, originalContractSumCents: 2830000 });

    const watch = (await (await as('general_contractor')).get(`/api/projects/${w.home.id}/variance`)).body;
    expect(watch.rows.find((r: { bidItemId: string }) => r.bidItemId === billable.a.id)).toMatchObject({
      originalQuantity: 1000,
      currentContractQuantity: 1600,
      unitPriceCents: 800,
    });
    expect(watch.originalContractAmountCents).toBe(2830000);
  });

  it('leaves the certified October application exactly as it was', async () => {
    const again = (await (await as('owner')).get(`/api/pay-apps/${october.id}`)).body.payApp;
    expect(again).toEqual(octoberBefore);
  });

  it('compiles November at the current contract; the new price applies to November quantities only', async () => {
    nov = (
      await (
        await as('subcontractor')
      )
        .post(`/api/projects/${w.home.id}/pay-apps`)
        .send({ periodStart: '2026-11-01', periodEnd: '2026-11-30' })
    ).body.payApp;
    // Previous $2,900.00 as certified; 100 CY x $8.00 = $800.00 this period; $3,700.00 to date (not 500 x $8.00).
    expect(line(nov, 'A-1')).toMatchObject({
      unitPriceCents: 800,
      contractQuantity: 1600,
      previousQuantity: 400,
      thisPeriodQuantity: 100,
      previousAmountCents: 290000,
      thisPeriodAmountCents: 80000,
      amountToDateCents: 370000,
    });
    expect(nov.contractSumCents).toBe(3385000);
    const sum = (k: string) => nov.lines.reduce((s: number, l: Line) => s + (l[k] as number), 0);
    expect(sum('amountToDateCents')).toBe(nov.earnedToDateCents);
    expect(sum('thisPeriodAmountCents')).toBe(nov.thisPeriodCents);

    const text = await pdfText(nov.id);
    expect(text).toContain('Contract sum to date $33,850.00');
    expect(text).toMatch(/A-1 .*CY \$8\.00 1,600\.00/);
    const rows = await csvRows(nov.id);
    const a1 = rows.find((r) => r[0] === 'A-1')!;
    expect(a1.slice(3, 5)).toEqual(['8.00', '1600']);
    expect(a1[8]).toBe('2900.00');
    expect(a1[10]).toBe('3700.00');
  });
});

const waitForMail = (email: string, subject: RegExp) =>
  waitForMailIn(t.mailbox, (m) => m.to.includes(email) && subject.test(m.subject));

describe('disputes that cannot go wrong silently (November, A-1 claims 100 CY)', () => {
  let disputeId: string;
  const a1 = () => line(nov, 'A-1').id;

  it('refuses a counter quantity above the claim with 400 COUNTER_ABOVE_CLAIM, and returns nothing', async () => {
    expect(
      (await (await as('subcontractor')).post(`/api/pay-apps/${nov.id}/submit`).send({ expectedRevision: 0 })).status,
    ).toBe(200);
    const gc = await as('general_contractor');
    const res = await gc.post(`/api/pay-apps/${nov.id}/review`).send({
      expectedRevision: 0,
      lines: [{ lineId: a1(), decision: 'dispute', reason: 'More was hauled', counterQuantity: 150 }],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('COUNTER_ABOVE_CLAIM');
    expect(res.body.error.details[0].path).toBe('lines.0.counterQuantity');
    expect((await gc.get(`/api/pay-apps/${nov.id}`)).body.payApp.status).toBe('submitted');
  });

  it('lets the reviewer correct an open dispute, in the thread and by mail; the subcontractor may not', async () => {
    const gc = await as('general_contractor');
    const lines = nov.lines.map((l) =>
      l.id === a1()
        ? { lineId: l.id, decision: 'dispute', reason: 'Survey shows less', counterQuantity: 80 }
        : { lineId: l.id, decision: 'approve' },
    );
    const returned = await gc.post(`/api/pay-apps/${nov.id}/review`).send({ expectedRevision: 0, lines });
    expect(returned.body.payApp.status).toBe('returned');
    disputeId = returned.body.payApp.disputes[0].id;
    expect(
      (await (await as('subcontractor')).patch(`/api/disputes/${disputeId}`).send({ counterQuantity: 90 })).status,
    ).toBe(403);
    expect((await (await as('owner')).patch(`/api/disputes/${disputeId}`).send({ counterQuantity: 90 })).status).toBe(
      404,
    );
    expect(
      (await (await as('outsider')).patch(`/api/disputes/${disputeId}`).send({ counterQuantity: 90 })).status,
    ).toBe(404);
    const above = await gc.patch(`/api/disputes/${disputeId}`).send({ counterQuantity: 101 });
    expect(above.body.error.code).toBe('COUNTER_ABOVE_CLAIM');
    const edited = await gc.patch(`/api/disputes/${disputeId}`).send({ counterQuantity: 90 });
    expect(edited.status).toBe(200);
    const d = edited.body.payApp.disputes[0];
    expect(d).toMatchObject({ counterQuantity: 90, status: 'open' });
    expect(d.comments.at(-1).body).toMatch(/Counter quantity changed from 80\.00 CY to 90\.00 CY/);
    await waitForMail(w.people.subcontractor.email, /item A-1 dispute changed/);
  });

  it('refuses an answer without a choice, and a proposal without a quantity or a reason', async () => {
    const sub = await as('subcontractor');
    const none = await sub
      .post(`/api/pay-apps/${nov.id}/revise`)
      .send({ expectedRevision: 0, lines: [{ lineId: a1() }] });
    expect(none.status).toBe(400);
    expect(none.body.error.details.map((x: { path: string }) => x.path)).toContain('lines.0.action');
    const bare = await sub
      .post(`/api/pay-apps/${nov.id}/revise`)
      .send({ expectedRevision: 0, lines: [{ lineId: a1(), action: 'propose' }] });
    expect(bare.body.error.details.map((x: { path: string }) => x.path).sort()).toEqual([
      'lines.0.comment',
      'lines.0.proposedQuantity',
    ]);
  });

  it('takes a third quantity with its reason: the line is recomputed, the thread says so, the reviewer is mailed', async () => {
    const res = await (await as('subcontractor')).post(`/api/pay-apps/${nov.id}/revise`).send({
      expectedRevision: 0,
      lines: [
        {
          lineId: a1(),
          action: 'propose',
          proposedQuantity: 95,
          comment: 'Five loads were topsoil; the rest is on the tickets',
        },
      ],
    });
    expect(res.status).toBe(200);
    const app = res.body.payApp;
    // 95 CY x $8.00 = $760.00 this period, on top of the $2,900.00 certified
    expect(line(app, 'A-1')).toMatchObject({
      thisPeriodQuantity: 95,
      thisPeriodAmountCents: 76000,
      amountToDateCents: 366000,
      reviewStatus: 'pending',
    });
    expect(app.disputes[0]).toMatchObject({ status: 'resolved', resolution: 'quantity_proposed' });
    expect(app.disputes[0].comments.at(-1).body).toMatch(
      /Proposes 95\.00 CY instead of the claimed 100\.00 CY and the counter 90\.00 CY/,
    );
    await waitForMail(w.people.general_contractor.email, /disputes were answered/);
    // Answered: the reviewer can no longer change it.
    expect(
      (await (await as('general_contractor')).patch(`/api/disputes/${disputeId}`).send({ counterQuantity: 50 })).body
        .error.code,
    ).toBe('DISPUTE_ANSWERED');
  });

  it('lets the reviewer withdraw a dispute before it is answered: the line stands as claimed', async () => {
    expect(
      (await (await as('subcontractor')).post(`/api/pay-apps/${nov.id}/submit`).send({ expectedRevision: 1 })).status,
    ).toBe(200);
    const gc = await as('general_contractor');
    const returned = await gc.post(`/api/pay-apps/${nov.id}/review`).send({
      expectedRevision: 1,
      lines: [{ lineId: a1(), decision: 'dispute', reason: 'Check the tickets', counterQuantity: 90 }],
    });
    const open = returned.body.payApp.disputes.find((d: { status: string }) => d.status === 'open');
    expect((await gc.post(`/api/disputes/${open.id}/withdraw`).send({})).status).toBe(400);
    const res = await gc.post(`/api/disputes/${open.id}/withdraw`).send({ note: 'Tickets 12 to 16 found' });
    expect(res.status).toBe(200);
    expect(res.body.payApp.disputes.find((d: { id: string }) => d.id === open.id)).toMatchObject({
      status: 'resolved',
      resolution: 'withdrawn',
    });
    expect(line(res.body.payApp, 'A-1')).toMatchObject({ reviewStatus: 'approved', thisPeriodQuantity: 95 });
    await waitForMail(w.people.subcontractor.email, /item A-1 dispute withdrawn/);
    const events = await t.database.db.select().from(auditEvents).where(eq(auditEvents.objectId, open.id));
    expect(events.map((e) => e.action)).toEqual(['dispute.withdrawn']);
  });
});
