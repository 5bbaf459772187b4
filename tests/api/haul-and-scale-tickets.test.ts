import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEvents, scaleTickets, truckTickets } from '../../server/db/schema';
import { makeBidItem, makeWorld } from '../setup/factories';
import { makeProfiledItem, makeSource } from '../setup/provisions-factories';
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

const ticket = (bidItemId: string, over: Record<string, unknown> = {}) => ({
  bidItemId,
  deliveredOn: '2026-05-04',
  truckLabel: 'T-12',
  material: 'Select borrow',
  source: 'Hollis pit',
  loadedAt: 'Hollis pit face 2',
  deliveredTo: 'Sta 14+00 fill',
  loadCheckerInitials: 'RB',
  deliveryCheckerInitials: 'MK',
  ...over,
});

async function auditCount(action: string) {
  const [row] = await t.database.db.select({ n: count() }).from(auditEvents).where(eq(auditEvents.action, action));
  return row!.n;
}

describe('truck register and truck tickets', () => {
  it('registers trucks for either contractor, refuses a second truck with the same number (409), and the owner only reads', async () => {
    const sub = await as('subcontractor');
    const body = {
      label: 'T-12',
      hauler: 'Orchard Haul',
      bedVolumeCy: 11.38,
      measuredBy: 'R. Baines',
      measuredOn: '2026-04-28',
    };
    const made = await sub.post(`/api/projects/${w.home.id}/trucks`).send(body);
    expect(made.status).toBe(201);
    expect(made.body.truck).toMatchObject({ label: 'T-12', bedVolumeCy: 11.38, measuredBy: 'R. Baines' });
    expect(await auditCount('truck.registered')).toBe(1);
    const gc = await as('general_contractor');
    expect((await gc.post(`/api/projects/${w.home.id}/trucks`).send({ ...body, label: 't-12' })).status).toBe(409);
    const gc2 = await gc.post(`/api/projects/${w.home.id}/trucks`).send({ ...body, label: 'T-14', bedVolumeCy: 15.56 });
    expect(gc2.status).toBe(201);
    const owner = await as('owner');
    expect((await owner.post(`/api/projects/${w.home.id}/trucks`).send({ ...body, label: 'T-20' })).status).toBe(403);
    const list = await owner.get(`/api/projects/${w.home.id}/trucks`);
    expect(list.body.trucks.map((x: { label: string }) => x.label)).toEqual(['T-12', 'T-14']);
    expect((await (await as('outsider')).get(`/api/projects/${w.home.id}/trucks`)).status).toBe(404);
  });

  it('registers one of two trucks with the same number sent at once, whatever their case (409 for the other)', async () => {
    // On PostgreSQL the two requests run in parallel transactions: a check before the insert would let both in.
    const sub = await as('subcontractor');
    const gc = await as('general_contractor');
    const body = { label: 'K-31', bedVolumeCy: 12.1, measuredBy: 'R. Baines', measuredOn: '2026-04-28' };
    const results = await Promise.all([
      sub.post(`/api/projects/${w.home.id}/trucks`).send(body),
      gc.post(`/api/projects/${w.home.id}/trucks`).send({ ...body, label: 'k-31' }),
    ]);
    expect(results.map((r) => r.status).sort()).toEqual([201, 409]);
    expect(results.find((r) => r.status === 409)!.body.error.code).toBe('TRUCK_ALREADY_REGISTERED');
    const list = await sub.get(`/api/projects/${w.home.id}/trucks`);
    expect(list.body.trucks.filter((x: { label: string }) => x.label.toUpperCase() === 'K-31')).toHaveLength(1);
  });

  it('refuses a bed volume with more than 2 decimals, naming the field', async () => {
    const res = await (
      await as('subcontractor')
    )
      .post(`/api/projects/${w.home.id}/trucks`)
      .send({ label: 'T-30', bedVolumeCy: 11.385, measuredBy: 'R. Baines', measuredOn: '2026-04-28' });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].path).toBe('bedVolumeCy');
  });

  it('records typed tickets, flags an unregistered truck and a load past capacity, and totals by day and item (0.01 computed, 0.1 paid)', async () => {
    const item = await makeProfiledItem(t.database.db, w.home.id, 'truck_measure', {
      itemNumber: 'TM-1',
      payUnit: 'CY',
    });
    const sub = await as('subcontractor');
    for (const over of [
      {},
      {},
      { truckLabel: 'T-14' },
      { truckLabel: 'T-99' },
      { loadVolumeCy: 12 },
      { deliveredOn: '2026-05-05', loadVolumeCy: 10.5 },
    ]) {
      const res = await sub.post(`/api/projects/${w.home.id}/truck-tickets`).send(ticket(item.id, over));
      expect(res.status).toBe(201);
    }
    const list = await sub.get(`/api/projects/${w.home.id}/truck-tickets?bidItemId=${item.id}`);
    expect(list.status).toBe(200);
    expect(list.body.nextCursor).toBeNull();
    // Newest first, as every paged list.
    const flags = list.body.items.map((x: { flags: string[] }) => x.flags.join(','));
    expect(flags).toEqual(['', 'over_capacity', 'unregistered_truck', '', '', '']);
    const totals = await sub.get(`/api/projects/${w.home.id}/truck-tickets/totals?bidItemId=${item.id}`);
    expect(totals.status).toBe(200);
    // 11.38 + 11.38 + 15.56 = 38.32 CY on the 4th (two flagged loads left out); 10.50 on the 5th.
    expect(totals.body.totals.byDay).toEqual([
      { key: '2026-05-04', loads: 3, computedCy: 38.32, payCy: 38.3, flagged: 2 },
      { key: '2026-05-05', loads: 1, computedCy: 10.5, payCy: 10.5, flagged: 0 },
    ]);
    expect(totals.body.totals.byItem).toEqual([{ key: item.id, loads: 4, computedCy: 48.82, payCy: 48.8, flagged: 2 }]);
  });

  it("refuses tickets on an item that is not paid by truck measure (400 PROFILE_MISMATCH) and on another project's item", async () => {
    const sub = await as('subcontractor');
    const plain = await makeBidItem(t.database.db, w.home.id, { itemNumber: 'WS-1' });
    const res = await sub.post(`/api/projects/${w.home.id}/truck-tickets`).send(ticket(plain.id));
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('PROFILE_MISMATCH');
    const foreign = await makeProfiledItem(t.database.db, w.foreign.id, 'truck_measure', { itemNumber: 'F-1' });
    const cross = await sub.post(`/api/projects/${w.home.id}/truck-tickets`).send(ticket(foreign.id));
    expect(cross.status).toBe(400);
    expect(cross.body.error.details[0]).toMatchObject({ path: 'bidItemId' });
  });

  it('imports a CSV whole, or refuses it naming each bad line and column with nothing saved', async () => {
    const item = await makeProfiledItem(t.database.db, w.home.id, 'truck_measure', { itemNumber: 'TM-2' });
    const gc = await as('general_contractor');
    const header =
      'delivered_on,truck,material,source,loaded_at,delivered_to,load_checker,delivery_checker,load_volume_cy';
    const good = `${header}\n2026-05-06,T-12,Select borrow,Hollis pit,Face 2,Sta 15+00,RB,MK,\n2026-05-06,T-14,Select borrow,Hollis pit,Face 2,Sta 15+50,RB,MK,15.2\n`;
    const ok = await gc.post(`/api/projects/${w.home.id}/truck-tickets/import`).send({ bidItemId: item.id, csv: good });
    expect(ok.status).toBe(201);
    expect(ok.body).toMatchObject({ imported: 2, flagged: 0 });
    expect(await auditCount('truck_tickets.imported')).toBe(1);
    const bad = `${header}\n2026-05-07,T-12,Select borrow,Hollis pit,Face 2,Sta 16+00,RB,MK,\n2026-13-01,T-12,Select borrow,Hollis pit,Face 2,Sta 16+00,R8,MK,abc\n`;
    const [before] = await t.database.db.select({ n: count() }).from(truckTickets);
    const refused = await gc
      .post(`/api/projects/${w.home.id}/truck-tickets/import`)
      .send({ bidItemId: item.id, csv: bad });
    expect(refused.status).toBe(400);
    expect(
      refused.body.error.details.map((d: { line: number; column: string }) => `${d.line}:${d.column}`).sort(),
    ).toEqual(['3:delivered_on', '3:load_checker', '3:load_volume_cy']);
    const missing = await gc
      .post(`/api/projects/${w.home.id}/truck-tickets/import`)
      .send({ bidItemId: item.id, csv: 'truck\nT-1\n' });
    expect(missing.body.error.details.map((d: { column: string }) => d.column)).toContain('delivered_on');
    // A load dated a year ahead (the year mistyped) is refused on its line, and the whole file with it.
    const nextYear = new Date().getUTCFullYear() + 1;
    const ahead = await gc.post(`/api/projects/${w.home.id}/truck-tickets/import`).send({
      bidItemId: item.id,
      csv: `${header}\n${nextYear}-01-06,T-12,Select borrow,Hollis pit,Face 2,Sta 16+00,RB,MK,\n`,
    });
    expect(ahead.status).toBe(400);
    expect(ahead.body.error.details).toEqual([
      expect.objectContaining({ line: 2, column: 'delivered_on', message: 'Cannot be a day still to come' }),
    ]);
    const [after] = await t.database.db.select({ n: count() }).from(truckTickets);
    expect(after!.n).toBe(before!.n);
  });

  it('refuses an import from the owner (403) before reading the file', async () => {
    const item = await makeProfiledItem(t.database.db, w.home.id, 'truck_measure', { itemNumber: 'TM-3' });
    const res = await (
      await as('owner')
    )
      .post(`/api/projects/${w.home.id}/truck-tickets/import`)
      .send({ bidItemId: item.id, csv: 'x' });
    expect(res.status).toBe(403);
  });
});

describe('material sources and scale tickets', () => {
  it("computes a source's factor from three weighed loads (1.4730 computed, 1.473 used) and refuses two loads", async () => {
    const sub = await as('subcontractor');
    const loads = [
      { netTons: 18.42, volumeCy: 12.5 },
      { netTons: 19.1, volumeCy: 13 },
      { netTons: 18.75, volumeCy: 12.7 },
    ];
    const res = await sub
      .post(`/api/projects/${w.home.id}/material-sources`)
      .send({ name: 'Hollis pit', weighedLoads: loads, statedMoisturePercent: 5 });
    expect(res.status).toBe(201);
    expect(res.body.source).toMatchObject({ factorComputed: 1.473, factorUsed: 1.473 });
    const two = await sub
      .post(`/api/projects/${w.home.id}/material-sources`)
      .send({ name: 'Other', weighedLoads: loads.slice(0, 2) });
    expect(two.status).toBe(400);
    expect(two.body.error.details[0].path).toBe('weighedLoads');
  });

  it('records a scale ticket with net, moisture correction and banded CY, and refuses a duplicate number (409) with nothing saved', async () => {
    const db = t.database.db;
    const item = await makeProfiledItem(db, w.home.id, 'weight', { itemNumber: 'WT-1', payUnit: 'TON' });
    const source = await makeSource(db, w.home.id);
    const gc = await as('general_contractor');
    const body = {
      bidItemId: item.id,
      sourceId: source.id,
      ticketNumber: '40117',
      weighedOn: '2026-05-04',
      grossTons: 33.85,
      tareTons: 13.85,
      material: 'Crushed aggregate base',
      moisturePercent: 8,
      scaleCheckerInitials: 'JT',
      deliveryCheckerInitials: 'MK',
    };
    const res = await gc.post(`/api/projects/${w.home.id}/scale-tickets`).send(body);
    expect(res.status).toBe(201);
    // 20.00 t net at 8 % over a stated 5 %: 20 x 100 / 108 = 18.52 t; / 1.473 = 12.57 CY; banded 12.5 CY.
    expect(res.body.ticket).toMatchObject({ netTons: 20, payTons: 18.52, computedCy: 12.57, bandedCy: 12.5 });
    const again = await gc.post(`/api/projects/${w.home.id}/scale-tickets`).send({ ...body, grossTons: 30 });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('DUPLICATE_TICKET_NUMBER');
    const rows = await db.select().from(scaleTickets).where(eq(scaleTickets.ticketNumber, '40117'));
    expect(rows).toHaveLength(1);
    const owner = await as('owner');
    expect(
      (await owner.post(`/api/projects/${w.home.id}/scale-tickets`).send({ ...body, ticketNumber: '40118' })).status,
    ).toBe(403);
    expect((await owner.get(`/api/projects/${w.home.id}/scale-tickets`)).body.items).toHaveLength(1);
  });

  it('refuses a tare at or above gross naming the tare, and a source of another project', async () => {
    const db = t.database.db;
    const item = await makeProfiledItem(db, w.home.id, 'weight', { itemNumber: 'WT-2', payUnit: 'TON' });
    const foreignSource = await makeSource(db, w.foreign.id);
    const sub = await as('subcontractor');
    const base = {
      bidItemId: item.id,
      sourceId: foreignSource.id,
      ticketNumber: '50001',
      weighedOn: '2026-05-04',
      grossTons: 20,
      tareTons: 21,
      material: 'Base',
      scaleCheckerInitials: 'JT',
      deliveryCheckerInitials: 'MK',
    };
    const tare = await sub.post(`/api/projects/${w.home.id}/scale-tickets`).send(base);
    expect(tare.status).toBe(400);
    expect(tare.body.error.details[0].path).toBe('tareTons');
    const cross = await sub.post(`/api/projects/${w.home.id}/scale-tickets`).send({ ...base, tareTons: 10 });
    expect(cross.status).toBe(400);
    expect(cross.body.error.details[0].path).toBe('sourceId');
  });
});

describe('the ticket lists are paged (a job keeps thousands of loads)', () => {
  it('walks every truck ticket once, newest first, a page at a time, while the totals count them all', async () => {
    const item = await makeProfiledItem(t.database.db, w.home.id, 'truck_measure', { itemNumber: 'TM-P' });
    const gc = await as('general_contractor');
    const header =
      'delivered_on,truck,material,source,loaded_at,delivered_to,load_checker,delivery_checker,load_volume_cy';
    // One import is one statement: the rows share created_at, and the id must break the ties.
    const rows = Array.from(
      { length: 7 },
      (_, i) => `2026-06-0${1 + (i % 3)},T-12,Select borrow,Hollis pit,F,S,RB,MK,10`,
    );
    const imported = await gc
      .post(`/api/projects/${w.home.id}/truck-tickets/import`)
      .send({ bidItemId: item.id, csv: `${header}\n${rows.join('\n')}\n` });
    expect(imported.status).toBe(201);
    const seen: string[] = [];
    let cursor: string | null = null;
    let pages = 0;
    do {
      const url = `/api/projects/${w.home.id}/truck-tickets?bidItemId=${item.id}&limit=3${cursor ? `&cursor=${cursor}` : ''}`;
      const page = await gc.get(url);
      expect(page.status).toBe(200);
      expect(page.body.items.length).toBeLessThanOrEqual(3);
      seen.push(...page.body.items.map((x: { id: string }) => x.id));
      cursor = page.body.nextCursor;
      pages++;
    } while (cursor);
    expect(pages).toBe(3);
    expect(new Set(seen).size).toBe(7);
    const totals = await gc.get(`/api/projects/${w.home.id}/truck-tickets/totals?bidItemId=${item.id}`);
    expect(totals.body.totals.byItem).toEqual([{ key: item.id, loads: 7, computedCy: 70, payCy: 70, flagged: 0 }]);
  });

  it('refuses a bad limit or cursor on either list with 400 naming the field', async () => {
    const owner = await as('owner');
    for (const list of ['truck-tickets', 'scale-tickets']) {
      const big = await owner.get(`/api/projects/${w.home.id}/${list}?limit=100000`);
      expect(big.status).toBe(400);
      expect(big.body.error.details[0].path).toBe('limit');
      const forged = await owner.get(`/api/projects/${w.home.id}/${list}?cursor=bm90LW91cnM`);
      expect(forged.status).toBe(400);
      expect(forged.body.error.details[0].path).toBe('cursor');
    }
  });
});
