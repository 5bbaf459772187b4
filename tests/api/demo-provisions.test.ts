import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '../../server/db/seed-demo';
import { projects } from '../../server/db/schema';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

let t: TestApp;
let projectId: string;
beforeAll(async () => {
  t = await createTestApp();
  expect(await seedDemo(t.database.db, t.auth, t.storage)).toBe(true);
  projectId = (await t.database.db.select().from(projects))[0]!.id;
}, 120_000);
afterAll(() => t.close());

describe('demo project: one item of each way of paying (invented data)', () => {
  it('has an item of each profile', async () => {
    const agent = await signedInAgent(t.app, 'owner@tallyard.test', 'tallyard-demo');
    const res = await agent.get(`/api/projects/${projectId}/measurement-profiles`);
    const byItem = Object.fromEntries(
      res.body.profiles.map((p: { itemNumber: string; profile: string }) => [p.itemNumber, p.profile]),
    );
    expect(byItem).toMatchObject({
      '101': 'lump_sum',
      '201': 'lump_sum',
      '402': 'plan_quantity',
      '203': 'worksheet',
      '303': 'truck_measure',
      '401': 'weight',
      'FA-1': 'force_account',
    });
    // 201: stages of 45 % and 35 % done of $38,500.00 = $30,800.00.
    expect(res.body.profiles.find((p: { itemNumber: string }) => p.itemNumber === '201').earnedCents).toBe(3_080_000);
  });

  it('has loads with one flagged truck, scale tickets, signed daily sheets, stored riprap and adjustments', async () => {
    const agent = await signedInAgent(t.app, 'gc@tallyard.test', 'tallyard-demo');
    const loads = (await agent.get(`/api/projects/${projectId}/truck-tickets`)).body;
    expect(loads.items).toHaveLength(17);
    expect(loads.items.filter((x: { flags: string[] }) => x.flags.includes('unregistered_truck'))).toHaveLength(1);
    const { totals } = (await agent.get(`/api/projects/${projectId}/truck-tickets/totals`)).body;
    expect(totals.byDay.map((d: { key: string }) => d.key)).toEqual(['2026-09-14', '2026-09-15', '2026-09-16']);
    expect((await agent.get(`/api/projects/${projectId}/scale-tickets`)).body.items).toHaveLength(5);
    const sheets = (await agent.get(`/api/projects/${projectId}/daily-sheets`)).body.sheets;
    expect(sheets.map((s: { complete: boolean }) => s.complete)).toEqual([true, false]);
    const stored = (await agent.get(`/api/projects/${projectId}/stored-materials`)).body.materials;
    // 180 + 160 - 95 = 245 t on hand; 420 - 95 = 325 t still needed; 245 t x $41.50 = $10,167.50.
    expect(stored[0].account).toMatchObject({ remainingQuantity: 245, payableCents: 1_016_750 });
    const adjustments = (await agent.get(`/api/projects/${projectId}/pay-adjustments`)).body.adjustments;
    // 6,240 CY x 0.20 gal/CY = 1,248 gal x ($3.688 - $3.412) = $344.45 (Iowa DOT 2120 factor).
    expect(adjustments.map((a: { amountCents: number }) => a.amountCents)).toEqual([34_445, -84_600]);
  });

  it('seeds the records once', async () => {
    expect(await seedDemo(t.database.db, t.auth, t.storage)).toBe(false);
  });
});
