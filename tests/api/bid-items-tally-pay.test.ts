import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeBidItem, makeWorld } from '../setup/factories';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

// The bid schedule tells the worksheets which items a tally does not bill (issue 12's chain meets issue 15's
// profiles): a truck-measure item is paid from its tickets, so a tally for it bills nothing, and the screens say so.
let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
});
afterAll(() => t.close());

describe('bid items say when their tallies are not billed', () => {
  it('marks a truck-measure item and a plan quantity with its percent; leaves a worksheet item and one without settings', async () => {
    const trucks = await makeBidItem(t.database.db, w.home.id, { itemNumber: 'T-1', payUnit: 'CY' });
    const plan = await makeBidItem(t.database.db, w.home.id, { itemNumber: 'T-2', payUnit: 'CY' });
    const planBare = await makeBidItem(t.database.db, w.home.id, { itemNumber: 'T-3', payUnit: 'CY' });
    const measured = await makeBidItem(t.database.db, w.home.id, { itemNumber: 'T-4', payUnit: 'CY' });
    const gc = await signedInAgent(t.app, w.people.general_contractor.email);
    const put = (id: string, body: object) => gc.put(`/api/bid-items/${id}/measurement-profile`).send(body);
    expect((await put(trucks.id, { profile: 'truck_measure' })).status).toBe(200);
    expect((await put(plan.id, { profile: 'plan_quantity', settings: { percentComplete: 40 } })).status).toBe(200);
    expect((await put(planBare.id, { profile: 'plan_quantity' })).status).toBe(200);

    const sub = await signedInAgent(t.app, w.people.subcontractor.email);
    const res = await sub.get(`/api/projects/${w.home.id}/bid-items`);
    expect(res.status).toBe(200);
    const of = (id: string) =>
      (res.body.bidItems as { id: string; talliesNotBilled: string | null }[]).find((b) => b.id === id)!
        .talliesNotBilled;
    expect(of(trucks.id)).toMatch(/^paid as “Counted loads \(truck register\)”, not from tallies/);
    expect(of(plan.id)).toMatch(/^paid as “Contract quantity”/);
    expect(of(planBare.id)).toBeNull();
    expect(of(measured.id)).toBeNull();
    // The list also names each item's profile, for the schedule's "Measured by" (none: measured by worksheet).
    const paidAs = (id: string) =>
      (res.body.bidItems as { id: string; paidAs: string | null }[]).find((b) => b.id === id)!.paidAs;
    expect([paidAs(trucks.id), paidAs(plan.id), paidAs(measured.id)]).toEqual(['truck_measure', 'plan_quantity', null]);
  });
});
