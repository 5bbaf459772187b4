import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { quantityChange } from '../setup/change-order-factories';
import { makeBidItem, makeWorld } from '../setup/factories';
import { auditActions, FILES } from '../setup/pay-cycle-factories';
import { tallyEvidence } from '../../server/db/schema';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
});
afterAll(() => t.close());

const sub = () => signedInAgent(t.app, w.people.subcontractor.email);
const url = () => `/api/projects/${w.home.id}/tallies`;
// US Navy EO training manual (NAVEDTRA 14081), reference.md section 1: 50 and 70 sq ft, 100 ft apart = 222.22 CY.
const navy = {
  unit: 'ft',
  stations: [
    { station: 1000, cutArea: 50, fillArea: 0 },
    { station: 1100, cutArea: 70, fillArea: 0 },
  ],
};
const longer = {
  unit: 'ft',
  stations: [
    { station: 1000, cutArea: 50, fillArea: 0 },
    { station: 1200, cutArea: 70, fillArea: 0 },
  ],
};

describe('a draft tally edited in its worksheet keeps its earlier inputs as a revision', () => {
  it('saves revision 1 with the first inputs and quantity, revision 2 with the second, newest first', async () => {
    const item = await makeBidItem(t.database.db, w.home.id, { contractQuantity: 100_000 });
    const agent = await sub();
    const created = await agent
      .post(url())
      .send({ bidItemId: item.id, measuredOn: '2026-10-15', method: 'end-area', inputs: navy, title: 'North cut' });
    const id = created.body.tally.id;
    await agent.patch(`/api/tallies/${id}`).send({ inputs: longer });
    const second = await agent.patch(`/api/tallies/${id}`).send({ inputs: navy, title: 'North cut, checked' });
    expect(second.status).toBe(200);
    const detail = await (await signedInAgent(t.app, w.people.general_contractor.email)).get(`/api/tallies/${id}`);
    expect(detail.body.revisions.map((r: { revision: number }) => r.revision)).toEqual([2, 1]);
    const [r2, r1] = detail.body.revisions;
    expect(r1).toMatchObject({ quantity: 222.2222, title: 'North cut', inputs: navy, replacedBy: expect.any(String) });
    expect(r2).toMatchObject({ quantity: 444.4444, inputs: longer });
    expect(r1.trail.at(-1)).toMatch(/^Bills 222\.2222 CY bank/);
    expect(await auditActions(t.database.db, id)).toEqual(['tally.created', 'tally.updated', 'tally.updated']);
  });
});

describe('sanity limits before saving', () => {
  it('asks for a reason past 10 x the contract quantity (400 SANITY_REASON_REQUIRED on sanityReason), saves nothing, then records the reason', async () => {
    const item = await makeBidItem(t.database.db, w.home.id, { contractQuantity: 20 });
    const agent = await sub();
    const body = { bidItemId: item.id, measuredOn: '2026-10-15', method: 'end-area', inputs: navy };
    const refused = await agent.post(url()).send(body);
    expect(refused.status).toBe(400);
    expect(refused.body.error.code).toBe('SANITY_REASON_REQUIRED');
    expect(refused.body.error.details[0]).toMatchObject({
      path: 'sanityReason',
      message: expect.stringMatching(/more than 10 times the contract quantity \(20\.00 CY\)/),
    });
    expect((await agent.get(url()).query({ bidItemId: item.id })).body.items).toHaveLength(0);
    const reason = 'Plan quantity was for one culvert; three were built under the field order';
    const ok = await agent.post(url()).send({ ...body, sanityReason: reason });
    expect(ok.status).toBe(201);
    expect(ok.body.tally.sanityReason).toBe(reason);
  });

  it('asks past twice the remaining quantity (contract less the item’s other tallies), and not below it', async () => {
    const item = await makeBidItem(t.database.db, w.home.id, { contractQuantity: 300 });
    const agent = await sub();
    const body = { bidItemId: item.id, measuredOn: '2026-10-15', method: 'end-area', inputs: navy };
    expect((await agent.post(url()).send(body)).status).toBe(201); // 222.22 of 300: remaining was 300
    const second = await agent.post(url()).send(body); // remaining 77.78, twice that 155.56 < 222.22
    expect(second.body.error.code).toBe('SANITY_REASON_REQUIRED');
    expect(second.body.error.message).toMatch(/more than twice the quantity left on the item \(77\.78 CY/);
  });

  it('judges against the current contract quantity: original plus the approved change order, not the original', async () => {
    // 20 CY bid; change order +100 CY approved -> 120 CY (src/shared/domain/contract.ts). 222.22 CY is more than
    // 10 x 20 = 200 (the original) but within 2 x 120 = 240 and 10 x 120 = 1,200 (the current contract).
    const item = await makeBidItem(t.database.db, w.home.id, { contractQuantity: 20 });
    const agent = await sub();
    const body = { bidItemId: item.id, measuredOn: '2026-10-15', method: 'end-area', inputs: navy };
    expect((await agent.post(url()).send(body)).body.error.code).toBe('SANITY_REASON_REQUIRED');
    const co = await agent.post(`/api/projects/${w.home.id}/change-orders`).send(quantityChange(item.id, 100));
    const gc = await signedInAgent(t.app, w.people.general_contractor.email);
    const proposedOnly = await agent.post(url()).send(body);
    expect(proposedOnly.body.error.code).toBe('SANITY_REASON_REQUIRED'); // a proposed change counts for nothing
    expect((await gc.post(`/api/change-orders/${co.body.changeOrder.id}/approve`).send({})).status).toBe(200);
    const saved = await agent.post(url()).send(body);
    expect(saved.status).toBe(201);
    expect(saved.body.tally).toMatchObject({ quantity: 222.2222, sanityReason: null });
    // The remaining limit reads the current quantity too: 120 - 222.22 tallied leaves 0, so a second one asks.
    const second = await agent.post(url()).send(body);
    expect(second.body.error.message).toMatch(/quantity left on the item \(0\.00 CY of 120\.00/);
  });

  it('refuses a reason shorter than 10 characters', async () => {
    const item = await makeBidItem(t.database.db, w.home.id, { contractQuantity: 1 });
    const res = await (
      await sub()
    )
      .post(url())
      .send({ bidItemId: item.id, measuredOn: '2026-10-15', method: 'end-area', inputs: navy, sanityReason: 'ok' });
    expect(res.body.error.code).toBe('SANITY_REASON_REQUIRED');
  });
});

describe('a file loaded into a worksheet becomes the tally evidence', () => {
  it('stores the CSV the worksheet read with its SHA-256 (checked with node:crypto)', async () => {
    const item = await makeBidItem(t.database.db, w.home.id, { contractQuantity: 100_000 });
    const agent = await sub();
    const csv = Buffer.from('station,cut_area,fill_area\n10+00,50,0\n11+00,70,0\n');
    const created = await agent
      .post(url())
      .send({ bidItemId: item.id, measuredOn: '2026-10-15', method: 'end-area', inputs: navy });
    const up = await agent
      .post(`/api/tallies/${created.body.tally.id}/evidence`)
      .attach('files', csv, { filename: 'north-sections.csv', contentType: 'text/csv' });
    expect(up.status).toBe(201);
    expect(up.body.evidence[0]).toMatchObject({
      fileName: 'north-sections.csv',
      kind: 'csv',
      sha256: createHash('sha256').update(csv).digest('hex'),
    });
    const detail = await agent.get(`/api/tallies/${created.body.tally.id}`);
    expect(detail.body.tally.evidenceCount).toBe(1);
  });
});

describe('a tally and its worksheet files save in one request', () => {
  const csv = Buffer.from('station,cut_area,fill_area\n10+00,50,0\n11+00,70,0\n');
  const tallyOf = (bidItemId: string) =>
    JSON.stringify({ bidItemId, measuredOn: '2026-10-16', method: 'end-area', inputs: navy, title: 'One request' });

  it('creates the tally with its files as evidence (SHA-256 by node:crypto) and one audit event', async () => {
    const item = await makeBidItem(t.database.db, w.home.id, { contractQuantity: 100_000 });
    const res = await (
      await sub()
    )
      .post(url())
      .field('tally', tallyOf(item.id))
      .attach('files', csv, { filename: 'north-sections.csv', contentType: 'text/csv' })
      .attach('files', FILES.pdf, { filename: 'field-notes.pdf', contentType: 'application/pdf' });
    expect(res.status).toBe(201);
    expect(res.body.tally).toMatchObject({ quantity: 222.2222, evidenceCount: 2, title: 'One request' });
    const hashes = res.body.evidence.map((e: { sha256: string }) => e.sha256).sort();
    expect(hashes).toEqual([csv, FILES.pdf].map((b) => createHash('sha256').update(b).digest('hex')).sort());
    expect(await auditActions(t.database.db, res.body.tally.id)).toEqual(['tally.created']);
  });

  it('saves nothing when one file is refused: no tally, no evidence row, no stored file', async () => {
    const item = await makeBidItem(t.database.db, w.home.id, { contractQuantity: 100_000 });
    const agent = await sub();
    const before = await t.database.db.select().from(tallyEvidence);
    const res = await agent
      .post(url())
      .field('tally', tallyOf(item.id))
      .attach('files', csv, { filename: 'north-sections.csv', contentType: 'text/csv' })
      .attach('files', Buffer.from('not a picture'), { filename: 'photo.png', contentType: 'image/png' });
    expect(res.status).toBe(400);
    expect(res.body.error.details.some((d: { path: string }) => d.path.startsWith('files'))).toBe(true);
    expect((await agent.get(url()).query({ bidItemId: item.id })).body.items).toHaveLength(0);
    expect(await t.database.db.select().from(tallyEvidence)).toHaveLength(before.length);
  });

  it('saves nothing when the tally is refused (sanity reason missing), though its files were good', async () => {
    const item = await makeBidItem(t.database.db, w.home.id, { contractQuantity: 1 });
    const agent = await sub();
    const before = await t.database.db.select().from(tallyEvidence);
    const res = await agent
      .post(url())
      .field('tally', tallyOf(item.id))
      .attach('files', csv, { filename: 'north-sections.csv', contentType: 'text/csv' });
    expect(res.body.error.code).toBe('SANITY_REASON_REQUIRED');
    expect((await agent.get(url()).query({ bidItemId: item.id })).body.items).toHaveLength(0);
    expect(await t.database.db.select().from(tallyEvidence)).toHaveLength(before.length);
  });

  it('updates a draft with new files in one request: a revision, the files, one tally.updated event', async () => {
    const item = await makeBidItem(t.database.db, w.home.id, { contractQuantity: 100_000 });
    const agent = await sub();
    const created = await agent.post(url()).field('tally', tallyOf(item.id));
    expect(created.status).toBe(201);
    const id = created.body.tally.id;
    const res = await agent
      .patch(`/api/tallies/${id}`)
      .field('tally', JSON.stringify({ inputs: longer }))
      .attach('files', csv, { filename: 'north-sections.csv', contentType: 'text/csv' });
    expect(res.status).toBe(200);
    expect(res.body.tally).toMatchObject({ quantity: 444.4444, evidenceCount: 1 });
    expect((await agent.get(`/api/tallies/${id}`)).body.revisions).toHaveLength(1);
    expect(await auditActions(t.database.db, id)).toEqual(['tally.created', 'tally.updated']);
  });

  it('answers 400 on the field `tally` when its JSON is missing or broken', async () => {
    const res = await (
      await sub()
    )
      .post(url())
      .field('tally', '{not json')
      .attach('files', csv, { filename: 'north-sections.csv', contentType: 'text/csv' });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].path).toBe('tally');
  });
});
