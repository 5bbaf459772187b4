import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { tallies } from '../../server/db/schema';
import { makeWorld } from '../setup/factories';
import { makeTally } from '../setup/pay-cycle-factories';
import { makeProfiledItem } from '../setup/provisions-factories';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

// Invented figures (test data), worked by hand; retainage 10 % (the project's rate).
let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
let clearing: { id: string };
let topsoil: { id: string };
let stray: { id: string };
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
  const db = t.database.db;
  // Lump sum by a stage schedule (45 / 35 / 20 %), the first two done: 80 % of 1 LS.
  clearing = await makeProfiledItem(
    db,
    w.home.id,
    'lump_sum',
    { itemNumber: 'L-1', description: 'Clearing', payUnit: 'LS', unitPriceCents: 2_000_000, contractQuantity: 1 },
    {
      stages: [
        { name: 'Pad', percentOfItem: 45 },
        { name: 'Basin', percentOfItem: 35 },
        { name: 'Borrow', percentOfItem: 20 },
      ],
      completedStages: [0, 1],
    },
  );
  // Contract (plan) quantity paid by percent complete: 4,000 SY at 37.5 %.
  topsoil = await makeProfiledItem(
    db,
    w.home.id,
    'plan_quantity',
    {
      itemNumber: 'P-1',
      description: 'Topsoil, plan quantity',
      payUnit: 'SY',
      unitPriceCents: 125,
      contractQuantity: 4000,
    },
    { percentComplete: 37.5 },
  );
  stray = await makeTally(db, {
    projectId: w.home.id,
    bidItemId: clearing.id,
    authorUserId: w.people.subcontractor.id,
    measuredOn: '2026-10-05',
    quantity: 1,
  });
});
afterAll(() => t.close());

describe('items paid from their settings when a pay application is compiled', () => {
  it("pays the stages done and the percent complete, and leaves those items' tallies unbilled", async () => {
    const res = await (
      await signedInAgent(t.app, w.people.subcontractor.email)
    )
      .post(`/api/projects/${w.home.id}/pay-apps`)
      .send({ periodStart: '2026-10-01', periodEnd: '2026-10-31' });
    expect(res.status).toBe(201);
    const app = res.body.payApp;
    const line = (id: string) => app.lines.find((l: { bidItemId: string }) => l.bidItemId === id);
    // L-1: 45 % + 35 % = 80 % of 1 LS = 0.8 LS x $20,000.00 = $16,000.00.
    expect(line(clearing.id)).toMatchObject({ thisPeriodQuantity: 0.8, amountToDateCents: 1_600_000 });
    // P-1: 4,000 SY x 37.5 % = 1,500 SY x $1.25 = $1,875.00.
    expect(line(topsoil.id)).toMatchObject({ thisPeriodQuantity: 1500, amountToDateCents: 187_500 });
    // $17,875.00 earned, $1,787.50 retainage, $16,087.50 due.
    expect(app).toMatchObject({ earnedToDateCents: 1_787_500, retainageCents: 178_750, currentDueCents: 1_608_750 });
    const [tally] = await t.database.db.select().from(tallies).where(eq(tallies.id, stray.id));
    expect(tally).toMatchObject({ status: 'ready', payAppId: null });
    // Each line says what it was paid from, and the settings lines look for no tally behind them: their percent
    // complete and stages (with their audit events) are their record.
    expect(line(clearing.id).paidFrom).toBe('settings');
    expect(line(topsoil.id).paidFrom).toBe('settings');
    const noEvidence = app.flags.filter((f: { kind: string }) => f.kind === 'no_evidence');
    expect(noEvidence.map((f: { itemNumber: string }) => f.itemNumber)).not.toContain('L-1');
    expect(noEvidence.map((f: { itemNumber: string }) => f.itemNumber)).not.toContain('P-1');
  });
});
