import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEvents, forceAccountSheets, storedMaterialMovements } from '../../server/db/schema';
import { makeBidItem, makeWorld } from '../setup/factories';
import { makeChangeOrder, makeStoredMaterial } from '../setup/provisions-factories';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
});
afterAll(() => t.close());

const as = (who: keyof typeof w.people | 'outsider') =>
  signedInAgent(t.app, who === 'outsider' ? w.outsider.email : w.people[who].email);

const sheet = (changeOrderId: string, workedOn = '2026-06-02') => ({
  changeOrderId,
  workedOn,
  description: 'Dig out and replace unsuitable subgrade at the culvert inlet',
  labor: [
    { trade: 'Operator', hours: 8, rateCents: 6250 },
    { trade: 'Laborer', hours: 8, rateCents: 4125 },
  ],
  equipment: [{ unit: 'Excavator 30 t', hours: 6, rateCents: 18_500, standbyHours: 2, standbyRateCents: 9250 }],
  materials: [{ description: 'Geotextile, 2 rolls', invoiceCents: 41_238 }],
  markups: { laborPercent: 25, equipmentPercent: 15, materialPercent: 15 },
});

describe('force account daily sheets', () => {
  it('totals a day with the contract markups ($3,000.99, hand-worked in the domain tests) and needs both sides to sign', async () => {
    const co = await makeChangeOrder(t.database.db, w.home.id, w.people.general_contractor.id);
    const sub = await as('subcontractor');
    const made = await sub.post(`/api/projects/${w.home.id}/daily-sheets`).send(sheet(co.id));
    expect(made.status).toBe(201);
    expect(made.body.sheet).toMatchObject({ totalCents: 300_099, complete: false, contractorSignedAt: null });
    const id = made.body.sheet.id;
    const first = await sub.post(`/api/daily-sheets/${id}/sign`);
    expect(first.status).toBe(200);
    expect(first.body.sheet.contractorSignedAt).not.toBeNull();
    expect((await sub.post(`/api/daily-sheets/${id}/sign`)).status).toBe(409);
    expect((await (await as('owner')).post(`/api/daily-sheets/${id}/sign`)).status).toBe(403);
    expect((await (await as('outsider')).post(`/api/daily-sheets/${id}/sign`)).status).toBe(404);
    const gc = await (await as('general_contractor')).post(`/api/daily-sheets/${id}/sign`);
    expect(gc.body.sheet.complete).toBe(true);
    const events = await t.database.db.select().from(auditEvents).where(eq(auditEvents.objectId, id));
    expect(events.map((e) => e.action)).toEqual([
      'force_account_sheet.added',
      'force_account_sheet.signed',
      'force_account_sheet.signed',
    ]);
  });

  it('refuses work under a change order not yet approved (409), of another project (400), and a second sheet for the same day', async () => {
    const db = t.database.db;
    const proposed = await makeChangeOrder(db, w.home.id, w.people.general_contractor.id, 'proposed');
    const foreign = await makeChangeOrder(db, w.foreign.id, w.outsider.id);
    const sub = await as('subcontractor');
    const notYet = await sub.post(`/api/projects/${w.home.id}/daily-sheets`).send(sheet(proposed.id));
    expect(notYet.status).toBe(409);
    expect(notYet.body.error.code).toBe('CHANGE_ORDER_NOT_APPROVED');
    const cross = await sub.post(`/api/projects/${w.home.id}/daily-sheets`).send(sheet(foreign.id));
    expect(cross.status).toBe(400);
    expect(cross.body.error.details[0].path).toBe('changeOrderId');
    const co = await makeChangeOrder(db, w.home.id, w.people.general_contractor.id);
    expect((await sub.post(`/api/projects/${w.home.id}/daily-sheets`).send(sheet(co.id, '2026-06-03'))).status).toBe(
      201,
    );
    const twice = await sub.post(`/api/projects/${w.home.id}/daily-sheets`).send(sheet(co.id, '2026-06-03'));
    expect(twice.status).toBe(409);
    const [rows] = await db
      .select({ n: count() })
      .from(forceAccountSheets)
      .where(eq(forceAccountSheets.changeOrderId, co.id));
    expect(rows!.n).toBe(1);
  });

  it('refuses more than 24 hours on one unit naming the line, and the owner recording a sheet (403)', async () => {
    const co = await makeChangeOrder(t.database.db, w.home.id, w.people.general_contractor.id);
    const body = sheet(co.id, '2026-06-04');
    body.equipment[0]!.hours = 20;
    body.equipment[0]!.standbyHours = 6;
    const res = await (await as('general_contractor')).post(`/api/projects/${w.home.id}/daily-sheets`).send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].path).toBe('equipment.0');
    expect(
      (await (await as('owner')).post(`/api/projects/${w.home.id}/daily-sheets`).send(sheet(co.id, '2026-06-05')))
        .status,
    ).toBe(403);
  });
});

describe('stored materials', () => {
  it('keeps a running account per period and pays only what the job still needs (23 CFR 635.122)', async () => {
    const db = t.database.db;
    const item = await makeBidItem(db, w.home.id, { itemNumber: 'SM-1', payUnit: 'LF' });
    const sub = await as('subcontractor');
    const made = await sub.post(`/api/projects/${w.home.id}/stored-materials`).send({
      bidItemId: item.id,
      description: '24 in RCP, class III',
      unit: 'LF',
      unitCostCents: 5840,
      neededQuantity: 400,
      storedAt: 'Yard east of Sta 20+00',
    });
    expect(made.status).toBe(201);
    const id = made.body.material.id;
    const move = (kind: string, movedOn: string, quantity: number, invoiceRef = '') =>
      sub.post(`/api/stored-materials/${id}/movements`).send({ kind, movedOn, quantity, invoiceRef });
    expect((await move('added', '2026-05-12', 240, 'INV-3381')).status).toBe(201);
    expect((await move('added', '2026-06-03', 200, 'INV-3420')).status).toBe(201);
    expect((await move('used', '2026-06-20', 150)).status).toBe(201);
    const june = await sub.get(`/api/projects/${w.home.id}/stored-materials?from=2026-06-01&to=2026-06-30`);
    const account = june.body.materials.find((m: { id: string }) => m.id === id).account;
    // 240 + 200 - 150 = 290 LF on hand; 400 - 150 = 250 LF still needed; 250 x $58.40 = $14,600.00.
    expect(account).toEqual({
      previousQuantity: 240,
      addedQuantity: 200,
      usedQuantity: 150,
      remainingQuantity: 290,
      payableQuantity: 250,
      payableCents: 1_460_000,
    });
  });

  it('refuses an addition without its invoice, and a use of more than is on hand, with nothing saved', async () => {
    const db = t.database.db;
    const item = await makeBidItem(db, w.home.id, { itemNumber: 'SM-2' });
    const material = await makeStoredMaterial(db, w.home.id, item.id);
    const gc = await as('general_contractor');
    const noInvoice = await gc
      .post(`/api/stored-materials/${material.id}/movements`)
      .send({ kind: 'added', movedOn: '2026-05-01', quantity: 10 });
    expect(noInvoice.status).toBe(400);
    expect(noInvoice.body.error.details[0].path).toBe('invoiceRef');
    const over = await gc
      .post(`/api/stored-materials/${material.id}/movements`)
      .send({ kind: 'used', movedOn: '2026-05-01', quantity: 10 });
    expect(over.status).toBe(400);
    expect(over.body.error.details[0].path).toBe('quantity');
    const rows = await db
      .select()
      .from(storedMaterialMovements)
      .where(eq(storedMaterialMovements.storedMaterialId, material.id));
    expect(rows).toEqual([]);
    expect(
      (
        await (
          await as('owner')
        )
          .post(`/api/stored-materials/${material.id}/movements`)
          .send({ kind: 'added', movedOn: '2026-05-01', quantity: 1, invoiceRef: 'X' })
      ).status,
    ).toBe(403);
    expect(
      (
        await (
          await as('outsider')
        )
          .post(`/api/stored-materials/${material.id}/movements`)
          .send({ kind: 'added', movedOn: '2026-05-01', quantity: 1, invoiceRef: 'X' })
      ).status,
    ).toBe(404);
  });
});

describe('deductions and adjustments on their own lines', () => {
  it('computes liquidated damages and a fuel adjustment on the server, and keeps a credit negative', async () => {
    const gc = await as('general_contractor');
    const ld = await gc
      .post(`/api/projects/${w.home.id}/pay-adjustments`)
      .send({
        kind: 'liquidated_damages',
        appliesOn: '2026-11-30',
        description: 'Completion 12 days late',
        daysOverrun: 12,
        dailyCents: 285_000,
      });
    expect(ld.status).toBe(201);
    expect(ld.body.adjustment).toMatchObject({
      amountCents: -3_420_000,
      basis: { daysOverrun: 12, dailyCents: 285_000 },
    });
    const fuel = await (
      await as('admin')
    )
      .post(`/api/projects/${w.home.id}/pay-adjustments`)
      .send({
        kind: 'fuel_adjustment',
        appliesOn: '2026-06-30',
        description: 'June diesel index',
        fuelKind: 'excavation',
        quantityCy: 25_000,
        baseIndex: 2.85,
        currentIndex: 3.215,
      });
    expect(fuel.body.adjustment.amountCents).toBe(182_500); // 5,000 gal x $0.365 (Iowa DOT 2120 factor 0.20)
    const credit = await gc
      .post(`/api/projects/${w.home.id}/pay-adjustments`)
      .send({ kind: 'credit', appliesOn: '2026-06-30', description: 'Owner-furnished pipe', amountCents: 125_000 });
    expect(credit.body.adjustment.amountCents).toBe(-125_000);
    const list = await (await as('owner')).get(`/api/projects/${w.home.id}/pay-adjustments`);
    expect(list.body.adjustments.map((a: { kind: string }) => a.kind)).toEqual([
      'fuel_adjustment',
      'credit',
      'liquidated_damages',
    ]);
  });

  it('refuses the subcontractor and the owner (403) and a client-sent amount on a computed kind (400)', async () => {
    const body = {
      kind: 'liquidated_damages',
      appliesOn: '2026-11-30',
      description: 'Late',
      daysOverrun: 2,
      dailyCents: 100,
    };
    for (const who of ['subcontractor', 'owner'] as const) {
      expect((await (await as(who)).post(`/api/projects/${w.home.id}/pay-adjustments`).send(body)).status, who).toBe(
        403,
      );
    }
    const sneaky = await (
      await as('general_contractor')
    )
      .post(`/api/projects/${w.home.id}/pay-adjustments`)
      .send({ ...body, amountCents: 5 });
    expect(sneaky.status).toBe(400);
  });
});
