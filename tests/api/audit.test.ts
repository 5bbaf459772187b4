import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEvents } from '../../server/db/schema';
import { makePayApp, quantityChange } from '../setup/change-order-factories';
import { makeBidItem, makeWorld, sampleBidItem } from '../setup/factories';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';
import { recordAudit } from '../../server/modules/audit/audit.repository';

let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
});
afterAll(() => t.close());

const as = (who: keyof typeof w.people | 'outsider') =>
  signedInAgent(t.app, who === 'outsider' ? w.outsider.email : w.people[who].email);
type Event = { action: string; objectType: string; actor: { name: string } | null; before: unknown; after: unknown; at: string };

describe('audit trail', () => {
  it('writes one row with each change, with actor, before and after, newest first', async () => {
    const gc = await as('general_contractor');
    const item = (await gc.post(`/api/projects/${w.home.id}/bid-items`).send(sampleBidItem({ itemNumber: 'AU-1' }))).body.bidItem;
    await gc.patch(`/api/bid-items/${item.id}`).send({ unitPriceCents: 810 });
    const co = (await gc.post(`/api/projects/${w.home.id}/change-orders`).send(quantityChange(item.id, 12))).body.changeOrder;
    await gc.post(`/api/change-orders/${co.id}/approve`).send({});
    const res = await (await as('owner')).get(`/api/projects/${w.home.id}/audit`);
    expect(res.status).toBe(200);
    const actions = res.body.events.map((e: Event) => e.action);
    expect(actions.slice(0, 4)).toEqual(['change_order.approved', 'change_order.proposed', 'bid_item.updated', 'bid_item.created']);
    const updated = res.body.events.find((e: Event) => e.action === 'bid_item.updated');
    expect(updated).toMatchObject({ objectType: 'bid_item', actor: { name: expect.any(String) }, before: { unitPriceCents: 725 }, after: { unitPriceCents: 810 } });
    expect(res.body.objectTypes).toEqual(expect.arrayContaining(['bid_item', 'change_order']));
  });

  it('pages and filters by object type', async () => {
    const gc = await as('general_contractor');
    const page = await gc.get(`/api/projects/${w.home.id}/audit?pageSize=1&page=2&objectType=bid_item`);
    expect(page.status).toBe(200);
    expect(page.body).toMatchObject({ page: 2, pageSize: 1, total: 2 });
    expect(page.body.events.map((e: Event) => e.action)).toEqual(['bid_item.created']);
    const bad = await gc.get(`/api/projects/${w.home.id}/audit?objectType=DROP%20TABLE`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0].path).toBe('objectType');
  });

  it('is read by members only: 404 off the project for the project and pay application trails', async () => {
    const app = await makePayApp(t.database.db, w.home.id, w.people.subcontractor.id, 'submitted', []);
    const outsider = await as('outsider');
    expect((await outsider.get(`/api/projects/${w.home.id}/audit`)).status).toBe(404);
    expect((await outsider.get(`/api/pay-apps/${app.id}/audit`)).status).toBe(404);
    expect((await (await as('admin')).get(`/api/projects/${w.home.id}/audit`)).status).toBe(200);
  });

  it('gives a pay application its own events and those of its lines', async () => {
    const { db } = t.database;
    const item = await makeBidItem(db, w.home.id);
    const app = await makePayApp(db, w.home.id, w.people.subcontractor.id, 'in_review', [{ bidItemId: item.id, quantity: 5 }]);
    const base = { projectId: w.home.id, actorUserId: w.people.general_contractor.id };
    await recordAudit(db, { ...base, objectType: 'pay_app', objectId: app.id, action: 'pay_app.submitted' });
    await recordAudit(db, { ...base, objectType: 'pay_app_line', objectId: 'line-1', action: 'line.disputed', after: { payAppId: app.id } });
    await recordAudit(db, { ...base, objectType: 'pay_app', objectId: w.home.id, action: 'unrelated' });
    const res = await (await as('subcontractor')).get(`/api/pay-apps/${app.id}/audit`);
    expect(res.status).toBe(200);
    expect(res.body.events.map((e: Event) => e.action)).toEqual(['line.disputed', 'pay_app.submitted']);
  });

  it('has no route that updates or deletes a row, and the database refuses it too', async () => {
    const gc = await as('general_contractor');
    for (const method of ['put', 'patch', 'delete'] as const) {
      expect((await gc[method](`/api/projects/${w.home.id}/audit`)).status).toBe(404);
    }
    const [row] = await t.database.db.select().from(auditEvents).limit(1);
    await expect(t.database.db.execute(sql`update audit_events set action = 'x' where id = ${row!.id}`)).rejects.toThrow();
    await expect(t.database.db.delete(auditEvents).where(eq(auditEvents.id, row!.id))).rejects.toThrow();
  });
});
