import { eq } from 'drizzle-orm';
import Papa from 'papaparse';
import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { changeOrders } from '../../server/db/schema';
import { makeBidItem, makeWorld } from '../setup/factories';
import { makeBillableProject, makeTally } from '../setup/pay-cycle-factories';
import { makeChangeOrder, makeProfiledItem, makeSource, makeStoredMaterial } from '../setup/provisions-factories';
import { submitAndCertify } from '../setup/certify';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

// Invented figures (test data), every total worked by hand below. Items: A-1 1,000 CY at $7.25, B-2 500 LF at
// $42.10, C-3 2,000 CY at $4.00 (truck measure), D-4 1,000 CY at $12.00 (weight): original contract $48,300.00.
// Retainage 10 % on work and stored materials (the project's rate), each line rounded once to the cent.
let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
let billable: Awaited<ReturnType<typeof makeBillableProject>>;
let truckItem: { id: string };
let weightItem: { id: string };
let material: { id: string };
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
  const db = t.database.db;
  billable = await makeBillableProject(db, w.home.id, w.people.subcontractor.id, (o) => makeBidItem(db, w.home.id, o));
  truckItem = await makeProfiledItem(db, w.home.id, 'truck_measure', {
    itemNumber: 'C-3',
    description: 'Borrow, truck measure',
    payUnit: 'CY',
    unitPriceCents: 400,
    contractQuantity: 2000,
  });
  weightItem = await makeProfiledItem(db, w.home.id, 'weight', {
    itemNumber: 'D-4',
    description: 'Aggregate base, by weight',
    payUnit: 'CY',
    unitPriceCents: 1200,
    contractQuantity: 1000,
  });
  material = await makeStoredMaterial(db, w.home.id, billable.b.id);
});
afterAll(() => t.close());

type Who = keyof typeof w.people;
const as = (who: Who) => signedInAgent(t.app, w.people[who].email);

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
  expect(res.status).toBe(200);
  const parser = new PDFParse({ data: new Uint8Array(res.body as Buffer) });
  const { text } = await parser.getText();
  await parser.destroy();
  return text.replace(/\s+/g, ' ');
}
async function csvRows(payAppId: string) {
  const res = await (await as('general_contractor')).get(`/api/pay-apps/${payAppId}/export.csv`);
  expect(res.status).toBe(200);
  return Papa.parse<Record<string, string>>(res.text, { header: true, skipEmptyLines: true }).data;
}
type Summary = { key: string; label: string; amountCents: number };
type Pkg = {
  schedule: Record<string, number | string | null>[];
  totals: Record<string, number | null>;
  summary: Summary[];
  changeOrders: {
    approvedCount: number;
    netChangeCents: number;
    sinceLastCents: number;
    beforeCents: number;
    lines: { number: number; title: string; amountCents: number }[];
  };
};
const amounts = (pkg: Pkg) => Object.fromEntries(pkg.summary.map((s) => [s.key, s.amountCents]));
const row = (pkg: Pkg, item: string) => pkg.schedule.find((r) => r.itemNumber === item)!;

const certify = (app: { id: string; revision: number; lines: { id: string }[] }) =>
  submitAndCertify(
    t.app,
    { subcontractor: w.people.subcontractor.email, generalContractor: w.people.general_contractor.email },
    app,
  );

let october: { id: string; revision: number; lines: { id: string }[]; currentDueCents: number; package: Pkg };

describe('the pay application package (October: work, materials stored, a deduction, field records)', () => {
  it('records the period: stored pipe, liquidated damages, truck and scale tickets, a force account day', async () => {
    const db = t.database.db;
    const sub = await as('subcontractor');
    const gc = await as('general_contractor');
    // 100 LF of pipe delivered on a paid invoice: 100 x $58.40 = $5,840.00 stored (needed 400 LF).
    expect(
      (
        await sub
          .post(`/api/stored-materials/${material.id}/movements`)
          .send({ kind: 'added', movedOn: '2026-10-20', quantity: 100, invoiceRef: 'INV-5521' })
      ).status,
    ).toBe(201);
    // Liquidated damages: 2 days x $125.00 = -$250.00 (23 CFR 635.127 arithmetic, days times the daily amount).
    expect(
      (
        await gc.post(`/api/projects/${w.home.id}/pay-adjustments`).send({
          kind: 'liquidated_damages',
          appliesOn: '2026-10-25',
          description: 'Milestone 1 late by two days',
          daysOverrun: 2,
          dailyCents: 12_500,
        })
      ).status,
    ).toBe(201);
    expect(
      (
        await sub.post(`/api/projects/${w.home.id}/trucks`).send({
          label: 'T-12',
          bedVolumeCy: 14.5,
          measuredBy: 'R. Okafor',
          measuredOn: '2026-09-28',
        })
      ).status,
    ).toBe(201);
    const ticket = {
      bidItemId: truckItem.id,
      truckLabel: 'T-12',
      material: 'Select borrow',
      source: 'Hollis pit',
      loadedAt: 'Hollis pit face 2',
      deliveredTo: 'Sta 14+00 fill',
      loadCheckerInitials: 'RO',
      deliveryCheckerInitials: 'JM',
    };
    for (const [deliveredOn, loadVolumeCy] of [
      ['2026-10-10', null],
      ['2026-10-10', 13.25],
      ['2026-11-02', null],
    ] as const) {
      expect(
        (await sub.post(`/api/projects/${w.home.id}/truck-tickets`).send({ ...ticket, deliveredOn, loadVolumeCy }))
          .status,
      ).toBe(201);
    }
    const source = await makeSource(db, w.home.id, 'Quarry north');
    expect(
      (
        await sub.post(`/api/projects/${w.home.id}/scale-tickets`).send({
          bidItemId: weightItem.id,
          sourceId: source.id,
          ticketNumber: 'S-1001',
          weighedOn: '2026-10-12',
          grossTons: 32.4,
          tareTons: 13.9,
          material: 'Crushed base',
          scaleCheckerInitials: 'KL',
          deliveryCheckerInitials: 'JM',
        })
      ).status,
    ).toBe(201);
    const co = await makeChangeOrder(db, w.home.id, w.people.general_contractor.id);
    await db
      .update(changeOrders)
      .set({ number: 3, title: 'Unsuitable subgrade at the inlet', decidedAt: new Date('2026-10-01T12:00:00Z') })
      .where(eq(changeOrders.id, co.id));
    const sheet = await sub.post(`/api/projects/${w.home.id}/daily-sheets`).send({
      changeOrderId: co.id,
      workedOn: '2026-10-14',
      description: 'Dig out and replace unsuitable subgrade at the culvert inlet',
      labor: [{ trade: 'Operator', hours: 8, rateCents: 6250 }],
      equipment: [{ unit: 'Excavator 30 t', hours: 6, rateCents: 18_500, standbyHours: 0, standbyRateCents: 0 }],
      materials: [],
      markups: { laborPercent: 25, equipmentPercent: 15, materialPercent: 15 },
    });
    expect(sheet.status).toBe(201);
    // Labor 8 x $62.50 = $500.00 + 25 % = $625.00; equipment 6 x $185.00 = $1,110.00 + 15 % = $1,276.50.
    expect(sheet.body.sheet.totalCents).toBe(190_150);
    await sub.post(`/api/daily-sheets/${sheet.body.sheet.id}/sign`);
    await gc.post(`/api/daily-sheets/${sheet.body.sheet.id}/sign`);
  });

  it('compiles October: schedule of values, summary lines and change orders to the cent', async () => {
    const res = await (
      await as('subcontractor')
    )
      .post(`/api/projects/${w.home.id}/pay-apps`)
      .send({ periodStart: '2026-10-01', periodEnd: '2026-10-31' });
    expect(res.status).toBe(201);
    october = res.body.payApp;
    const pkg = october.package;
    // B-2: 120.25 LF x $42.10 = $5,062.525 -> $5,062.53 work; $5,840.00 stored; done and stored $10,902.53 of
    // $21,050.00 = 51.79 % (rounded down); retainage 10 % of $10,902.53 = $1,090.253 -> $1,090.25.
    expect(row(pkg, 'B-2')).toMatchObject({
      scheduledValueCents: 2_105_000,
      previousCents: 0,
      thisPeriodCents: 506_253,
      storedMaterialsCents: 584_000,
      completedAndStoredCents: 1_090_253,
      percentBps: 5179,
      balanceToFinishCents: 1_014_747,
      retainageCents: 109_025,
    });
    // 400 CY x $7.25 = $2,900.00, retainage $290.00.
    expect(row(pkg, 'A-1')).toMatchObject({ completedAndStoredCents: 290_000, retainageCents: 29_000 });
    // C-3 from its October tickets (a state DOT construction manual 109.11): 14.50 (bed) + 13.25 = 27.75 CY paid
    // 27.8 CY x $4.00 = $111.20, retainage $11.12; the November load waits for November.
    expect(row(pkg, 'C-3')).toMatchObject({ thisPeriodCents: 11_120, retainageCents: 1_112 });
    // D-4 from its scale ticket (Resident Engineer's Manual 109.12): 18.50 t net, no moisture measured; 18.50 /
    // 1.473 = 12.559... -> 12.56 CY, banded to 12.5 CY x $12.00 = $150.00, retainage $15.00.
    expect(row(pkg, 'D-4')).toMatchObject({ thisPeriodCents: 15_000, retainageCents: 1_500 });
    // The signed day on its own line under the change order: $1,901.50, valued as done, retainage $190.15.
    expect(pkg.schedule.at(-1)).toMatchObject({
      kind: 'force_account',
      scheduledValueCents: 190_150,
      thisPeriodCents: 190_150,
      completedAndStoredCents: 190_150,
      percentBps: 10_000,
      balanceToFinishCents: 0,
      retainageCents: 19_015,
    });
    expect(pkg.totals).toMatchObject({
      scheduledValueCents: 5_020_150,
      storedMaterialsCents: 584_000,
      completedAndStoredCents: 1_596_523,
      retainageCents: 159_652,
    });
    // Done and stored $13,802.53 + $111.20 + $150.00 + $1,901.50 = $15,965.23; retainage $1,380.25 + $11.12 +
    // $15.00 + $190.15 = $1,596.52; earned less retainage $14,368.71; less $250.00 damages: $14,118.71 due.
    expect(amounts(pkg)).toEqual({
      originalContract: 4_830_000,
      netChangeOrders: 190_150,
      contractToDate: 5_020_150,
      completedAndStored: 1_596_523,
      retainage: 159_652,
      earnedLessRetainage: 1_436_871,
      adjustments: -25_000,
      previousCertified: 0,
      currentDue: 1_411_871,
      balanceToFinish: 3_583_279,
    });
    expect(october.currentDueCents).toBe(1_411_871);
    expect(pkg.changeOrders).toMatchObject({ approvedCount: 1, netChangeCents: 190_150, sinceLastCents: 190_150 });
    expect(pkg.changeOrders.lines[0]).toMatchObject({ amountCents: 190_150, forceAccountCents: 190_150 });
  });

  it('prints the same figures in the PDF (read back) and the CSV, with the field records as appendices', async () => {
    const text = await pdfText(october.id);
    expect(text).toContain('Original contract sum $48,300.00');
    expect(text).toContain('Work done and materials stored to date $15,965.23');
    expect(text).toContain('Less retainage held (10 %) $1,596.52');
    expect(text).toContain('Earned less retainage $14,368.71');
    expect(text).toContain('Deductions and adjustments to date -$250.00');
    expect(text).toContain('Due on this application $14,118.71');
    expect(text).toContain('Left to finish, retainage included $35,832.79');
    expect(text).toMatch(
      /CO 3 FA Force account: Unsuitable subgrade at the inlet \(1 signed day this period\) \$1,901\.50 \$0\.00 \$1,901\.50 \$0\.00 \$1,901\.50 100 % \$0\.00 \$190\.15/,
    );
    expect(text).toMatch(
      /B-2 Storm trench \$21,050\.00 \$0\.00 \$5,062\.53 \$5,840\.00 \$10,902\.53 51\.79 % \$10,147\.47 \$1,090\.25/,
    );
    expect(text).toMatch(/Total \$50,201\.50 \$0\.00 \$10,125\.23 \$5,840\.00 \$15,965\.23 .* \$1,596\.52/);
    expect(text).toContain('Milestone 1 late by two days');
    // Appendix A: two October loads, 14.50 (bed) + 13.25 (written) = 27.75 CY; the November load is not listed.
    expect(text).toContain('Appendix A - Truck tickets');
    expect(text).toMatch(/2 loads 27\.75/);
    // Appendix B: 32.40 - 13.90 = 18.50 t net.
    expect(text).toMatch(/S-1001 2026-10-12 D-4 .*32\.40 13\.90 18\.50/);
    // Appendix C: the day, $1,901.50, signed by both sides.
    expect(text).toMatch(/2026-10-14 CO \d+ Dig out .*\$625\.00 \$1,276\.50 \$0\.00 \$1,901\.50 both sides/);

    const rows = await csvRows(october.id);
    const b2 = rows.find((r) => r.item_number === 'B-2')!;
    expect(b2).toMatchObject({
      scheduled_value: '21050.00',
      materials_stored: '5840.00',
      completed_and_stored: '10902.53',
      percent_done: '51.79',
      balance_to_finish: '10147.47',
      retainage: '1090.25',
    });
    const summary = (key: string) => rows.find((r) => r.item_number === key)!.amount_to_date;
    expect(summary('SUMMARY_CURRENT_DUE')).toBe('14118.71');
    expect(summary('SUMMARY_ADJUSTMENTS')).toBe('-250.00');
    expect(summary('SUMMARY_BALANCE_TO_FINISH')).toBe('35832.79');
    expect(summary('CHANGE_ORDERS_NET')).toBe('1901.50');
    expect(rows.find((r) => r.item_number?.endsWith(' FA'))).toMatchObject({
      this_period_amount: '1901.50',
      amount_to_date: '1901.50',
      retainage: '190.15',
      scheduled_value: '1901.50',
      balance_to_finish: '0.00',
    });
  });
});

describe('an approved change order reaches the next application everywhere (issue 11 item 3)', () => {
  let november: { id: string; currentDueCents: number; package: Pkg };
  let coNumber: number;

  it('certifies October, approves +600 CY at $8.00 on A-1, and compiles November', async () => {
    await certify(october);
    const co = (
      await (await as('subcontractor')).post(`/api/projects/${w.home.id}/change-orders`).send({
        title: 'North pad extension',
        reason: 'The pad grew 40 ft north',
        items: [
          { kind: 'change_quantity', bidItemId: billable.a.id, quantityDelta: 600 },
          { kind: 'change_price', bidItemId: billable.a.id, newUnitPriceCents: 800 },
        ],
      })
    ).body.changeOrder;
    coNumber = co.number;
    expect((await (await as('general_contractor')).post(`/api/change-orders/${co.id}/approve`).send({})).status).toBe(
      200,
    );
    // November: A-1 100 CY (the factory's tally of 2026-11-02), B-2 40 LF laid, 40 LF of the stored pipe used.
    await makeTally(t.database.db, {
      projectId: w.home.id,
      bidItemId: billable.b.id,
      authorUserId: w.people.subcontractor.id,
      measuredOn: '2026-11-06',
      quantity: 40,
    });
    expect(
      (
        await (
          await as('subcontractor')
        )
          .post(`/api/stored-materials/${material.id}/movements`)
          .send({ kind: 'used', movedOn: '2026-11-06', quantity: 40 })
      ).status,
    ).toBe(201);
    const res = await (
      await as('subcontractor')
    )
      .post(`/api/projects/${w.home.id}/pay-apps`)
      .send({ periodStart: '2026-11-01', periodEnd: '2026-11-30' });
    expect(res.status).toBe(201);
    november = res.body.payApp;
  });

  it('shows the change on the schedule of values, the summary lines and the change order summary', async () => {
    const pkg = november.package;
    // A-1 now 1,600 CY x $8.00 = $12,800.00; to date $2,900.00 certified + (500 - 400) x $8.00 = $3,700.00.
    expect(row(pkg, 'A-1')).toMatchObject({
      scheduledValueCents: 1_280_000,
      previousCents: 290_000,
      thisPeriodCents: 80_000,
      completedAndStoredCents: 370_000,
      percentBps: 2890,
      balanceToFinishCents: 910_000,
      retainageCents: 37_000,
    });
    // B-2: 160.25 LF x $42.10 = $6,746.525 -> $6,746.53; 60 LF stored x $58.40 = $3,504.00; retainage 10 % of
    // $10,250.53 -> $1,025.05.
    expect(row(pkg, 'B-2')).toMatchObject({
      previousCents: 506_253,
      thisPeriodCents: 168_400,
      storedMaterialsCents: 350_400,
      completedAndStoredCents: 1_025_053,
      retainageCents: 102_505,
    });
    // C-3: the November load, 14.50 CY (bed) paid 14.5; to date 27.8 + 14.5 = 42.3 CY x $4.00 = $169.20, retainage
    // $16.92. The October tickets are not paid again.
    expect(row(pkg, 'C-3')).toMatchObject({ previousCents: 11_120, thisPeriodCents: 5_800, retainageCents: 1_692 });
    expect(row(pkg, 'D-4')).toMatchObject({ previousCents: 15_000, thisPeriodCents: 0 });
    // The force account line carries its certified $1,901.50 and no new day.
    expect(pkg.schedule.at(-1)).toMatchObject({ previousCents: 190_150, thisPeriodCents: 0, retainageCents: 19_015 });
    // Contract $48,300.00 + $5,550.00 (1,600 x $8.00 - 1,000 x $7.25) + $1,901.50 force account = $55,751.50.
    // Done and stored $3,700.00 + $10,250.53 + $169.20 + $150.00 + $1,901.50 = $16,171.23; retainage $370.00 +
    // $1,025.05 + $16.92 + $15.00 + $190.15 = $1,617.12; earned less retainage $14,554.11; less damages $250.00
    // and October's $14,118.71: $185.40 due.
    expect(amounts(pkg)).toEqual({
      originalContract: 4_830_000,
      netChangeOrders: 745_150,
      contractToDate: 5_575_150,
      completedAndStored: 1_617_123,
      retainage: 161_712,
      earnedLessRetainage: 1_455_411,
      adjustments: -25_000,
      previousCertified: 1_411_871,
      currentDue: 18_540,
      balanceToFinish: 4_119_739,
    });
    expect(november.currentDueCents).toBe(18_540);
    expect(pkg.totals.scheduledValueCents).toBe(5_575_150);
    expect(pkg.changeOrders).toMatchObject({
      approvedCount: 2,
      beforeCents: 190_150,
      sinceLastCents: 555_000,
      netChangeCents: 745_150,
    });
    expect(pkg.changeOrders.lines.at(-1)).toMatchObject({
      number: coNumber,
      title: 'North pad extension',
      amountCents: 555_000,
    });
  });

  it('prints the change in the PDF and the CSV of November', async () => {
    const text = await pdfText(november.id);
    expect(text).toContain('Change orders approved, net $7,451.50');
    expect(text).toContain('Contract sum to date $55,751.50');
    expect(text).toContain('Approved since the last application $5,550.00');
    expect(text).toMatch(new RegExp(`CO ${coNumber} North pad extension \\d{4}-\\d{2}-\\d{2} \\$5,550\\.00`));
    expect(text).toMatch(/A-1 .* \$12,800\.00 \$2,900\.00 \$800\.00 \$0\.00 \$3,700\.00 28\.9 % \$9,100\.00 \$370\.00/);
    expect(text).toContain('Due on this application $185.40');
    const rows = await csvRows(november.id);
    expect(rows.find((r) => r.item_number === 'A-1')).toMatchObject({
      unit_price: '8.00',
      contract_quantity: '1600',
      scheduled_value: '12800.00',
      completed_and_stored: '3700.00',
    });
    const amount = (key: string) => rows.find((r) => r.item_number === key)!.amount_to_date;
    expect(amount('SUMMARY_NET_CHANGE_ORDERS')).toBe('7451.50');
    expect(amount('SUMMARY_CONTRACT_TO_DATE')).toBe('55751.50');
    expect(amount(`CHANGE_ORDER_${coNumber}`)).toBe('5550.00');
    expect(amount('CHANGE_ORDERS_SINCE_LAST')).toBe('5550.00');
    expect(amount('SUMMARY_CURRENT_DUE')).toBe('185.40');
  });

  it('leaves October as certified: its package still counts only what was approved before it', async () => {
    const again = (await (await as('owner')).get(`/api/pay-apps/${october.id}`)).body.payApp;
    expect(amounts(again.package)).toEqual(amounts(october.package));
    expect(again.package.changeOrders.approvedCount).toBe(1);
  });
});
