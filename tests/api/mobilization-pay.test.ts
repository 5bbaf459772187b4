import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { tallies } from '../../server/db/schema';
import { makeBidItem, makeWorld } from '../setup/factories';
import { makeBillableProject, makeTally } from '../setup/pay-cycle-factories';
import { makeProfiledItem } from '../setup/provisions-factories';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

// Invented figures (test data), worked by hand. Mobilization 1 LS at $30,000.00 paid in steps of the original
// contract earned (a project's setting; the 25 % at 5 % / 50 % at 10 % pattern is Iowa DOT 2533's example):
// 25 % at 5 %, 50 % at 10 %, 100 % at 50 %. Original contract: $30,000.00 + A-1 $7,250.00 + B-2 $21,050.00 =
// $58,300.00.
let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
let mob: { id: string };
let mobTally: { id: string };
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
  const db = t.database.db;
  await makeBillableProject(db, w.home.id, w.people.subcontractor.id, (o) => makeBidItem(db, w.home.id, o));
  mob = await makeProfiledItem(
    db,
    w.home.id,
    'lump_sum',
    { itemNumber: '0-1', description: 'Mobilization', payUnit: 'LS', unitPriceCents: 3_000_000, contractQuantity: 1 },
    {
      mobilizationSteps: [
        { contractEarnedPercent: 5, mobilizationPercent: 25 },
        { contractEarnedPercent: 10, mobilizationPercent: 50 },
        { contractEarnedPercent: 50, mobilizationPercent: 100 },
      ],
    },
  );
  // A tally someone typed on the mobilization item: the steps decide its pay, so it is not billed.
  mobTally = await makeTally(db, {
    projectId: w.home.id,
    bidItemId: mob.id,
    authorUserId: w.people.subcontractor.id,
    measuredOn: '2026-10-05',
    quantity: 1,
  });
});
afterAll(() => t.close());

describe('mobilization paid in steps when a pay application is compiled', () => {
  it('pays the step the other items have reached, by hand: 13.66 % earned -> 50 % of mobilization', async () => {
    const sub = await signedInAgent(t.app, w.people.subcontractor.email);
    const res = await sub
      .post(`/api/projects/${w.home.id}/pay-apps`)
      .send({ periodStart: '2026-10-01', periodEnd: '2026-10-31' });
    expect(res.status).toBe(201);
    const app = res.body.payApp;
    // Other items: A-1 400 CY x $7.25 = $2,900.00, B-2 120.25 LF x $42.10 = $5,062.53: $7,962.53 of $58,300.00 =
    // 13.66 %, past the 10 % step (not the 50 %): 50 % x 1 LS = 0.5 LS = $15,000.00.
    const line = app.lines.find((l: { bidItemId: string }) => l.bidItemId === mob.id);
    expect(line).toMatchObject({
      previousQuantity: 0,
      thisPeriodQuantity: 0.5,
      toDateQuantity: 0.5,
      amountToDateCents: 1_500_000,
      retainageCents: 150_000,
    });
    // Earned $22,962.53; retainage $290.00 + $506.25 + $1,500.00 = $2,296.25; due $20,666.28.
    expect(app).toMatchObject({ earnedToDateCents: 2_296_253, retainageCents: 229_625, currentDueCents: 2_066_628 });
    const [tally] = await t.database.db.select().from(tallies).where(eq(tallies.id, mobTally.id));
    expect(tally).toMatchObject({ status: 'ready', payAppId: null });
  });
});
