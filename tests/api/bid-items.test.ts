import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bidItems } from '../../server/db/schema';
import { makeBidItem, makeWorld, sampleBidItem } from '../setup/factories';
import { makeTally } from '../setup/pay-cycle-factories';
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
const countItems = async (projectId: string) =>
  (await t.database.db.select().from(bidItems).where(eq(bidItems.projectId, projectId))).length;

describe('bid items: who may do what', () => {
  it('lets the general contractor and the admin create, and everyone on the project read', async () => {
    const gc = await as('general_contractor');
    const created = await gc.post(`/api/projects/${w.home.id}/bid-items`).send(sampleBidItem({ itemNumber: 'R-1', contractQuantity: 10.5, unitPriceCents: 333 }));
    expect(created.status).toBe(201);
    // 10.5 x $3.33 = $34.965 -> $34.97, rounded to the cent once
    expect(created.body.bidItem).toMatchObject({ itemNumber: 'R-1', contractAmountCents: 3497, projectId: w.home.id });
    expect((await (await as('admin')).post(`/api/projects/${w.home.id}/bid-items`).send(sampleBidItem({ itemNumber: 'R-2' }))).status).toBe(201);
    for (const who of ['subcontractor', 'owner'] as const) {
      const res = await (await as(who)).get(`/api/projects/${w.home.id}/bid-items`);
      expect(res.status).toBe(200);
      expect(res.body.bidItems.map((b: { itemNumber: string }) => b.itemNumber)).toEqual(expect.arrayContaining(['R-1', 'R-2']));
    }
  });

  it('returns 403 when the subcontractor or the owner tries to create, edit or delete', async () => {
    const item = await makeBidItem(t.database.db, w.home.id);
    for (const who of ['subcontractor', 'owner'] as const) {
      const agent = await as(who);
      expect((await agent.post(`/api/projects/${w.home.id}/bid-items`).send(sampleBidItem())).status).toBe(403);
      expect((await agent.patch(`/api/bid-items/${item.id}`).send({ unitPriceCents: 1 })).status).toBe(403);
      expect((await agent.delete(`/api/bid-items/${item.id}`)).status).toBe(403);
    }
  });

  it('returns 404 to a person of another project for reads and writes, and changes nothing', async () => {
    const item = await makeBidItem(t.database.db, w.home.id, { unitPriceCents: 999 });
    const agent = await as('outsider');
    expect((await agent.get(`/api/projects/${w.home.id}/bid-items`)).status).toBe(404);
    expect((await agent.post(`/api/projects/${w.home.id}/bid-items`).send(sampleBidItem())).status).toBe(404);
    expect((await agent.patch(`/api/bid-items/${item.id}`).send({ unitPriceCents: 1 })).status).toBe(404);
    expect((await agent.delete(`/api/bid-items/${item.id}`)).status).toBe(404);
    const [after] = await t.database.db.select().from(bidItems).where(eq(bidItems.id, item.id));
    expect(after!.unitPriceCents).toBe(999);
  });

  it('edits and deletes for the general contractor', async () => {
    const item = await makeBidItem(t.database.db, w.home.id);
    const gc = await as('general_contractor');
    const patched = await gc.patch(`/api/bid-items/${item.id}`).send({ contractQuantity: 2500, isMajor: true });
    expect(patched.status).toBe(200);
    expect(patched.body.bidItem).toMatchObject({ contractQuantity: 2500, isMajor: true });
    expect((await gc.delete(`/api/bid-items/${item.id}`)).status).toBe(204);
    expect((await gc.patch(`/api/bid-items/${item.id}`).send({ isMajor: false })).status).toBe(404);
  });

  it('refuses with 409 to delete an item that tallies or pay application lines refer to, and keeps it', async () => {
    const item = await makeBidItem(t.database.db, w.home.id);
    await makeTally(t.database.db, { projectId: w.home.id, bidItemId: item.id, authorUserId: w.people.subcontractor.id, measuredOn: '2026-10-05', quantity: 10, status: 'draft' });
    const res = await (await as('general_contractor')).delete(`/api/bid-items/${item.id}`);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('BID_ITEM_IN_USE');
    expect(res.body.error.message).toContain('1 tally');
    expect((await t.database.db.select().from(bidItems).where(eq(bidItems.id, item.id))).length).toBe(1);
  });
});

describe('bid items: validation', () => {
  it('returns 400 VALIDATION_FAILED with each bad field named', async () => {
    const res = await (await as('general_contractor'))
      .post(`/api/projects/${w.home.id}/bid-items`)
      .send({ ...sampleBidItem(), payUnit: 'BUSHEL', unitPriceCents: 12.5, contractQuantity: -3, projectId: w.foreign.id });
    expect(res.status).toBe(400);
    const paths = res.body.error.details.map((d: { path: string }) => d.path).sort();
    expect(paths).toEqual(['(body)', 'contractQuantity', 'payUnit', 'unitPriceCents']);
  });

  it('returns 409 ITEM_NUMBER_TAKEN for a duplicate item number', async () => {
    const gc = await as('general_contractor');
    await gc.post(`/api/projects/${w.home.id}/bid-items`).send(sampleBidItem({ itemNumber: 'DUP' }));
    const res = await gc.post(`/api/projects/${w.home.id}/bid-items`).send(sampleBidItem({ itemNumber: 'DUP' }));
    expect(res.status).toBe(409);
    expect(res.body.error.details).toEqual([{ path: 'itemNumber', message: expect.stringContaining('DUP') }]);
  });

  it('returns 400 MALFORMED_JSON for a body that is not JSON', async () => {
    const res = await (await as('general_contractor'))
      .post(`/api/projects/${w.home.id}/bid-items`)
      .set('Content-Type', 'application/json')
      .send('{"itemNumber": ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('MALFORMED_JSON');
  });
});

const HEADER = 'item_number,description,pay_unit,basis,unit_price,contract_quantity,major,method';
const upload = async (csv: string | Buffer, name = 'schedule.csv', type = 'text/csv') =>
  (await as('general_contractor'))
    .post(`/api/projects/${w.home.id}/bid-items/import`)
    .attach('file', Buffer.isBuffer(csv) ? csv : Buffer.from(csv), { filename: name, contentType: type });

describe('POST /api/projects/:projectId/bid-items/import', () => {
  it('imports every row of a good file, money parsed to exact cents', async () => {
    const before = await countItems(w.home.id);
    const csv = [HEADER, 'C-1,Clearing,LS,bank,"$12,500.00",1,no,manual', 'C-2,Excavation,CY,bank,6.85,"18,400",yes,end-area'].join('\n');
    const res = await upload(csv);
    expect(res.status).toBe(201);
    expect(res.body.imported).toBe(2);
    expect(res.body.bidItems[1]).toMatchObject({ unitPriceCents: 685, contractQuantity: 18400, isMajor: true });
    expect(await countItems(w.home.id)).toBe(before + 2);
  });

  it('reports each bad row and column by line and saves none of the rows', async () => {
    const before = await countItems(w.home.id);
    const csv = [
      HEADER,
      'D-1,Good row,CY,bank,5.00,100,no,grid',
      'D-2,Bad price,CY,bank,5.005,100,no,grid',
      'D-3,Bad unit,BARREL,bank,5.00,ten,maybe,grid',
      'D-1,Repeat,CY,bank,5.00,100,no,grid',
    ].join('\r\n');
    const res = await upload(csv);
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/nothing was imported/);
    const where = res.body.error.details.map((d: { line: number; column: string }) => `${d.line}:${d.column}`);
    expect(where).toEqual(['3:unit_price', '4:contract_quantity', '4:major', '4:pay_unit', '5:item_number']);
    expect(await countItems(w.home.id)).toBe(before);
  });

  it('rolls back the whole file when one item number is already on the schedule', async () => {
    await makeBidItem(t.database.db, w.home.id, { itemNumber: 'E-2' });
    const before = await countItems(w.home.id);
    const res = await upload([HEADER, 'E-1,New,CY,bank,1,1,no,grid', 'E-2,Taken,CY,bank,1,1,no,grid'].join('\n'));
    expect(res.status).toBe(409);
    expect(res.body.error.details).toEqual([{ path: 'line 3.item_number', message: expect.stringContaining('E-2') }]);
    expect(await countItems(w.home.id)).toBe(before);
  });

  it('names a missing column, and refuses files that are not CSV text', async () => {
    const missing = await upload('item_number,description\nX,Y');
    expect(missing.status).toBe(400);
    expect(missing.body.error.details.map((d: { column: string }) => d.column)).toContain('unit_price');
    const png = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0]);
    const binary = await upload(png);
    expect(binary.status).toBe(400);
    expect(binary.body.error.code).toBe('UPLOAD_NOT_CSV');
    expect((await upload(Buffer.from([0xff, 0xfe, 0x41]))).body.error.code).toBe('UPLOAD_NOT_CSV');
    expect((await upload('a,b', 'schedule.exe', 'application/x-msdownload')).status).toBe(400);
  });

  it('returns 413 for a file over the upload limit', async () => {
    const res = await upload(`${HEADER}\n${'x'.repeat(1024 * 1024 + 10)}`);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('UPLOAD_FILE_SIZE');
  });

  it('returns 403 for the subcontractor', async () => {
    const res = await (await as('subcontractor'))
      .post(`/api/projects/${w.home.id}/bid-items/import`)
      .attach('file', Buffer.from(`${HEADER}\nZ,Z,CY,bank,1,1,no,grid`), { filename: 'a.csv', contentType: 'text/csv' });
    expect(res.status).toBe(403);
  });
});
