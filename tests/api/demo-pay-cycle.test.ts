import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '../../server/db/seed-demo';
import {
  auditEvents,
  changeOrders,
  payAppStatusHistory,
  payApps,
  payments,
  projects,
  tallyEvidence,
} from '../../server/db/schema';
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
    // Ours (205 and 208), the one authorising the time-and-materials work, and the drafted variance one.
    expect(cos.map((c) => c.status).sort()).toEqual(['approved', 'approved', 'proposed']);
  });

  it('reflects its approved change order everywhere: bid schedule, project, watch and the period compiled after it', async () => {
    const [project] = await t.database.db.select().from(projects);
    const agent = await signedInAgent(t.app, 'gc@tallyard.test', 'tallyard-demo');
    const items = (await agent.get(`/api/projects/${project!.id}/bid-items`)).body;
    // Invented demo figures: 3,200 + 1,600 CY on item 205; 9 DAY at $1,850.00 added as item 208.
    expect(items.bidItems.find((b: { itemNumber: string }) => b.itemNumber === '205')).toMatchObject({
      originalQuantity: 3200,
      contractQuantity: 4800,
    });
    expect(items.bidItems.find((b: { itemNumber: string }) => b.itemNumber === '208')).toMatchObject({
      payUnit: 'DAY',
      originalQuantity: 0,
      contractQuantity: 9,
      contractAmountCents: 1_665_000,
    });
    // 1,600 CY x $9.75 = $15,600.00 and 9 x $1,850.00 = $16,650.00 are among the approved changes
    const a205 = items.bidItems.find((b: { itemNumber: string }) => b.itemNumber === '205');
    expect(a205.contractAmountCents - a205.originalAmountCents).toBe(1_560_000);
    const view = (await agent.get(`/api/projects/${project!.id}`)).body.project;
    expect(view).toMatchObject({
      approvedChangesCents: items.totals.approvedChangesCents,
      contractSumCents: items.totals.contractSumCents,
    });
    const watch = (await agent.get(`/api/projects/${project!.id}/variance`)).body;
    expect(watch.rows.find((r: { itemNumber: string }) => r.itemNumber === '205')).toMatchObject({
      currentContractQuantity: 4800,
    });
    const third = (await agent.get(`/api/projects/${project!.id}/pay-apps`)).body.payApps.find(
      (a: { number: number }) => a.number === 3,
    );
    const detail = (await agent.get(`/api/pay-apps/${third.id}`)).body.payApp;
    expect(detail.status).toBe('returned');
    expect(detail.disputes).toHaveLength(1);
    // Compiled after our change order (and before the later time-and-materials one): it carries 205 at 4,800 CY.
    expect(detail.lines.find((l: { itemNumber: string }) => l.itemNumber === '205')).toMatchObject({
      contractQuantity: 4800,
    });
  });

  it('is idempotent: a second run adds nothing', async () => {
    expect(await seedDemo(t.database.db, t.auth, t.storage)).toBe(false);
    expect((await t.database.db.select().from(payApps)).length).toBe(3);
  });
});

describe('demo dates (invented scenario)', () => {
  it('dates each step after its period, in order, and nothing of the scenario on the day it was seeded', async () => {
    const { db } = t.database;
    const apps = await db.select().from(payApps).orderBy(payApps.number);
    for (const a of apps) {
      const periodEnd = Date.parse(`${a.periodEnd}T23:59:59Z`);
      expect(a.createdAt.getTime()).toBeGreaterThan(periodEnd);
      expect(a.submittedAt!.getTime()).toBeGreaterThan(a.createdAt.getTime());
      if (a.certifiedAt) expect(a.certifiedAt.getTime()).toBeGreaterThan(a.submittedAt!.getTime());
      const history = await db.select().from(payAppStatusHistory).where(eq(payAppStatusHistory.payAppId, a.id));
      const times = history.map((h) => h.createdAt.getTime());
      expect(Math.min(...times)).toBeGreaterThan(periodEnd);
      expect(Math.max(...times)).toBeLessThan(Date.parse(`${a.periodEnd}T00:00:00Z`) + 40 * 86_400_000);
    }
    const seededToday = Date.now() - 86_400_000;
    const events = await db.select({ at: auditEvents.createdAt, action: auditEvents.action }).from(auditEvents);
    expect(events.length).toBeGreaterThan(20);
    expect(events.filter((e) => e.at.getTime() > seededToday)).toEqual([]);
  });
});
