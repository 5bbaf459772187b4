import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEvents, bidItemProfiles } from '../../server/db/schema';
import { makeBidItem, makeWorld } from '../setup/factories';
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

describe('measurement profile per bid item', () => {
  it("lists every item, a worksheet at its unit's default when none is set (CY paid to 0.1, measured to 0.01)", async () => {
    const item = await makeBidItem(t.database.db, w.home.id, { itemNumber: 'P-1', payUnit: 'CY' });
    const res = await (await as('owner')).get(`/api/projects/${w.home.id}/measurement-profiles`);
    expect(res.status).toBe(200);
    expect(res.body.profiles.find((p: { bidItemId: string }) => p.bidItemId === item.id)).toMatchObject({
      profile: 'worksheet',
      payDecimals: 1,
      measuredDecimals: 2,
      stage: 'interim',
      isDefault: true,
      earnedCents: null,
    });
  });

  it('lets the general contractor and an admin set it, with one audit event holding before and after', async () => {
    const item = await makeBidItem(t.database.db, w.home.id, {
      itemNumber: 'P-2',
      payUnit: 'CY',
      contractQuantity: 1240,
      unitPriceCents: 1850,
    });
    const gc = await as('general_contractor');
    const res = await gc
      .put(`/api/bid-items/${item.id}/measurement-profile`)
      .send({ profile: 'plan_quantity', settings: { percentComplete: 37.5 } });
    expect(res.status).toBe(200);
    // 37.5 % of 1,240 CY = 465.00 CY x $18.50 = $8,602.50 (hand-worked).
    expect(res.body.profile).toMatchObject({ profile: 'plan_quantity', isDefault: false, earnedCents: 860_250 });
    const admin = await as('admin');
    const again = await admin
      .put(`/api/bid-items/${item.id}/measurement-profile`)
      .send({ profile: 'truck_measure', stage: 'final' });
    expect(again.status).toBe(200);
    const events = await t.database.db.select().from(auditEvents).where(eq(auditEvents.objectId, item.id));
    expect(events.map((e) => e.action)).toEqual(['measurement_profile.set', 'measurement_profile.set']);
    expect(events[1]!.before).toMatchObject({ profile: 'plan_quantity' });
    expect(events[1]!.after).toMatchObject({ profile: 'truck_measure', stage: 'final' });
  });

  it('refuses the subcontractor and the owner (403) and an outsider (404), writing nothing', async () => {
    const item = await makeBidItem(t.database.db, w.home.id, { itemNumber: 'P-3' });
    for (const who of ['subcontractor', 'owner'] as const) {
      const res = await (
        await as(who)
      )
        .put(`/api/bid-items/${item.id}/measurement-profile`)
        .send({ profile: 'weight' });
      expect(res.status, who).toBe(403);
    }
    const out = await (
      await as('outsider')
    )
      .put(`/api/bid-items/${item.id}/measurement-profile`)
      .send({ profile: 'weight' });
    expect(out.status).toBe(404);
    expect(out.body.error.message).toMatch(/bid item/);
    expect(await t.database.db.select().from(bidItemProfiles).where(eq(bidItemProfiles.bidItemId, item.id))).toEqual(
      [],
    );
  });

  it('earns a lump sum by stages, and refuses a schedule that does not add up to 100 % naming the field', async () => {
    const item = await makeBidItem(t.database.db, w.home.id, {
      itemNumber: 'LS-1',
      payUnit: 'LS',
      contractQuantity: 1,
      unitPriceCents: 4_800_000,
    });
    const gc = await as('general_contractor');
    const stages = [
      { name: 'Clear and grub', percentOfItem: 30 },
      { name: 'Strip topsoil', percentOfItem: 45 },
      { name: 'Respread and seed', percentOfItem: 25 },
    ];
    const ok = await gc
      .put(`/api/bid-items/${item.id}/measurement-profile`)
      .send({ profile: 'lump_sum', settings: { stages, completedStages: [0, 1] } });
    expect(ok.status).toBe(200);
    expect(ok.body.profile.earnedCents).toBe(3_600_000); // 75 % of $48,000.00
    const bad = await gc
      .put(`/api/bid-items/${item.id}/measurement-profile`)
      .send({ profile: 'lump_sum', settings: { stages: stages.slice(0, 2) } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0].path).toBe('settings.stages');
  });

  it('refuses a setting of another profile and a lump sum on an item not paid in LS', async () => {
    const item = await makeBidItem(t.database.db, w.home.id, { itemNumber: 'P-4', payUnit: 'CY' });
    const gc = await as('general_contractor');
    const stray = await gc
      .put(`/api/bid-items/${item.id}/measurement-profile`)
      .send({ profile: 'weight', settings: { percentComplete: 10 } });
    expect(stray.status).toBe(400);
    expect(stray.body.error.details[0].path).toBe('settings.percentComplete');
    const ls = await gc.put(`/api/bid-items/${item.id}/measurement-profile`).send({ profile: 'lump_sum' });
    expect(ls.status).toBe(400);
    expect(ls.body.error.details[0].path).toBe('profile');
  });
});
