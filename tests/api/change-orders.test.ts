import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEvents, bidItems, changeOrders, projects } from '../../server/db/schema';
import { quantityChange } from '../setup/change-order-factories';
import { makeBidItem, makeWorld, sampleBidItem } from '../setup/factories';
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
const quantitiesOf = async (projectId: string, bidItemId: string) => {
  const res = await (await as('owner')).get(`/api/projects/${projectId}/contract-quantities`);
  return res.body.contractQuantities.find((q: { bidItemId: string }) => q.bidItemId === bidItemId);
};

describe('change orders: proposing', () => {
  it('lets either contractor propose, numbered per project, and refuses the owner with 403', async () => {
    const item = await makeBidItem(t.database.db, w.home.id);
    const sub = await (
      await as('subcontractor')
    )
      .post(`/api/projects/${w.home.id}/change-orders`)
      .send(quantityChange(item.id, 50));
    const gc = await (
      await as('general_contractor')
    )
      .post(`/api/projects/${w.home.id}/change-orders`)
      .send(quantityChange(item.id, 10));
    expect(sub.status).toBe(201);
    expect(gc.status).toBe(201);
    expect(gc.body.changeOrder.number).toBe(sub.body.changeOrder.number + 1);
    expect(sub.body.changeOrder).toMatchObject({
      status: 'proposed',
      items: [{ kind: 'change_quantity', quantityDelta: 50 }],
    });
    // 50 CY x $7.25 = $362.50
    expect(sub.body.changeOrder.amountDeltaCents).toBe(36250);
    expect(sub.body.changeOrder.history).toMatchObject([{ action: 'change_order.proposed' }]);
    const owner = await (
      await as('owner')
    )
      .post(`/api/projects/${w.home.id}/change-orders`)
      .send(quantityChange(item.id, 1));
    expect(owner.status).toBe(403);
  });

  it('answers 400 with the item path when a quantity would go below zero, and saves nothing', async () => {
    const item = await makeBidItem(t.database.db, w.home.id, { contractQuantity: 100 });
    const before = (await t.database.db.select().from(changeOrders)).length;
    const res = await (
      await as('subcontractor')
    )
      .post(`/api/projects/${w.home.id}/change-orders`)
      .send(quantityChange(item.id, -100.5));
    expect(res.status).toBe(400);
    expect(res.body.error.details).toEqual([expect.objectContaining({ path: 'items.0.quantityDelta' })]);
    expect((await t.database.db.select().from(changeOrders)).length).toBe(before);
  });

  it('answers 400 VALIDATION_FAILED on reason when the reason is missing or blank, and saves nothing', async () => {
    const item = await makeBidItem(t.database.db, w.home.id);
    const before = (await t.database.db.select().from(changeOrders)).length;
    const sub = await as('subcontractor');
    const { reason: _omitted, ...withoutReason } = quantityChange(item.id, 5);
    for (const body of [withoutReason, { ...withoutReason, reason: '   ' }]) {
      const res = await sub.post(`/api/projects/${w.home.id}/change-orders`).send(body);
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('VALIDATION_FAILED');
      expect(res.body.error.details).toEqual([expect.objectContaining({ path: 'reason' })]);
    }
    expect((await t.database.db.select().from(changeOrders)).length).toBe(before);
  });

  it('answers 400 for a bid item of another project and for a zero change', async () => {
    const foreignItem = await makeBidItem(t.database.db, w.foreign.id);
    const sub = await as('subcontractor');
    const other = await sub.post(`/api/projects/${w.home.id}/change-orders`).send(quantityChange(foreignItem.id, 5));
    expect(other.status).toBe(400);
    expect(other.body.error.details[0].path).toBe('items.0.bidItemId');
    const zero = await sub.post(`/api/projects/${w.home.id}/change-orders`).send(quantityChange(foreignItem.id, 0));
    expect(zero.status).toBe(400);
    expect(zero.body.error.details[0].path).toBe('items.0.quantityDelta');
  });

  it('returns 404 to a person of another project', async () => {
    const item = await makeBidItem(t.database.db, w.home.id);
    const created = await (
      await as('subcontractor')
    )
      .post(`/api/projects/${w.home.id}/change-orders`)
      .send(quantityChange(item.id, 5));
    const outsider = await as('outsider');
    expect((await outsider.get(`/api/projects/${w.home.id}/change-orders`)).status).toBe(404);
    expect((await outsider.get(`/api/change-orders/${created.body.changeOrder.id}`)).status).toBe(404);
    expect((await outsider.post(`/api/change-orders/${created.body.changeOrder.id}/approve`).send({})).status).toBe(
      404,
    );
  });
});

describe('change orders: deciding', () => {
  it('applies on the general contractor approval: contract quantity = original + approved changes', async () => {
    const item = await makeBidItem(t.database.db, w.home.id, { contractQuantity: 1000 });
    const sub = await as('subcontractor');
    const co = (await sub.post(`/api/projects/${w.home.id}/change-orders`).send(quantityChange(item.id, -120.25))).body
      .changeOrder;
    expect(await quantitiesOf(w.home.id, item.id)).toMatchObject({
      currentContractQuantity: 1000,
      approvedChangeQuantity: 0,
    });
    expect((await sub.post(`/api/change-orders/${co.id}/approve`).send({})).status).toBe(403);
    const approved = await (
      await as('general_contractor')
    )
      .post(`/api/change-orders/${co.id}/approve`)
      .send({ note: 'Agreed in the field' });
    expect(approved.status).toBe(200);
    expect(approved.body.changeOrder).toMatchObject({
      status: 'approved',
      gcApproval: { by: { userId: w.people.general_contractor.id } },
    });
    expect(await quantitiesOf(w.home.id, item.id)).toEqual({
      bidItemId: item.id,
      originalQuantity: 1000,
      approvedChangeQuantity: -120.25,
      currentContractQuantity: 879.75,
    });
    const history = approved.body.changeOrder.history.map((h: { action: string; note: string }) => [h.action, h.note]);
    expect(history).toEqual([
      ['change_order.proposed', 'Field conditions'],
      ['change_order.approved', 'Agreed in the field'],
    ]);
  });

  it('returns 409 on a stale decision: a second approval or a reject after approval', async () => {
    const item = await makeBidItem(t.database.db, w.home.id);
    const co = (
      await (
        await as('subcontractor')
      )
        .post(`/api/projects/${w.home.id}/change-orders`)
        .send(quantityChange(item.id, 3))
    ).body.changeOrder;
    const gc = await as('general_contractor');
    const [a, b] = await Promise.all([
      gc.post(`/api/change-orders/${co.id}/approve`).send({}),
      gc.post(`/api/change-orders/${co.id}/reject`).send({ note: 'No' }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    expect((await gc.post(`/api/change-orders/${co.id}/approve`).send({})).status).toBe(409);
    expect(await quantitiesOf(w.home.id, item.id)).toMatchObject({ approvedChangeQuantity: a.status === 200 ? 3 : 0 });
  });

  it('rejects with a required note, and a rejected change counts for nothing', async () => {
    const item = await makeBidItem(t.database.db, w.home.id);
    const co = (
      await (
        await as('general_contractor')
      )
        .post(`/api/projects/${w.home.id}/change-orders`)
        .send(quantityChange(item.id, 40))
    ).body.changeOrder;
    const gc = await as('general_contractor');
    const noNote = await gc.post(`/api/change-orders/${co.id}/reject`).send({});
    expect(noNote.status).toBe(400);
    expect(noNote.body.error.details[0].path).toBe('note');
    const rejected = await gc.post(`/api/change-orders/${co.id}/reject`).send({ note: 'Quantity is within the plan' });
    expect(rejected.body.changeOrder).toMatchObject({
      status: 'rejected',
      decisionNote: 'Quantity is within the plan',
    });
    expect(await quantitiesOf(w.home.id, item.id)).toMatchObject({
      approvedChangeQuantity: 0,
      currentContractQuantity: 1000,
    });
  });

  it('adds a bid item and changes a unit price on approval', async () => {
    const item = await makeBidItem(t.database.db, w.home.id, { unitPriceCents: 500 });
    const newItem = sampleBidItem({ itemNumber: 'CO-NEW-1', contractQuantity: 75, unitPriceCents: 2000 });
    const body = {
      title: 'Extra swale',
      reason: 'Runoff from the new access road needs a swale',
      items: [
        { kind: 'add_item', newItem },
        { kind: 'change_price', bidItemId: item.id, newUnitPriceCents: 650 },
      ],
    };
    const co = (await (await as('subcontractor')).post(`/api/projects/${w.home.id}/change-orders`).send(body)).body
      .changeOrder;
    await (await as('general_contractor')).post(`/api/change-orders/${co.id}/approve`).send({});
    const [added] = await t.database.db.select().from(bidItems).where(eq(bidItems.itemNumber, 'CO-NEW-1'));
    expect(added).toMatchObject({ addedByChangeOrderId: co.id, contractQuantity: 75, projectId: w.home.id });
    expect(await quantitiesOf(w.home.id, added!.id)).toMatchObject({
      originalQuantity: 0,
      approvedChangeQuantity: 75,
      currentContractQuantity: 75,
    });
    // The bid item keeps its original price; the current one comes from the approved change order.
    const list = (await (await as('owner')).get(`/api/projects/${w.home.id}/bid-items`)).body.bidItems as {
      id: string;
    }[];
    expect(list.find((b) => b.id === item.id)).toMatchObject({
      unitPriceCents: 650,
      originalUnitPriceCents: 500,
      changeOrderNumbers: [co.number],
    });
    expect(list.find((b) => b.id === added!.id)).toMatchObject({
      originalQuantity: 0,
      contractQuantity: 75,
      changeOrderNumbers: [co.number],
    });
  });

  it('needs both approvals where the owner approves change orders too, recording each', async () => {
    const { db } = t.database;
    await db.update(projects).set({ ownerApprovesChangeOrders: true }).where(eq(projects.id, w.home.id));
    const item = await makeBidItem(db, w.home.id);
    const co = (
      await (
        await as('subcontractor')
      )
        .post(`/api/projects/${w.home.id}/change-orders`)
        .send(quantityChange(item.id, 25))
    ).body.changeOrder;
    // `can` names the side each reader decides for, and drops it once that side has approved.
    expect(co.can).toEqual({ decide: false, decideAs: null, attachDocuments: true });
    const canOf = async (who: 'owner' | 'general_contractor') =>
      (await (await as(who)).get(`/api/change-orders/${co.id}`)).body.changeOrder.can;
    expect(await canOf('owner')).toEqual({ decide: true, decideAs: 'owner', attachDocuments: true });
    expect(await canOf('general_contractor')).toMatchObject({ decide: true, decideAs: 'gc' });
    const first = await (await as('owner')).post(`/api/change-orders/${co.id}/approve`).send({});
    expect(first.body.changeOrder.can).toMatchObject({ decide: false, decideAs: null });
    expect(first.body.changeOrder).toMatchObject({
      status: 'proposed',
      ownerApproval: { by: { userId: w.people.owner.id } },
      gcApproval: null,
    });
    expect((await (await as('owner')).post(`/api/change-orders/${co.id}/approve`).send({})).status).toBe(409);
    const second = await (await as('general_contractor')).post(`/api/change-orders/${co.id}/approve`).send({});
    expect(second.body.changeOrder.status).toBe('approved');
    expect(second.body.changeOrder.can).toEqual({ decide: false, decideAs: null, attachDocuments: false });
    const actions = (await db.select().from(auditEvents).where(eq(auditEvents.objectId, co.id))).map((e) => e.action);
    expect(actions).toEqual(['change_order.proposed', 'change_order.owner_approved', 'change_order.approved']);
    await db.update(projects).set({ ownerApprovesChangeOrders: false }).where(eq(projects.id, w.home.id));
  });
});
