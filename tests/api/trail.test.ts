import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AuditEventView, AuditPage } from '../../src/shared/schemas/audit';
import { user } from '../../server/db/schema';
import { recordAudit } from '../../server/modules/audit/audit.repository';
import { quantityChange } from '../setup/change-order-factories';
import { makeWorld, sampleBidItem } from '../setup/factories';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

// The readable trail (issue 14): objects by their human name and number with a link, never an id; filters by
// object, person and date; the CSV export of the filtered trail with formula cells neutralised (OWASP, CSV
// injection), as the pay application CSV does.
let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
let gc: Awaited<ReturnType<typeof signedInAgent>>;
let sub: Awaited<ReturnType<typeof signedInAgent>>;
let itemId: string;
let coId: string;

const UUID = /[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/i;
const readable = (e: AuditEventView) =>
  [e.sentence, e.object.label, ...e.changes.flatMap((c) => [c.field, c.before, c.after])].join(' | ');

beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
  gc = await signedInAgent(t.app, w.people.general_contractor.email);
  sub = await signedInAgent(t.app, w.people.subcontractor.email);
  await t.database.db.update(user).set({ name: 'Grace Contreras' }).where(eq(user.id, w.people.general_contractor.id));
  const item = await gc
    .post(`/api/projects/${w.home.id}/bid-items`)
    .send(
      sampleBidItem({
        itemNumber: '203',
        description: 'Unclassified excavation',
        unitPriceCents: 725,
        contractQuantity: 21000,
      }),
    );
  itemId = item.body.bidItem.id;
  await gc.patch(`/api/bid-items/${itemId}`).send({ unitPriceCents: 810 });
  const co = await sub
    .post(`/api/projects/${w.home.id}/change-orders`)
    .send({ ...quantityChange(itemId, 120), title: '=HYPERLINK("http://x")' });
  coId = co.body.changeOrder.id;
  await gc.post(`/api/change-orders/${coId}/approve`).send({});
  // An event on another project's object id must not be named from that project.
  await recordAudit(t.database.db, {
    projectId: w.home.id,
    actorUserId: null,
    objectType: 'bid_item',
    // Another id than the item's, whatever its last digit (a fixed '0' was the item's own id 1 time in 16).
    objectId: itemId.replace(/.$/, (c) => (c === '0' ? '1' : '0')),
    action: 'bid_item.updated',
  });
});
afterAll(() => t?.close());

const trail = async (query = ''): Promise<AuditPage> => {
  const res = await gc.get(`/api/projects/${w.home.id}/audit${query}`);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body as AuditPage;
};

describe('the readable trail', () => {
  it('names each object by its number and name with a link, formats money, and shows before and after', async () => {
    const { events } = await trail();
    const updated = events.find((e) => e.action === 'bid_item.updated' && e.actor)!;
    expect(updated.sentence).toBe('Grace Contreras changed {object}');
    expect(updated.object).toEqual({
      label: 'bid item 203 Unclassified excavation',
      href: `/projects/${w.home.id}/bid-items`,
      unit: 'CY',
    });
    expect(updated.changes).toContainEqual({ field: 'Unit price', before: '$7.25', after: '$8.10' });
    const created = events.find((e) => e.action === 'bid_item.created')!;
    expect(created.sentence).toBe('Grace Contreras added {object} at $7.25 per CY, 21,000.00 CY in the contract');
    const approved = events.find((e) => e.action === 'change_order.approved')!;
    expect(approved.object).toEqual({
      label: 'change order 1 (=HYPERLINK("http://x"))',
      href: `/projects/${w.home.id}/change-orders/${coId}`,
      unit: null,
    });
    for (const e of events) expect(readable(e), e.action).not.toMatch(UUID);
  });

  it('an id that is not this project’s object is not named or linked', async () => {
    const { events } = await trail();
    const orphan = events.find((e) => e.action === 'bid_item.updated' && !e.actor)!;
    expect(orphan.object).toMatchObject({ label: 'a bid item', href: null });
    expect(orphan.sentence).toBe('Tallyard changed {object}');
  });

  it('filters by object type, person and date, and lists the people for the filter', async () => {
    const all = await trail();
    expect(all.people).toEqual(
      expect.arrayContaining([{ userId: w.people.general_contractor.id, name: 'Grace Contreras' }]),
    );
    const bySub = await trail(`?person=${w.people.subcontractor.id}`);
    expect(bySub.events.map((e) => e.action)).toEqual(['change_order.proposed']);
    const items = await trail('?objectType=change_order');
    expect(new Set(items.events.map((e) => e.objectType))).toEqual(new Set(['change_order']));
    const future = new Date(Date.now() + 86_400_000).toISOString();
    expect((await trail(`?from=${encodeURIComponent(future)}`)).total).toBe(0);
    expect((await trail(`?to=${encodeURIComponent(new Date(Date.now() + 60_000).toISOString())}`)).total).toBe(
      all.total,
    );
    const bad = await gc.get(
      `/api/projects/${w.home.id}/audit?from=${encodeURIComponent(future)}&to=2020-01-01T00:00:00Z`,
    );
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0].path).toBe('from');
  });

  it('exports the filtered trail as CSV, sentences in words, formula cells neutralised', async () => {
    await t.database.db.update(user).set({ name: '=cmd|calc' }).where(eq(user.id, w.people.subcontractor.id));
    try {
      const res = await gc.get(`/api/projects/${w.home.id}/audit.csv?objectType=change_order`);
      expect(res.status).toBe(200);
      expect(res.headers['content-type']).toMatch(/^text\/csv/);
      expect(res.headers['content-disposition']).toBe('attachment; filename="Home-trail.csv"');
      const lines = res.text.trim().split('\r\n');
      expect(lines[0]).toBe('when_utc,who,what_happened,object,changes');
      expect(lines).toHaveLength(3);
      expect(lines[2]).toContain(`'=cmd|calc`);
      expect(lines[2]).toContain('=cmd|calc proposed change order 1 (=HYPERLINK(""http://x""))');
      expect(lines[1]).toMatch(/^\d{4}-\d\d-\d\dT[\d:.]+Z,Grace Contreras,/);
      expect(res.text).not.toMatch(UUID);
    } finally {
      await t.database.db.update(user).set({ name: 'sub' }).where(eq(user.id, w.people.subcontractor.id));
    }
  });

  it('the CSV is read by members only', async () => {
    const outsider = await signedInAgent(t.app, w.outsider.email);
    expect((await outsider.get(`/api/projects/${w.home.id}/audit.csv`)).status).toBe(404);
  });
});
