import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '../../server/db/seed-demo';
import { changeOrders, payApps, payments, projects, tallyEvidence } from '../../server/db/schema';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
  expect(await seedDemo(t.database.db, t.auth, t.storage)).toBe(true);
}, 60_000);
afterAll(() => t.close());

describe('demo pay cycle (invented data)', () => {
  it('seeds three periods: paid, certified awaiting payment, and one reviewed with a disputed line', async () => {
    const { db } = t.database;
    const apps = await db.select().from(payApps).orderBy(payApps.number);
    expect(apps.map((a) => a.status)).toEqual(['paid', 'certified', 'returned']);
    const [paid] = await db.select().from(payments).where(eq(payments.payAppId, apps[0]!.id));
    expect(paid).toMatchObject({ status: 'succeeded', amountCents: apps[0]!.currentDueCents });
    expect(apps[0]!.paidCents).toBe(apps[0]!.currentDueCents);
    expect((await db.select().from(tallyEvidence)).length).toBeGreaterThan(3);
  });

  it('has one bid item beyond its band with a drafted change order, seen on the quantity watch', async () => {
    const [project] = await t.database.db.select().from(projects);
    const agent = await signedInAgent(t.app, 'gc@tallyard.test', 'tallyard-demo');
    const watch = await agent.get(`/api/projects/${project!.id}/variance`);
    const over = watch.body.rows.filter((r: { status: string }) => r.status === 'over');
    expect(over.map((r: { itemNumber: string }) => r.itemNumber)).toEqual(['203']);
    expect(over[0].openChangeOrder).not.toBeNull();
    expect(watch.body.periods).toHaveLength(3);
    const cos = await t.database.db.select().from(changeOrders).orderBy(changeOrders.number);
    // The drafted variance change order; the approved one authorises the demo's time-and-materials work (issue 15).
    expect(cos.map((c) => c.status)).toEqual(['proposed', 'approved']);
  });

  it('is idempotent: a second run adds nothing', async () => {
    expect(await seedDemo(t.database.db, t.auth, t.storage)).toBe(false);
    expect((await t.database.db.select().from(payApps)).length).toBe(3);
  });
});
