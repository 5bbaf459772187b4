import { createHash } from 'node:crypto';
import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { changeOrderDocuments, projects } from '../../server/db/schema';
import { MAX_DOCUMENTS_PER_CHANGE_ORDER } from '../../src/shared/constants';
import { quantityChange } from '../setup/change-order-factories';
import { makeBidItem, makeWorld } from '../setup/factories';
import { auditActions, FILES } from '../setup/pay-cycle-factories';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

// Supporting documents of a change order: the same upload checks as tally evidence, frozen once decided.
let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
});
afterAll(() => t.close());

type Who = keyof typeof w.people | 'outsider';
const as = (who: Who) => signedInAgent(t.app, who === 'outsider' ? w.outsider.email : w.people[who].email);
const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');

async function propose(who: Who = 'subcontractor') {
  const item = await makeBidItem(t.database.db, w.home.id);
  const res = await (await as(who)).post(`/api/projects/${w.home.id}/change-orders`).send(quantityChange(item.id, 30));
  expect(res.status).toBe(201);
  return res.body.changeOrder as { id: string; number: number };
}

async function attach(who: Who, changeOrderId: string, ...files: [Buffer, string, string?][]) {
  let req = (await as(who)).post(`/api/change-orders/${changeOrderId}/documents`);
  for (const [bytes, name, contentType] of files) {
    req = req.attach('files', bytes, contentType ? { filename: name, contentType } : name);
  }
  return req;
}

const countDocs = async (changeOrderId: string) =>
  (await t.database.db.select().from(changeOrderDocuments).where(eq(changeOrderDocuments.changeOrderId, changeOrderId)))
    .length;

describe('change order documents: attaching', () => {
  it('stores each file with its SHA-256, in one audit event, and lists them for every member', async () => {
    const co = await propose();
    const res = await attach('subcontractor', co.id, [FILES.pdf, 'survey-note.pdf'], [FILES.png, 'photo.png']);
    expect(res.status).toBe(201);
    expect(res.body.documents).toMatchObject([
      { fileName: 'survey-note.pdf', kind: 'pdf', sizeBytes: FILES.pdf.length, sha256: sha256(FILES.pdf) },
      { fileName: 'photo.png', kind: 'image', sha256: sha256(FILES.png) },
    ]);
    expect(await auditActions(t.database.db, co.id)).toEqual([
      'change_order.proposed',
      'change_order.documents_attached',
    ]);
    for (const who of ['subcontractor', 'general_contractor', 'owner'] as const) {
      const list = await (await as(who)).get(`/api/change-orders/${co.id}/documents`);
      expect(list.status).toBe(200);
      expect(list.body.documents.map((d: { fileName: string }) => d.fileName)).toEqual([
        'survey-note.pdf',
        'photo.png',
      ]);
    }
  });

  it('lets the general contractor attach; the owner only where the owner approves change orders', async () => {
    const co = await propose('general_contractor');
    expect((await attach('general_contractor', co.id, [FILES.csv, 'haul.csv'])).status).toBe(201);
    const owner = await attach('owner', co.id, [FILES.pdf, 'owner.pdf']);
    expect(owner.status).toBe(403);
    const db = t.database.db;
    await db.update(projects).set({ ownerApprovesChangeOrders: true }).where(eq(projects.id, w.home.id));
    try {
      expect((await attach('owner', co.id, [FILES.pdf, 'owner.pdf'])).status).toBe(201);
    } finally {
      await db.update(projects).set({ ownerApprovesChangeOrders: false }).where(eq(projects.id, w.home.id));
    }
    expect(await countDocs(co.id)).toBe(2);
  });

  it('refuses bad files with the same checks as tally evidence, naming each file, and saves nothing', async () => {
    const co = await propose();
    const res = await attach(
      'subcontractor',
      co.id,
      [FILES.pdf, 'fine.pdf'],
      [Buffer.from('MZ not a pdf'), 'fake.pdf'],
      [FILES.pdf, 'run.exe'],
    );
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('EVIDENCE_REJECTED');
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toEqual(['files.1', 'files.2']);
    expect((await attach('subcontractor', co.id)).body.error.code).toBe('UPLOAD_MISSING');
    expect(await countDocs(co.id)).toBe(0);
  });

  it(`refuses more than ${MAX_DOCUMENTS_PER_CHANGE_ORDER} documents on one change order`, async () => {
    const co = await propose();
    const many = Array.from({ length: 15 }, (_, i) => [FILES.csv, `f${i}.csv`] as [Buffer, string]);
    expect((await attach('subcontractor', co.id, ...many)).status).toBe(201);
    const more = await attach('subcontractor', co.id, ...many.slice(0, 6));
    expect(more.status).toBe(400);
    expect(more.body.error.code).toBe('DOCUMENT_LIMIT');
    expect(await countDocs(co.id)).toBe(15);
  });

  it('freezes the documents once the change order is approved or rejected (409)', async () => {
    const approved = await propose();
    expect((await attach('subcontractor', approved.id, [FILES.pdf, 'before.pdf'])).status).toBe(201);
    const gc = await as('general_contractor');
    expect((await gc.post(`/api/change-orders/${approved.id}/approve`).send({})).status).toBe(200);
    const late = await attach('subcontractor', approved.id, [FILES.pdf, 'after.pdf']);
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe('CHANGE_ORDER_DOCUMENTS_FROZEN');
    expect(late.body.error.message).toMatch(/approved/);

    const rejected = await propose();
    expect((await gc.post(`/api/change-orders/${rejected.id}/reject`).send({ note: 'Not in scope' })).status).toBe(200);
    expect((await attach('general_contractor', rejected.id, [FILES.pdf, 'x.pdf'])).body.error.code).toBe(
      'CHANGE_ORDER_DOCUMENTS_FROZEN',
    );
    expect(await countDocs(approved.id)).toBe(1);
    expect(await countDocs(rejected.id)).toBe(0);
    // The documents the decision was made on stay readable.
    expect((await gc.get(`/api/change-orders/${approved.id}/documents`)).body.documents).toHaveLength(1);
  });
});

describe('change order documents: downloading and outsiders', () => {
  it('downloads as an attachment with nosniff and the stored bytes', async () => {
    const co = await propose();
    const doc = (await attach('subcontractor', co.id, [FILES.csv, '../../etc/pass"wd;.csv'])).body.documents[0];
    expect(doc.fileName).toBe('pass_wd_.csv');
    for (const who of ['subcontractor', 'general_contractor', 'owner'] as const) {
      const dl = await (await as(who)).get(doc.downloadUrl);
      expect(dl.status).toBe(200);
      expect(dl.headers['content-disposition']).toBe(
        `attachment; filename="pass_wd_.csv"; filename*=UTF-8''pass_wd_.csv`,
      );
      expect(dl.headers['x-content-type-options']).toBe('nosniff');
      expect(dl.headers['content-type']).toMatch(/text\/csv/);
      expect(dl.text).toBe(FILES.csv.toString('utf8'));
    }
  });

  it('answers 404 to a person of another project on every route, and 401 to no one signed in', async () => {
    const co = await propose();
    const doc = (await attach('subcontractor', co.id, [FILES.pdf, 'site.pdf'])).body.documents[0];
    const outsider = await as('outsider');
    expect((await outsider.get(`/api/change-orders/${co.id}/documents`)).status).toBe(404);
    expect((await outsider.get(doc.downloadUrl)).status).toBe(404);
    const upload = await outsider.post(`/api/change-orders/${co.id}/documents`).attach('files', FILES.pdf, 'mine.pdf');
    expect(upload.status).toBe(404);
    expect((await request(t.app).get(doc.downloadUrl)).status).toBe(401);
    expect((await request(t.app).get(`/api/change-orders/${co.id}/documents`)).status).toBe(401);
    expect((await outsider.get('/api/change-order-documents/not-a-uuid/download')).status).toBe(404);
    expect(await countDocs(co.id)).toBe(1);
  });
});
