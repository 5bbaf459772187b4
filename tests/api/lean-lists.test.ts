import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { tallies } from '../../server/db/schema';
import { makeBidItem, makeWorld } from '../setup/factories';
import { makeTally } from '../setup/pay-cycle-factories';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
const made: string[] = [];
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
  const db = t.database.db;
  const item = await makeBidItem(db, w.home.id, {
    itemNumber: 'L-1',
    payUnit: 'CY',
    basis: 'bank',
    contractQuantity: 1_000_000,
  });
  for (let i = 0; i < 23; i++) {
    const row = await makeTally(db, {
      projectId: w.home.id,
      bidItemId: item.id,
      authorUserId: w.people.subcontractor.id,
      measuredOn: '2026-10-05',
      quantity: i + 1,
    });
    made.push(row.id);
  }
  // Ties on created_at (rows written in one statement share it): the id breaks them, so none is skipped or repeated.
  const same = new Date('2026-10-05T12:00:00.123456Z');
  await db.update(tallies).set({ createdAt: same }).where(eq(tallies.id, made[3]!));
  await db.update(tallies).set({ createdAt: same }).where(eq(tallies.id, made[4]!));
  await db.update(tallies).set({ createdAt: same }).where(eq(tallies.id, made[5]!));
  // A big worksheet that must not reach any list.
  await db
    .update(tallies)
    .set({ inputs: { note: 'x'.repeat(50_000) } })
    .where(eq(tallies.id, made[0]!));
});
afterAll(() => t.close());

const as = (who: keyof typeof w.people) => signedInAgent(t.app, w.people[who].email);
const url = () => `/api/projects/${w.home.id}/tallies`;

describe('the tally list is lean and paged', () => {
  it('answers summaries with no inputs or engine result; the one tally keeps them', async () => {
    const agent = await as('general_contractor');
    const res = await agent.get(url());
    expect(res.status).toBe(200);
    expect(Object.keys(res.body).sort()).toEqual(['items', 'nextCursor']);
    expect(res.body.items).toHaveLength(23);
    expect(res.body.nextCursor).toBeNull();
    for (const item of res.body.items as Record<string, unknown>[]) {
      expect(item).not.toHaveProperty('inputs');
      expect(item).not.toHaveProperty('result');
      expect(Object.keys(item)).toEqual(
        expect.arrayContaining([
          'id',
          'bidItem',
          'method',
          'quantity',
          'status',
          'author',
          'evidenceCount',
          'createdAt',
        ]),
      );
    }
    expect(res.text.length).toBeLessThan(20_000);
    const one = await agent.get(`/api/tallies/${made[0]}`);
    expect(one.body.tally.inputs.note).toHaveLength(50_000);
    expect(one.body.tally.result.trail).toEqual(['factory']);
  });

  it('walks every tally exactly once, newest first, page by page', async () => {
    const agent = await as('subcontractor');
    const seen: string[] = [];
    let cursor: string | null = null;
    let pages = 0;
    do {
      const res = await agent.get(url()).query({ limit: 4, ...(cursor ? { cursor } : {}) });
      expect(res.status).toBe(200);
      expect(res.body.items.length).toBeLessThanOrEqual(4);
      seen.push(...res.body.items.map((x: { id: string }) => x.id));
      cursor = res.body.nextCursor as string | null;
      pages += 1;
    } while (cursor && pages < 20);
    expect(pages).toBe(6);
    expect(seen).toHaveLength(23);
    expect(new Set(seen)).toEqual(new Set(made));
    const created = await Promise.all(
      seen.map(async (id) =>
        (await t.database.db.select().from(tallies).where(eq(tallies.id, id)))[0]!.createdAt.getTime(),
      ),
    );
    expect(created).toEqual([...created].sort((a, b) => b - a));
  });

  it('refuses a bad limit or cursor with 400 naming the field', async () => {
    const agent = await as('subcontractor');
    for (const limit of ['0', '501', 'ten', '2.5']) {
      const res = await agent.get(url()).query({ limit });
      expect(res.status, limit).toBe(400);
      expect(res.body.error.details.map((d: { path: string }) => d.path)).toContain('limit');
    }
    const forged = Buffer.from(JSON.stringify(['not a time', 'x'])).toString('base64url');
    const feb31 = Buffer.from(JSON.stringify(['2026-02-31 10:00:00+00', made[0]])).toString('base64url');
    for (const cursor of ['!!', 'abc', forged, feb31, Buffer.from('[1,2,3]').toString('base64url')]) {
      const res = await agent.get(url()).query({ cursor });
      expect(res.status, cursor).toBe(400);
      expect(res.body.error.details.map((d: { path: string }) => d.path)).toContain('cursor');
    }
  });

  it('pages only the project asked for: another project gives 404', async () => {
    const agent = await as('subcontractor');
    expect((await agent.get(`/api/projects/${w.foreign.id}/tallies`).query({ limit: 1 })).status).toBe(404);
  });
});
