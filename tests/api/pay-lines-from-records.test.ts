import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  auditEvents,
  bidItemProfiles,
  tallies,
  forceAccountSheets,
  payApps,
  scaleTickets,
  truckTickets,
} from '../../server/db/schema';
import { makeWorld } from '../setup/factories';
import { makeTally } from '../setup/pay-cycle-factories';
import { makeChangeOrder, makeProfiledItem, makeSource } from '../setup/provisions-factories';
import { submitAndCertify } from '../setup/certify';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

// Invented figures (test data), worked by hand below. Items: L-1 borrow by truck measure, 5,000 CY at $6.00;
// W-2 aggregate by weight, 800 TON at $21.50. Retainage 10 % (the project's rate), each line rounded once.
let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
let truckItem: { id: string };
let weightItem: { id: string };
let changeOrder: { id: string; number: number };
let forceItem: { id: string };
let strayTally: { id: string };
let sheetIds: string[];

type Who = keyof typeof w.people;
const as = (who: Who) => signedInAgent(t.app, w.people[who].email);

beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
  const db = t.database.db;
  truckItem = await makeProfiledItem(db, w.home.id, 'truck_measure', {
    itemNumber: 'L-1',
    description: 'Borrow by truck measure',
    payUnit: 'CY',
    unitPriceCents: 600,
    contractQuantity: 5000,
  });
  weightItem = await makeProfiledItem(db, w.home.id, 'weight', {
    itemNumber: 'W-2',
    description: 'Aggregate by weight',
    payUnit: 'TON',
    unitPriceCents: 2150,
    contractQuantity: 800,
  });
  // Tons are paid to 0.01 (the unit's default), measured to 0.001.
  await db.update(bidItemProfiles).set({ payDecimals: 2 }).where(eq(bidItemProfiles.bidItemId, weightItem.id));
  changeOrder = await makeChangeOrder(db, w.home.id, w.people.general_contractor.id);
  // An item paid by force account, with a tally saved for it by mistake in March: the days pay it, never the tally.
  forceItem = await makeProfiledItem(db, w.home.id, 'force_account', {
    itemNumber: 'FA-3',
    description: 'Extra work on time and materials',
    payUnit: 'LS',
    unitPriceCents: 500_000,
    contractQuantity: 1,
  });
  strayTally = await makeTally(db, {
    projectId: w.home.id,
    bidItemId: forceItem.id,
    authorUserId: w.people.subcontractor.id,
    measuredOn: '2026-03-12',
    quantity: 0.5,
  });
});
afterAll(() => t.close());

const ticket = (truckLabel: string, deliveredOn: string, loadVolumeCy: number | null = null) => ({
  bidItemId: truckItem.id,
  truckLabel,
  deliveredOn,
  loadVolumeCy,
  material: 'Select borrow',
  source: 'Ridge pit',
  loadedAt: 'Ridge pit bench 1',
  deliveredTo: 'Sta 40+00 embankment',
  loadCheckerInitials: 'DV',
  deliveryCheckerInitials: 'PA',
});
const day = (workedOn: string) => ({
  changeOrderId: changeOrder.id,
  workedOn,
  description: 'Pump out and dewater the outlet pit',
  labor: [{ trade: 'Laborer', hours: 10, rateCents: 4800 }],
  equipment: [],
  materials: [],
  markups: { laborPercent: 20, equipmentPercent: 0, materialPercent: 0 },
});

async function compile(periodStart: string, periodEnd: string) {
  const res = await (
    await as('subcontractor')
  )
    .post(`/api/projects/${w.home.id}/pay-apps`)
    .send({ periodStart, periodEnd });
  expect(res.status).toBe(201);
  return res.body.payApp;
}

const certify = (app: { id: string; revision: number; lines: { id: string }[] }) =>
  submitAndCertify(
    t.app,
    { subcontractor: w.people.subcontractor.email, generalContractor: w.people.general_contractor.email },
    app,
  );

type Line = {
  bidItemId: string;
  thisPeriodQuantity: number;
  previousQuantity: number;
  thisPeriodAmountCents: number;
  paidFrom: string;
};
const lineOf = (app: { lines: Line[] }, itemId: string) => app.lines.find((l) => l.bidItemId === itemId)!;

let first: {
  id: string;
  revision: number;
  lines: (Line & { id: string })[];
  forceAccount: { changeOrderNumber: number; days: number; thisPeriodAmountCents: number; retainageCents: number }[];
  ticketHolds: { kind: string; label: string; itemNumber: string; reasons: string[] }[];
  currentDueCents: number;
};

describe('tickets and signed days become pay lines at compilation (issue 15, items 1 and 2)', () => {
  it('records March: two registered loads, one on a truck not on the register, a scale ticket, two days', async () => {
    const sub = await as('subcontractor');
    const gc = await as('general_contractor');
    const truck = { label: 'R-4', bedVolumeCy: 16.35, measuredBy: 'D. Vance', measuredOn: '2026-02-26' };
    expect((await sub.post(`/api/projects/${w.home.id}/trucks`).send(truck)).status).toBe(201);
    for (const body of [ticket('R-4', '2026-03-03'), ticket('R-4', '2026-03-03', 15.9), ticket('R-9', '2026-03-04')])
      expect((await sub.post(`/api/projects/${w.home.id}/truck-tickets`).send(body)).status).toBe(201);
    const source = await makeSource(t.database.db, w.home.id, 'Ridge quarry');
    const weighed = await sub.post(`/api/projects/${w.home.id}/scale-tickets`).send({
      bidItemId: weightItem.id,
      sourceId: source.id,
      ticketNumber: 'Q-2201',
      weighedOn: '2026-03-05',
      grossTons: 36.84,
      tareTons: 14.2,
      moisturePercent: 9,
      material: 'Crushed aggregate',
      scaleCheckerInitials: 'MT',
      deliveryCheckerInitials: 'PA',
    });
    expect(weighed.status).toBe(201);
    sheetIds = [];
    for (const workedOn of ['2026-03-10', '2026-03-11']) {
      const res = await sub.post(`/api/projects/${w.home.id}/daily-sheets`).send(day(workedOn));
      expect(res.status).toBe(201);
      sheetIds.push(res.body.sheet.id);
    }
    // Both sides sign the first day; the second has only the subcontractor's signature.
    expect((await sub.post(`/api/daily-sheets/${sheetIds[0]}/sign`)).status).toBe(200);
    expect((await gc.post(`/api/daily-sheets/${sheetIds[0]}/sign`)).status).toBe(200);
    expect((await sub.post(`/api/daily-sheets/${sheetIds[1]}/sign`)).status).toBe(200);
  });

  it('refuses the compilation to the general contractor and the owner (403) and an outsider (404)', async () => {
    for (const who of ['general_contractor', 'owner'] as const) {
      const res = await (
        await as(who)
      )
        .post(`/api/projects/${w.home.id}/pay-apps`)
        .send({ periodStart: '2026-03-01', periodEnd: '2026-03-31' });
      expect(res.status).toBe(403);
    }
    const outsider = await signedInAgent(t.app, w.outsider.email);
    const res = await outsider
      .post(`/api/projects/${w.home.id}/pay-apps`)
      .send({ periodStart: '2026-03-01', periodEnd: '2026-03-31' });
    expect(res.status).toBe(404);
    expect(await t.database.db.select().from(payApps).where(eq(payApps.projectId, w.home.id))).toEqual([]);
  });

  it('pays L-1 from its registered loads, holds the unregistered one with its reason, and W-2 from its weight', async () => {
    first = await compile('2026-03-01', '2026-03-31');
    // L-1 (a state DOT construction manual 109.11): 16.35 (bed) + 15.90 = 32.25 CY computed, 32.3 CY paid;
    // 32.3 x $6.00 = $193.80.
    expect(lineOf(first, truckItem.id)).toMatchObject({ thisPeriodQuantity: 32.3, thisPeriodAmountCents: 19_380 });
    expect(first.ticketHolds).toEqual([
      expect.objectContaining({
        kind: 'truck',
        label: 'R-9',
        itemNumber: 'L-1',
        reasons: ['Truck not on the register'],
      }),
    ]);
    // W-2 (Resident Engineer's Manual 109.12): net 36.84 - 14.20 = 22.64 t at 9 % moisture, above the source's
    // stated 5 %: 22.64 x 100 / 109 = 20.7706... -> 20.77 t; x $21.50 = $446.555 -> $446.56.
    expect(lineOf(first, weightItem.id)).toMatchObject({ thisPeriodQuantity: 20.77, thisPeriodAmountCents: 44_656 });
    // The day signed by both sides: 10 h x $48.00 = $480.00 + 20 % = $576.00, retainage $57.60; the half-signed
    // day waits.
    expect(first.forceAccount).toEqual([
      expect.objectContaining({
        changeOrderNumber: changeOrder.number,
        days: 1,
        thisPeriodAmountCents: 57_600,
        retainageCents: 5_760,
      }),
    ]);
    // ($193.80 + $446.56 + $576.00) = $1,216.36 less 10 % retainage per line ($19.38 + $44.66 + $57.60 = $121.64).
    expect(first.currentDueCents).toBe(109_472);
  });

  it('pays an item on force account from its signed days only: a tally for it bills nothing and stays ready', async () => {
    // MoDOT EPG 109.5: force account work is paid on the signed daily records; the tally's 0.5 LS x $5,000.00 would
    // pay the same work a second time. The due above already leaves it out.
    expect(lineOf(first, forceItem.id)).toMatchObject({
      thisPeriodQuantity: 0,
      thisPeriodAmountCents: 0,
      paidFrom: 'days',
    });
    expect(lineOf(first, truckItem.id)).toMatchObject({ paidFrom: 'tickets' });
    const [tally] = await t.database.db.select().from(tallies).where(eq(tallies.id, strayTally.id));
    expect(tally).toMatchObject({ status: 'ready', payAppId: null });
  });

  it('links what it paid to the application and writes one audit event naming them', async () => {
    const db = t.database.db;
    const paidLoads = await db.select().from(truckTickets).where(eq(truckTickets.payAppId, first.id));
    expect(paidLoads).toHaveLength(2);
    expect(await db.select().from(scaleTickets).where(eq(scaleTickets.payAppId, first.id))).toHaveLength(1);
    const days = await db.select().from(forceAccountSheets).where(eq(forceAccountSheets.payAppId, first.id));
    expect(days.map((d) => d.id)).toEqual([sheetIds[0]]);
    const events = await db.select().from(auditEvents).where(eq(auditEvents.objectId, first.id));
    expect(events.map((e) => e.action)).toEqual(['pay_app.created']);
    expect(events[0]!.after).toMatchObject({
      truckTicketIds: expect.arrayContaining(paidLoads.map((p) => p.id)),
      ticketsHeld: 1,
      dailySheetIds: [sheetIds[0]],
    });
  });

  it('shows the force account line to the owner once certified, never before (404 while a draft)', async () => {
    expect((await (await as('owner')).get(`/api/pay-apps/${first.id}`)).status).toBe(404);
    await certify(first);
    const seen = await (await as('owner')).get(`/api/pay-apps/${first.id}`);
    expect(seen.status).toBe(200);
    expect(seen.body.payApp.forceAccount[0]).toMatchObject({ amountToDateCents: 57_600 });
    expect(seen.body.payApp.package.schedule.at(-1)).toMatchObject({
      kind: 'force_account',
      scheduledValueCents: 57_600,
    });
  });

  it('pays April what was cleared since (truck registered, second signature) and never pays March again', async () => {
    const sub = await as('subcontractor');
    const gc = await as('general_contractor');
    const truck = { label: 'R-9', bedVolumeCy: 12.8, measuredBy: 'D. Vance', measuredOn: '2026-04-01' };
    expect((await sub.post(`/api/projects/${w.home.id}/trucks`).send(truck)).status).toBe(201);
    expect((await gc.post(`/api/daily-sheets/${sheetIds[1]}/sign`)).status).toBe(200);
    const april = await compile('2026-04-01', '2026-04-30');
    // L-1: only the held R-9 load, now on the register at 12.80 CY: 12.8 CY this period, 32.3 before.
    expect(lineOf(april, truckItem.id)).toMatchObject({ previousQuantity: 32.3, thisPeriodQuantity: 12.8 });
    expect(april.ticketHolds).toEqual([]);
    // W-2: nothing new.
    expect(lineOf(april, weightItem.id)).toMatchObject({ previousQuantity: 20.77, thisPeriodQuantity: 0 });
    // The second March day, signed in April: paid now, on the same change order's line after March's $576.00.
    expect(april.forceAccount).toEqual([
      expect.objectContaining({ days: 1, previousAmountCents: 57_600, thisPeriodAmountCents: 57_600 }),
    ]);
    expect(april.package.changeOrders.lines).toEqual([
      expect.objectContaining({ number: changeOrder.number, amountCents: 115_200, forceAccountCents: 115_200 }),
    ]);
  });
});
