import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEvents, projects } from '../../server/db/schema';
import { makePayApp } from '../setup/change-order-factories';
import { addMember, makeBidItem, makeProject, makeWorld } from '../setup/factories';
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

type Row = { bidItemId: string; status: string; quantityBeyondBand: number; amountBeyondBandCents: number; variancePercent: number };

/** A fresh project of the home companies with one 10,000 CY item at $5.00, the home people on it. */
async function projectWith(preset: 'far-15' | 'major-125-75' | 'custom', extra: Partial<typeof projects.$inferInsert> = {}) {
  const { db } = t.database;
  const p = await makeProject(db, { subcontractor: w.companies.sub.id, general_contractor: w.companies.gc.id, owner: w.companies.owner.id });
  await db.update(projects).set({ variationPreset: preset, ...extra }).where(eq(projects.id, p.id));
  for (const role of ['subcontractor', 'general_contractor', 'owner'] as const) await addMember(db, p.id, w.people[role].id, role);
  const item = await makeBidItem(db, p.id, { contractQuantity: 10_000, unitPriceCents: 500 });
  return { project: p, item };
}

async function rowAfterForecast(projectId: string, bidItemId: string, forecastQuantity: number): Promise<Row> {
  const sub = await as('subcontractor');
  const put = await sub.put(`/api/bid-items/${bidItemId}/forecast`).send({ forecastQuantity, note: 'survey' });
  expect(put.status).toBe(200);
  const res = await sub.get(`/api/projects/${projectId}/variance`);
  return res.body.rows.find((r: Row) => r.bidItemId === bidItemId);
}

describe('variance watch: band edges against the published clauses', () => {
  it('FAR 52.211-18 on 10,000 estimated: 11,500 none, 12,000 500 above, 8,000 500 below, 85 % none', async () => {
    const { project, item } = await projectWith('far-15');
    // FAR 52.211-18: exactly 115 % is not beyond the band
    expect(await rowAfterForecast(project.id, item.id, 11_500)).toMatchObject({ quantityBeyondBand: 0, amountBeyondBandCents: 0 });
    // FAR 52.211-18: 12,000 -> 500 above 115 %; 500 CY x $5.00 = $2,500.00
    expect(await rowAfterForecast(project.id, item.id, 12_000)).toMatchObject({ status: 'over', quantityBeyondBand: 500, amountBeyondBandCents: 250_000, variancePercent: 20 });
    // FAR 52.211-18: 8,000 -> 500 below 85 %
    expect(await rowAfterForecast(project.id, item.id, 8_000)).toMatchObject({ status: 'under', quantityBeyondBand: 500 });
    // FAR 52.211-18: exactly 85 % is not beyond the band
    expect(await rowAfterForecast(project.id, item.id, 8_500)).toMatchObject({ quantityBeyondBand: 0 });
  });

  it('23 CFR 635.109(a)(3): exactly 125 % of a major item is not above; past it is; a minor item has no band', async () => {
    const { project, item } = await projectWith('major-125-75');
    const { db } = t.database;
    const minor = await makeBidItem(db, project.id, { contractQuantity: 10, unitPriceCents: 100 });
    // The 10,000 CY item is nearly the whole contract amount, so it is major by the 10 % threshold.
    expect(await rowAfterForecast(project.id, item.id, 12_500)).toMatchObject({ status: 'early_warning', quantityBeyondBand: 0 });
    expect(await rowAfterForecast(project.id, item.id, 12_600)).toMatchObject({ status: 'over', quantityBeyondBand: 100 });
    // 23 CFR 635.109(a)(3): a decrease below 75 %
    expect(await rowAfterForecast(project.id, item.id, 7_000)).toMatchObject({ status: 'under', quantityBeyondBand: 500 });
    expect(await rowAfterForecast(project.id, minor.id, 100)).toMatchObject({ status: 'no_band', quantityBeyondBand: 0 });
  });

  it('uses the project band for a custom clause and warns early past 80 % of it (our product setting)', async () => {
    const { project, item } = await projectWith('custom', { bandOverBps: 1000, bandUnderBps: 2000 });
    expect(await rowAfterForecast(project.id, item.id, 10_800)).toMatchObject({ status: 'within' });
    expect(await rowAfterForecast(project.id, item.id, 10_850)).toMatchObject({ status: 'early_warning' });
    expect(await rowAfterForecast(project.id, item.id, 11_100)).toMatchObject({ status: 'over', quantityBeyondBand: 100 });
    expect(await rowAfterForecast(project.id, item.id, 7_900)).toMatchObject({ status: 'under', quantityBeyondBand: 100 });
  });
});

describe('variance watch: quantities to date and forecasts', () => {
  it('sums approved (certified, paid) and pending (submitted, in review) quantities; forecast defaults to their sum', async () => {
    const { project, item } = await projectWith('far-15');
    const { db } = t.database;
    const by = w.people.subcontractor.id;
    await makePayApp(db, project.id, by, 'paid', [{ bidItemId: item.id, quantity: 3000 }]);
    await makePayApp(db, project.id, by, 'certified', [{ bidItemId: item.id, quantity: 2500.5 }]);
    await makePayApp(db, project.id, by, 'in_review', [{ bidItemId: item.id, quantity: 1000 }]);
    await makePayApp(db, project.id, by, 'draft', [{ bidItemId: item.id, quantity: 9999 }]);
    const res = await (await as('owner')).get(`/api/projects/${project.id}/variance`);
    expect(res.status).toBe(200);
    expect(res.body.rows[0]).toMatchObject({ approvedToDate: 5500.5, pending: 1000, forecast: null, forecastAtCompletion: 6500.5 });
    expect(res.body.periods.map((p: { status: string }) => p.status)).toEqual(['paid', 'certified', 'in_review']);
  });

  it('lets only the contractors set a forecast, validates it, and writes one audit event per change', async () => {
    const { project, item } = await projectWith('far-15');
    expect((await (await as('owner')).put(`/api/bid-items/${item.id}/forecast`).send({ forecastQuantity: 1 })).status).toBe(403);
    expect((await (await as('outsider')).put(`/api/bid-items/${item.id}/forecast`).send({ forecastQuantity: 1 })).status).toBe(404);
    const bad = await (await as('general_contractor')).put(`/api/bid-items/${item.id}/forecast`).send({ forecastQuantity: -5 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0].path).toBe('forecastQuantity');
    await rowAfterForecast(project.id, item.id, 10_100);
    await rowAfterForecast(project.id, item.id, 10_200);
    const events = await t.database.db.select().from(auditEvents).where(eq(auditEvents.objectId, item.id));
    expect(events.map((e) => [e.action, (e.after as { forecastQuantity: number }).forecastQuantity])).toEqual([
      ['forecast.updated', 10_100],
      ['forecast.updated', 10_200],
    ]);
  });

  it('drafts a proposed change order for the quantity beyond the band, once', async () => {
    const { project, item } = await projectWith('far-15');
    const row = await rowAfterForecast(project.id, item.id, 12_000);
    const sub = await as('subcontractor');
    const res = await sub.post(`/api/bid-items/${item.id}/variance-change-order`);
    expect(res.status).toBe(201);
    expect(res.body.changeOrder).toMatchObject({ status: 'proposed', items: [{ kind: 'change_quantity', bidItemId: item.id, quantityDelta: row.quantityBeyondBand }] });
    expect((await sub.post(`/api/bid-items/${item.id}/variance-change-order`)).status).toBe(409);
    const again = await sub.get(`/api/projects/${project.id}/variance`);
    expect(again.body.rows[0].openChangeOrder).toMatchObject({ number: res.body.changeOrder.number });
  });

  it('flags no under-run before a forecast: the quantity to date is not the quantity at completion', async () => {
    const { project, item } = await projectWith('far-15');
    await makePayApp(t.database.db, project.id, w.people.subcontractor.id, 'certified', [{ bidItemId: item.id, quantity: 2000 }]);
    const res = await (await as('owner')).get(`/api/projects/${project.id}/variance`);
    expect(res.body.rows[0]).toMatchObject({ forecastAtCompletion: 2000, status: 'within', quantityBeyondBand: 0, draftChangeOrderPath: null });
  });

  it('flags an over-run from the quantity to date when there is no forecast yet', async () => {
    const { project, item } = await projectWith('far-15');
    await makePayApp(t.database.db, project.id, w.people.subcontractor.id, 'certified', [{ bidItemId: item.id, quantity: 11_600 }]);
    const res = await (await as('owner')).get(`/api/projects/${project.id}/variance`);
    // FAR 52.211-18: 11,600 of 10,000 is 100 above 115 %
    expect(res.body.rows[0]).toMatchObject({ status: 'over', quantityBeyondBand: 100 });
  });

  it('answers 409 WITHIN_BAND for an item within its band, and 404 off the project', async () => {
    const { item } = await projectWith('far-15');
    const res = await (await as('general_contractor')).post(`/api/bid-items/${item.id}/variance-change-order`);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('WITHIN_BAND');
    expect((await (await as('outsider')).get(`/api/projects/${w.home.id}/variance`)).status).toBe(404);
  });
});
