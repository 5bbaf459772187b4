import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { tallies, tallyEvidence } from '../../server/db/schema';
import { makeBidItem, makeWorld } from '../setup/factories';
import { auditActions, FILES } from '../setup/pay-cycle-factories';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
let items: Record<'cut' | 'loose' | 'metric' | 'lf' | 'ton' | 'fill', Awaited<ReturnType<typeof makeBidItem>>>;
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
  const db = t.database.db;
  // Large contract quantities: these tests post many tallies per item and stay clear of the sanity limits
  // (tested on their own in tally-revisions.test.ts).
  const big = { contractQuantity: 1_000_000 };
  items = {
    cut: await makeBidItem(db, w.home.id, { itemNumber: 'T-1', payUnit: 'CY', basis: 'bank', ...big }),
    loose: await makeBidItem(db, w.home.id, {
      itemNumber: 'T-2',
      payUnit: 'CY',
      basis: 'loose',
      method: 'grid',
      ...big,
    }),
    metric: await makeBidItem(db, w.home.id, { itemNumber: 'T-3', payUnit: 'm3', basis: 'bank', ...big }),
    lf: await makeBidItem(db, w.home.id, { itemNumber: 'T-4', payUnit: 'LF', basis: 'bank', method: 'trench', ...big }),
    ton: await makeBidItem(db, w.home.id, {
      itemNumber: 'T-5',
      payUnit: 'TON',
      basis: 'bank',
      method: 'manual',
      ...big,
    }),
    fill: await makeBidItem(db, w.home.id, { itemNumber: 'T-6', payUnit: 'CY', basis: 'compacted', ...big }),
  };
});
afterAll(() => t.close());

const as = (who: keyof typeof w.people | 'outsider') =>
  signedInAgent(t.app, who === 'outsider' ? w.outsider.email : w.people[who].email);
const url = () => `/api/projects/${w.home.id}/tallies`;
// US Navy EO training manual (NAVEDTRA 14081) example, reference.md section 1: A1 = 50, A2 = 70 sq ft, 100 ft apart.
const navy = {
  unit: 'ft',
  stations: [
    { station: 1000, cutArea: 50, fillArea: 0 },
    { station: 1100, cutArea: 70, fillArea: 0 },
  ],
};
// Grid example, reference.md section 1: 3 x 3 nodes at 50 ft, 20,000 cu ft = 740.74 CY.
const grid = {
  unit: 'ft',
  spacingX: 50,
  spacingY: 50,
  depths: [
    [1, 1.5, 2],
    [1.5, 2, 2.5],
    [2, 2.5, 3],
  ],
};
const endArea = (bidItemId: string, extra: object = {}) => ({
  bidItemId,
  measuredOn: '2026-10-15',
  method: 'end-area',
  inputs: navy,
  ...extra,
});

describe('tallies: the server computes the quantity in the bid item unit and basis', () => {
  it('bills the cut of an end-area worksheet in bank CY: 222.22 CY (Navy EO manual example)', async () => {
    const res = await (await as('subcontractor')).post(url()).send(endArea(items.cut.id));
    expect(res.status).toBe(201);
    expect(res.body.tally.quantity).toBeCloseTo(222.2222, 4);
    expect(res.body.tally.result.measured).toMatchObject({ component: 'cut', basis: 'bank', unit: 'CY' });
    expect(res.body.tally.result.trail.at(-1)).toContain('222.2222 CY bank');
  });

  it('refuses a tally measured on a day still to come, naming measuredOn, with nothing saved', async () => {
    const nextYear = `${new Date().getUTCFullYear() + 1}-01-04`;
    const res = await (await as('subcontractor')).post(url()).send(endArea(items.cut.id, { measuredOn: nextYear }));
    expect(res.status).toBe(400);
    expect(res.body.error.details).toEqual([
      expect.objectContaining({ path: 'measuredOn', message: 'Cannot be a day still to come' }),
    ]);
  });

  it('ignores a quantity sent with a worksheet and keeps the server result', async () => {
    const res = await (await as('subcontractor')).post(url()).send(endArea(items.cut.id, { quantity: 99999 }));
    expect(res.status).toBe(201);
    expect(res.body.tally.quantity).toBeCloseTo(222.2222, 4);
  });

  it('converts bank to loose with the project swell (25 %): 740.74 x 1.25 = 925.93 CY, shown in the trail', async () => {
    const res = await (
      await as('subcontractor')
    )
      .post(url())
      .send({ bidItemId: items.loose.id, measuredOn: '2026-10-16', method: 'grid', inputs: grid });
    expect(res.status).toBe(201);
    // loose = bank x (1 + swell): Nichols and Day, Moving the Earth, p. 2.51 (reference.md section 3)
    expect(res.body.tally.quantity).toBeCloseTo((20000 / 27) * 1.25, 3);
    expect(res.body.tally.result.trail.join('\n')).toMatch(/swell 25\.0 %/);
  });

  it('bills a fill in compacted measure and converts a bank cut to compacted with the shrinkage (10 %)', async () => {
    const agent = await as('subcontractor');
    const fill = {
      unit: 'ft',
      stations: [
        { station: 0, cutArea: 0, fillArea: 27 },
        { station: 100, cutArea: 0, fillArea: 27 },
      ],
    };
    const a = await agent
      .post(url())
      .send({ bidItemId: items.fill.id, measuredOn: '2026-10-16', method: 'end-area', inputs: fill });
    expect(a.body.tally.quantity).toBeCloseTo(100, 4);
    const b = await agent.post(url()).send(endArea(items.fill.id, { component: 'cut' }));
    // compacted = bank x (1 - shrinkage), reference.md section 3
    expect(b.body.tally.quantity).toBeCloseTo(222.2222 * 0.9, 3);
  });

  it('converts CY to m3 with the exact yard (1 CY = 0.764554857984 m3)', async () => {
    const res = await (await as('subcontractor')).post(url()).send(endArea(items.metric.id));
    expect(res.body.tally.quantity).toBeCloseTo((22222.222 / 100) * 0.764554857984, 3);
    expect(res.body.tally.unit ?? res.body.tally.result.unit).toBe('m3');
  });

  it('takes the run lengths for an LF item from trench runs', async () => {
    const inputs = {
      unit: 'ft',
      protection: 'box',
      runs: [
        { length: 100, depth: 6, bottomWidth: 11 },
        { length: 40.5, depth: 4, bottomWidth: 3 },
      ],
    };
    const res = await (
      await as('subcontractor')
    )
      .post(url())
      .send({ bidItemId: items.lf.id, measuredOn: '2026-10-17', method: 'trench', inputs });
    expect(res.status).toBe(201);
    expect(res.body.tally.quantity).toBe(140.5);
  });

  it('computes a boxed trench volume: 100 x 11 x 6 ft = 6,600 cu ft = 244.44 CY (Measuring Excavation and Sitework, ch. 3)', async () => {
    const inputs = { unit: 'ft', protection: 'box', runs: [{ length: 100, depth: 6, bottomWidth: 11 }] };
    const res = await (
      await as('subcontractor')
    )
      .post(url())
      .send({ bidItemId: items.cut.id, measuredOn: '2026-10-17', method: 'trench', inputs });
    expect(res.body.tally.quantity).toBeCloseTo(6600 / 27, 4);
  });

  it('refuses a volume worksheet for a TON item with 400 UNIT_MISMATCH, and accepts a manual quantity with a basis', async () => {
    const agent = await as('subcontractor');
    const bad = await agent.post(url()).send(endArea(items.ton.id));
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('UNIT_MISMATCH');
    expect(bad.body.error.message).toMatch(/TON/);
    const ok = await agent.post(url()).send({
      bidItemId: items.ton.id,
      measuredOn: '2026-10-18',
      method: 'manual',
      quantity: 412.35,
      manualBasis: 'Scale tickets 4410-4452 from the quarry',
    });
    expect(ok.status).toBe(201);
    expect(ok.body.tally.quantity).toBe(412.35);
  });

  it('answers 400 with field paths for a manual tally without basis and for bad worksheet inputs', async () => {
    const agent = await as('subcontractor');
    const noBasis = await agent
      .post(url())
      .send({ bidItemId: items.ton.id, measuredOn: '2026-10-18', method: 'manual', quantity: 3 });
    expect(noBasis.status).toBe(400);
    expect(noBasis.body.error.details.map((d: { path: string }) => d.path)).toContain('manualBasis');
    const badStations = await agent.post(url()).send(
      endArea(items.cut.id, {
        inputs: {
          unit: 'ft',
          stations: [
            { station: 10, cutArea: 5, fillArea: 0 },
            { station: 5, cutArea: 5, fillArea: 0 },
          ],
        },
      }),
    );
    expect(badStations.status).toBe(400);
    expect(badStations.body.error.details[0].path).toBe('inputs.stations.1.station');
    const badDate = await agent.post(url()).send(endArea(items.cut.id, { measuredOn: '2026-02-30' }));
    expect(badDate.status).toBe(400);
    expect(badDate.body.error.details[0].path).toBe('measuredOn');
    const foreignItem = await makeBidItem(t.database.db, w.foreign.id);
    expect((await agent.post(url()).send(endArea(foreignItem.id))).body.error.details[0].path).toBe('bidItemId');
  });
});

describe('tallies: who may do what, and the draft life', () => {
  it('lets only the subcontractor write (403 for the others), everyone on the project read, and 404 an outsider', async () => {
    for (const who of ['general_contractor', 'owner', 'admin'] as const) {
      expect((await (await as(who)).post(url()).send(endArea(items.cut.id))).status).toBe(403);
      expect((await (await as(who)).get(url())).status).toBe(200);
    }
    const created = await (await as('subcontractor')).post(url()).send(endArea(items.cut.id));
    const outsider = await as('outsider');
    expect((await outsider.get(url())).status).toBe(404);
    expect((await outsider.get(`/api/tallies/${created.body.tally.id}`)).status).toBe(404);
    expect((await outsider.patch(`/api/tallies/${created.body.tally.id}`).send({ title: 'x' })).status).toBe(404);
  });

  it('edits a draft (recomputed), then ready, then refuses edits and deletes with 409 TALLY_NOT_DRAFT', async () => {
    const agent = await as('subcontractor');
    const { body } = await agent.post(url()).send(endArea(items.cut.id));
    const id = body.tally.id;
    const patched = await agent
      .patch(`/api/tallies/${id}`)
      .send({ inputs: { ...navy, stations: [navy.stations[0], { station: 1200, cutArea: 70, fillArea: 0 }] } });
    expect(patched.status).toBe(200);
    expect(patched.body.tally.quantity).toBeCloseTo(444.4444, 4);
    expect((await (await as('general_contractor')).post(`/api/tallies/${id}/ready`)).status).toBe(403);
    const ready = await agent.post(`/api/tallies/${id}/ready`);
    expect(ready.body.tally.status).toBe('ready');
    expect((await agent.patch(`/api/tallies/${id}`).send({ title: 'late' })).body.error.code).toBe('TALLY_NOT_DRAFT');
    expect((await agent.delete(`/api/tallies/${id}`)).status).toBe(409);
    expect((await agent.post(`/api/tallies/${id}/ready`)).status).toBe(409);
    expect(await auditActions(t.database.db, id)).toEqual(['tally.created', 'tally.updated', 'tally.ready']);
  });

  it('answers each reader with what it may do (`can`), the same rules the server enforces', async () => {
    const sub = await as('subcontractor');
    const { body } = await sub.post(url()).send(endArea(items.cut.id));
    const id = body.tally.id;
    const all = { edit: true, delete: true, markReady: true, addEvidence: true, removeEvidence: true };
    const none = { edit: false, delete: false, markReady: false, addEvidence: false, removeEvidence: false };
    expect(body.tally.can).toEqual(all);
    expect((await sub.get(`/api/projects/${w.home.id}`)).body.project.can).toMatchObject({ createTally: true });
    const listed = async (agent: Awaited<ReturnType<typeof as>>) =>
      ((await agent.get(url())).body.items as { id: string; can: unknown }[]).find((t) => t.id === id)?.can;
    expect(await listed(sub)).toEqual(all);
    for (const who of ['general_contractor', 'owner', 'admin'] as const) {
      const agent = await as(who);
      expect((await agent.get(`/api/tallies/${id}`)).body.tally.can).toEqual(none);
      expect(await listed(agent)).toEqual(none);
      expect((await agent.get(`/api/projects/${w.home.id}`)).body.project.can).toMatchObject({ createTally: false });
    }
    const ready = await sub.post(`/api/tallies/${id}/ready`);
    expect(ready.body.tally.can).toEqual(none);
    expect(await listed(sub)).toEqual(none);
  });

  it('filters the list by status, bid item and period', async () => {
    const agent = await as('subcontractor');
    await agent.post(url()).send(endArea(items.metric.id, { measuredOn: '2026-11-02' }));
    const byItem = await agent.get(url()).query({ bidItemId: items.metric.id, from: '2026-11-01', to: '2026-11-30' });
    expect(byItem.body.items).toHaveLength(1);
    expect(byItem.body.items[0].bidItem.itemNumber).toBe('T-3');
    const ready = await agent.get(url()).query({ status: 'ready' });
    expect(ready.body.items.every((x: { status: string }) => x.status === 'ready')).toBe(true);
    expect((await agent.get(url()).query({ status: 'lost' })).status).toBe(400);
  });

  it('deletes a draft with its evidence', async () => {
    const agent = await as('subcontractor');
    const { body } = await agent.post(url()).send(endArea(items.cut.id));
    await agent.post(`/api/tallies/${body.tally.id}/evidence`).attach('files', FILES.pdf, 'ticket.pdf');
    expect((await agent.delete(`/api/tallies/${body.tally.id}`)).status).toBe(204);
    expect(await t.database.db.select().from(tallies).where(eq(tallies.id, body.tally.id))).toHaveLength(0);
    expect(await auditActions(t.database.db, body.tally.id)).toContain('tally.deleted');
  });
});

describe('tallies: evidence files', () => {
  let tallyId: string;
  beforeAll(async () => {
    tallyId = (await (await as('subcontractor')).post(url()).send(endArea(items.cut.id))).body.tally.id;
  });
  const upload = async (...files: [Buffer, string, string?][]) => {
    let req = (await as('subcontractor')).post(`/api/tallies/${tallyId}/evidence`);
    for (const [bytes, name, contentType] of files)
      req = req.attach('files', bytes, contentType ? { filename: name, contentType } : name);
    return req;
  };

  it('stores PDF, PNG, JPEG, CSV and LandXML files whose content matches their type', async () => {
    const res = await upload(
      [FILES.pdf, 'survey.pdf'],
      [FILES.png, 'photo.png'],
      [FILES.jpeg, 'pit.jpg'],
      [FILES.csv, 'sections.csv'],
      [FILES.landxml, 'ground.xml'],
    );
    expect(res.status).toBe(201);
    expect(res.body.evidence.map((e: { kind: string }) => e.kind)).toEqual(['pdf', 'image', 'image', 'csv', 'landxml']);
    const detail = await (await as('owner')).get(`/api/tallies/${tallyId}`);
    expect(detail.body.evidence).toHaveLength(5);
    expect(detail.body.tally.evidenceCount).toBe(5);
  });

  it('refuses content that does not match the declared type, naming each file, and saves none of the upload', async () => {
    const before = (await t.database.db.select().from(tallyEvidence).where(eq(tallyEvidence.tallyId, tallyId))).length;
    const res = await upload(
      [FILES.pdf, 'good.pdf'],
      [Buffer.from('hello, not a pdf'), 'fake.pdf'],
      [Buffer.from('<root/>'), 'plain.xml'],
      [FILES.png, 'photo.jpg'],
      [Buffer.from([0xff, 0xfe, 0x00, 0x41]), 'bad.csv'],
      [FILES.pdf, 'run.exe'],
    );
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('EVIDENCE_REJECTED');
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toEqual([
      'files.1',
      'files.2',
      'files.3',
      'files.4',
      'files.5',
    ]);
    expect(res.body.error.details[1].message).toMatch(/LandXML/);
    expect((await t.database.db.select().from(tallyEvidence).where(eq(tallyEvidence.tallyId, tallyId))).length).toBe(
      before,
    );
  });

  it('refuses a declared type that contradicts the extension', async () => {
    const res = await upload([FILES.pdf, 'doc.pdf', 'image/png']);
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].message).toMatch(/image\/png/);
  });

  it('sanitises file names and downloads as an attachment, authorized like the tally', async () => {
    const res = await upload([FILES.csv, '../../etc/pass"wd;.csv']);
    const ev = res.body.evidence[0];
    expect(ev.fileName).toBe('pass_wd_.csv');
    const dl = await (await as('general_contractor')).get(ev.downloadUrl);
    expect(dl.status).toBe(200);
    expect(dl.headers['content-disposition']).toBe(
      `attachment; filename="pass_wd_.csv"; filename*=UTF-8''pass_wd_.csv`,
    );
    expect(dl.headers['content-type']).toMatch(/text\/csv/);
    expect(dl.text).toBe(FILES.csv.toString('utf8'));
    expect((await (await as('outsider')).get(ev.downloadUrl)).status).toBe(404);
    expect((await (await as('general_contractor')).delete(`/api/evidence/${ev.id}`)).status).toBe(403);
    expect((await (await as('subcontractor')).delete(`/api/evidence/${ev.id}`)).status).toBe(204);
  });

  it('refuses the upload past MAX_EVIDENCE_FILES_PER_TALLY files on one tally', async () => {
    const many = Array.from({ length: 16 }, (_, i) => [FILES.csv, `f${i}.csv`] as [Buffer, string]);
    const res = await upload(...many);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('EVIDENCE_LIMIT');
  });

  it('refuses evidence on a ready tally with 409', async () => {
    const agent = await as('subcontractor');
    const { body } = await agent.post(url()).send(endArea(items.cut.id));
    await agent.post(`/api/tallies/${body.tally.id}/ready`);
    const res = await agent.post(`/api/tallies/${body.tally.id}/evidence`).attach('files', FILES.pdf, 'late.pdf');
    expect(res.status).toBe(409);
  });
});
