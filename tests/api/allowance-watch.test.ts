import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bidItems, changeOrderItems } from '../../server/db/schema';
import { makeWorld } from '../setup/factories';
import { makeChangeOrder, makeProfiledItem } from '../setup/provisions-factories';
import { approveAndCertify } from '../setup/certify';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

// An allowance item the change order added, paid by force account (MoDOT EPG 109.5: force account work is paid on
// the signed daily records under the change order that authorised it). Invented figures, worked by hand: the
// allowance is 1 LS at $1,500.00; one day of 10 h at $48.00 + 20 % = $576.00, or 576 / 1,500 = 0.384 LS drawn.
let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
let allowance: { id: string };
let order: { id: string };

const as = (who: keyof typeof w.people) => signedInAgent(t.app, w.people[who].email);

beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
  const db = t.database.db;
  order = await makeChangeOrder(db, w.home.id, w.people.general_contractor.id);
  allowance = await makeProfiledItem(db, w.home.id, 'force_account', {
    itemNumber: 'FA-9',
    description: 'Extra work on time and materials, allowance',
    payUnit: 'LS',
    unitPriceCents: 150_000,
    contractQuantity: 1,
  });
  await db.update(bidItems).set({ addedByChangeOrderId: order.id }).where(eq(bidItems.id, allowance.id));
  await db.insert(changeOrderItems).values({ changeOrderId: order.id, kind: 'add_item', bidItemId: allowance.id });
});
afterAll(() => t.close());

const watchRowOf = async () => {
  const res = await (await as('owner')).get(`/api/projects/${w.home.id}/variance`);
  expect(res.status).toBe(200);
  return res.body.rows.find((r: { bidItemId: string }) => r.bidItemId === allowance.id);
};

describe('an allowance drawn by force account days on the quantity watch', () => {
  it('shows the days drawn, pending once claimed and approved once certified, at the allowance’s price', async () => {
    const sub = await as('subcontractor');
    const gc = await as('general_contractor');
    const day = await sub.post(`/api/projects/${w.home.id}/daily-sheets`).send({
      changeOrderId: order.id,
      workedOn: '2026-03-10',
      description: 'Pump out and dewater the outlet pit',
      labor: [{ trade: 'Laborer', hours: 10, rateCents: 4800 }],
      equipment: [],
      materials: [],
      markups: { laborPercent: 20, equipmentPercent: 0, materialPercent: 0 },
    });
    expect(day.status).toBe(201);
    expect((await sub.post(`/api/daily-sheets/${day.body.sheet.id}/sign`)).status).toBe(200);
    expect((await gc.post(`/api/daily-sheets/${day.body.sheet.id}/sign`)).status).toBe(200);
    expect(await watchRowOf()).toMatchObject({ approvedToDate: 0, pending: 0, currentContractQuantity: 1 });

    const compiled = await sub
      .post(`/api/projects/${w.home.id}/pay-apps`)
      .send({ periodStart: '2026-03-01', periodEnd: '2026-03-31' });
    expect(compiled.status).toBe(201);
    const app = compiled.body.payApp;
    // Its own line bills nothing; the change order's force account line carries the $576.00.
    expect(app.lines.find((l: { bidItemId: string }) => l.bidItemId === allowance.id)).toMatchObject({
      paidFrom: 'days',
      thisPeriodQuantity: 0,
      amountToDateCents: 0,
    });
    expect(app.forceAccount).toEqual([expect.objectContaining({ thisPeriodAmountCents: 57_600 })]);
    expect((await sub.post(`/api/pay-apps/${app.id}/submit`).send({ expectedRevision: app.revision })).status).toBe(
      200,
    );
    expect(await watchRowOf()).toMatchObject({ approvedToDate: 0, pending: 0.384, forecastAtCompletion: 0.384 });

    await approveAndCertify(t.app, w.people.general_contractor.email, app);
    expect(await watchRowOf()).toMatchObject({
      approvedToDate: 0.384,
      pending: 0,
      status: 'within',
      drawnByForceAccount: true,
    });
  });
});
