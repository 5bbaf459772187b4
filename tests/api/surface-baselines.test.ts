import { createHash } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEvents, surfaceBaselines } from '../../server/db/schema';
import { makeBidItem, makeWorld } from '../setup/factories';
import { auditActions } from '../setup/pay-cycle-factories';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

// The signed original ground surface (issue 13, item 3): recorded once, accepted by the subcontractor and the
// general contractor, then locked; surface tallies measure against it; replacing it needs both again.
let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
});
afterAll(() => t.close());

type Who = keyof typeof w.people | 'outsider';
const as = (who: Who) => signedInAgent(t.app, who === 'outsider' ? w.outsider.email : w.people[who].email);
/** The factories name each person after their e-mail's local part. */
const nameOf = (who: keyof typeof w.people) => w.people[who].email.split('@')[0]!;
const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');

/**
 * A square 100 ft on a side (plan in feet) whose elevations are written in metres by the LandXML default (Imperial
 * without elevationUnit: LandXML 1.2 schema): 30.48 m = 100 ft (0.3048 m to the foot).
 */
const ground = (elevationM = 30.48, units = '<Units><Imperial linearUnit="foot"/></Units>') =>
  Buffer.from(`<?xml version="1.0"?>
<LandXML xmlns="http://www.landxml.org/schema/LandXML-1.2" version="1.2">${units}
<Surfaces><Surface name="Original ground"><Definition surfType="TIN"><Pnts>
<P id="1">0 0 ${elevationM}</P><P id="2">0 100 ${elevationM}</P><P id="3">100 100 ${elevationM}</P><P id="4">100 0 ${elevationM}</P>
</Pnts><Faces><F>1 2 3</F><F>1 3 4</F></Faces></Definition></Surface></Surfaces></LandXML>`);

async function record(who: Who, bytes: Buffer, fields: Record<string, string> = {}, projectId = w.home.id) {
  let req = (await as(who)).post(`/api/projects/${projectId}/surface-baselines`);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return req.attach('file', bytes, 'original-ground.xml');
}
const accept = async (who: Who, id: string) => (await as(who)).post(`/api/surface-baselines/${id}/accept`).send({});

describe('recording an original ground surface', () => {
  it('stores the file with its SHA-256 and its points, proposed, in one audit event', async () => {
    const bytes = ground();
    const res = await record('subcontractor', bytes, { area: 'Record area' });
    expect(res.status).toBe(201);
    expect(res.body.baseline).toMatchObject({
      area: 'Record area',
      status: 'proposed',
      sha256: sha256(bytes),
      sizeBytes: bytes.length,
      surfaceName: 'Original ground',
      pointCount: 4,
      linearUnit: 'foot',
      elevationUnit: 'meter',
      unitsFrom: 'file',
      subcontractorAccepted: null,
      generalContractorAccepted: null,
      can: { accept: true },
    });
    expect(await auditActions(t.database.db, res.body.baseline.id)).toEqual(['surface_baseline.recorded']);
    const file = await (
      await as('owner')
    )
      .get(res.body.baseline.downloadUrl)
      .buffer(true)
      .parse((r, done) => {
        const parts: Buffer[] = [];
        r.on('data', (c: Buffer) => parts.push(c));
        r.on('end', () => done(null, Buffer.concat(parts)));
      });
    expect(file.status).toBe(200);
    expect(file.headers['x-content-type-options']).toBe('nosniff');
    expect(sha256(file.body as Buffer)).toBe(sha256(bytes));
  });

  it('the general contractor records too; the owner and the admins may not (403, nothing written)', async () => {
    expect((await record('general_contractor', ground(), { area: 'GC area' })).status).toBe(201);
    for (const who of ['owner', 'admin', 'subcontractor_admin', 'owner_admin'] as const) {
      const res = await record(who, ground(), { area: `Refused ${who}` });
      expect(res.status).toBe(403);
    }
    const rows = await t.database.db.select().from(surfaceBaselines).where(eq(surfaceBaselines.projectId, w.home.id));
    expect(rows.some((r) => r.area.startsWith('Refused'))).toBe(false);
  });

  it('asks the unit of a file without <Units>, and takes it as the recorder said', async () => {
    const bare = ground(100, '');
    const asked = await record('subcontractor', bare, { area: 'No units' });
    expect(asked.status).toBe(400);
    expect(asked.body.error.code).toBe('BASELINE_UNITS_REQUIRED');
    const told = await record('subcontractor', bare, { area: 'No units', unit: 'ft' });
    expect(told.status).toBe(201);
    expect(told.body.baseline).toMatchObject({ linearUnit: 'foot', elevationUnit: 'foot', unitsFrom: 'recorder' });
  });

  it('refuses a file that is not LandXML, naming the line, and saves nothing', async () => {
    const before = (await t.database.db.select().from(auditEvents)).length;
    const res = await record('subcontractor', Buffer.from('<?xml version="1.0"?>\n<LandXML>\n<Surfaces>\n</LandXML>'));
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('BASELINE_FILE_INVALID');
    expect(res.body.error.details[0].message).toMatch(/^Line 4, \(XML\): Not well-formed XML/);
    expect((await record('subcontractor', Buffer.from('x,y,z\n1,2,3'))).body.error.code).toBe('BASELINE_FILE_INVALID');
    expect((await t.database.db.select().from(auditEvents)).length).toBe(before);
  });

  it('keeps one proposal per area at a time (409 BASELINE_PROPOSAL_OPEN)', async () => {
    expect((await record('subcontractor', ground(), { area: 'Busy' })).status).toBe(201);
    const again = await record('general_contractor', ground(), { area: 'Busy' });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('BASELINE_PROPOSAL_OPEN');
  });
});

describe('accepting and locking', () => {
  it('locks once both sides accept; each side once; the owner and admins cannot accept', async () => {
    const { body } = await record('subcontractor', ground(), { area: 'Lock area' });
    const id = body.baseline.id as string;
    for (const who of ['owner', 'admin', 'subcontractor_admin', 'owner_admin'] as const)
      expect((await accept(who, id)).status).toBe(403);
    const sub = await accept('subcontractor', id);
    expect(sub.status).toBe(200);
    expect(sub.body.baseline.status).toBe('proposed');
    expect(sub.body.baseline.subcontractorAccepted.name).toBe(nameOf('subcontractor'));
    expect(sub.body.baseline.can.accept).toBe(false);
    const twice = await accept('subcontractor', id);
    expect([twice.status, twice.body.error.code]).toEqual([409, 'BASELINE_ALREADY_ACCEPTED']);
    const gc = await accept('general_contractor', id);
    expect(gc.body.baseline).toMatchObject({
      status: 'locked',
      generalContractorAccepted: { name: nameOf('general_contractor') },
    });
    expect(gc.body.baseline.lockedAt).not.toBeNull();
    expect(await auditActions(t.database.db, id)).toEqual([
      'surface_baseline.recorded',
      'surface_baseline.accepted',
      'surface_baseline.locked',
    ]);
    const late = await accept('general_contractor', id);
    expect([late.status, late.body.error.code]).toEqual([409, 'BASELINE_NOT_PROPOSED']);
  });

  it('two acceptances at the same moment lock it once (the row is locked while each is decided)', async () => {
    const id = (await record('subcontractor', ground(), { area: 'Race area' })).body.baseline.id as string;
    const [a, b] = await Promise.all([accept('subcontractor', id), accept('general_contractor', id)]);
    expect([a.status, b.status]).toEqual([200, 200]);
    const actions = await auditActions(t.database.db, id);
    expect(actions.filter((x) => x === 'surface_baseline.locked')).toHaveLength(1);
    expect(actions.filter((x) => x === 'surface_baseline.accepted')).toHaveLength(1);
    const list = (await (await as('owner')).get(`/api/projects/${w.home.id}/surface-baselines`)).body.baselines;
    expect(list.find((x: { id: string }) => x.id === id).status).toBe('locked');
  });

  it('replacing a locked baseline needs both acceptances again and is an audit event; the old one is kept as replaced', async () => {
    const first = (await record('subcontractor', ground(), { area: 'Replace area' })).body.baseline.id as string;
    await accept('subcontractor', first);
    await accept('general_contractor', first);
    const second = await record('general_contractor', ground(30.5), { area: 'Replace area' });
    expect(second.body.baseline).toMatchObject({ status: 'proposed', replacesId: first });
    await accept('general_contractor', second.body.baseline.id);
    let list = (await (await as('owner')).get(`/api/projects/${w.home.id}/surface-baselines`)).body.baselines;
    expect(list.find((b: { id: string }) => b.id === first).status).toBe('locked');
    await accept('subcontractor', second.body.baseline.id);
    list = (await (await as('owner')).get(`/api/projects/${w.home.id}/surface-baselines`)).body.baselines;
    expect(list.find((b: { id: string }) => b.id === first)).toMatchObject({ status: 'replaced' });
    expect(list.find((b: { id: string }) => b.id === second.body.baseline.id)).toMatchObject({ status: 'locked' });
    expect(await auditActions(t.database.db, second.body.baseline.id)).toEqual([
      'surface_baseline.replacement_recorded',
      'surface_baseline.accepted',
      'surface_baseline.replaced',
    ]);
  });
});

describe('outsiders and other projects', () => {
  it('answers 404 to a person of another project for every baseline route', async () => {
    const id = (await record('subcontractor', ground(), { area: 'Hidden' })).body.baseline.id as string;
    const outsider = await as('outsider');
    expect((await outsider.get(`/api/projects/${w.home.id}/surface-baselines`)).status).toBe(404);
    expect((await record('outsider', ground(), { area: 'x' })).status).toBe(404);
    expect((await outsider.post(`/api/surface-baselines/${id}/accept`).send({})).status).toBe(404);
    expect((await outsider.get(`/api/surface-baselines/${id}/download`)).status).toBe(404);
    expect((await outsider.get('/api/surface-baselines/not-a-uuid/download')).status).toBe(404);
  });

  it('a baseline of the home project is not one of the foreign project (a tally there cannot name it)', async () => {
    const id = (await record('subcontractor', ground(), { area: 'Home only' })).body.baseline.id as string;
    const list = await (await as('outsider')).get(`/api/projects/${w.foreign.id}/surface-baselines`);
    expect(list.status).toBe(200);
    expect(list.body.baselines.map((b: { id: string }) => b.id)).not.toContain(id);
  });
});

describe('surface tallies measure against the locked baseline', () => {
  it('takes the existing survey from the locked baseline, whatever the client sent, and says so in the trail', async () => {
    const item = await makeBidItem(t.database.db, w.home.id, { payUnit: 'CY', basis: 'bank', method: 'surface' });
    const design = [
      [0, 0, 99],
      [100, 0, 99],
      [100, 100, 99],
      [0, 100, 99],
    ];
    const wrongExisting = design.map(([x, y]) => [x, y, 500]);
    const sub = await as('subcontractor');
    const tally = (inputs: Record<string, unknown>) =>
      sub.post(`/api/projects/${w.home.id}/tallies`).send({
        bidItemId: item.id,
        measuredOn: '2026-10-20',
        method: 'surface',
        component: 'cut',
        inputs: { unit: 'ft', existing: wrongExisting, design, ...inputs },
      });
    // Some baseline of this project is locked by now (the tests above): a surface tally must name one.
    const missing = await tally({});
    expect([missing.status, missing.body.error.code]).toEqual([400, 'BASELINE_REQUIRED']);
    const open = (await record('subcontractor', ground(), { area: 'Tally area' })).body.baseline.id as string;
    expect((await tally({ baselineId: open })).body.error.code).toBe('BASELINE_REQUIRED');
    await accept('subcontractor', open);
    await accept('general_contractor', open);
    const res = await tally({ baselineId: open });
    expect(res.status).toBe(201);
    // Existing 30.48 m = 100 ft over a 100 x 100 ft square, design at 99 ft: 10,000 cu ft = 370.370... CY of cut
    // (27 cu ft to the CY), hand computation.
    expect(res.body.tally.result.engine.cut).toBeCloseTo(10_000 / 27, 6);
    expect(res.body.tally.result.trail[0]).toMatch(
      /locked original ground "original-ground.xml" \(Tally area\), SHA-256 [0-9a-f]{64}/,
    );
    const stored = (await sub.get(`/api/tallies/${res.body.tally.id}`)).body.tally.inputs;
    expect(stored.baselineId).toBe(open);
    expect(stored.existing[0][2]).toBeCloseTo(100, 9);
    // Faces or breaklines sent for the existing survey cannot reshape the locked surface: a single face over a
    // quarter of the square, or a breakline ridge 1,000 ft high, would change the cut; the answer is the same.
    const bent = await tally({
      baselineId: open,
      existingFaces: [[0, 1, 2]],
      existingBreaklines: [
        [
          [0, 50, 1000],
          [100, 50, 1000],
        ],
      ],
    });
    expect(bent.status).toBe(201);
    expect(bent.body.tally.result.engine.cut).toBeCloseTo(10_000 / 27, 6);
    const bentStored = (await sub.get(`/api/tallies/${bent.body.tally.id}`)).body.tally.inputs;
    // What is stored is what was measured: the baseline's own two faces, not the one sent.
    expect(bentStored.existingFaces).toEqual([
      [0, 1, 2],
      [0, 2, 3],
    ]);
    expect(bentStored.existingBreaklines).toBeUndefined();
  });
});

describe('point files and faces as original ground', () => {
  async function recordFile(bytes: string, fileName: string, fields: Record<string, string>) {
    let req = (await as('subcontractor')).post(`/api/projects/${w.home.id}/surface-baselines`);
    for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
    return req.attach('file', Buffer.from(bytes), fileName);
  }
  const square = '1,0,0,100,EG\n2,0,100,100,EG\n3,100,100,100,EG\n4,100,0,100,EG';

  it('records a point file in the order its header names, in the unit the recorder gives (a point file has none)', async () => {
    const text = `Point,Easting,Northing,Elevation,Description\n${square}`;
    const noUnit = await recordFile(text, 'points.csv', { area: 'Points A' });
    expect([noUnit.status, noUnit.body.error.code]).toEqual([400, 'BASELINE_UNITS_REQUIRED']);
    const res = await recordFile(text, 'points.csv', { area: 'Points A', unit: 'ft' });
    expect(res.status).toBe(201);
    expect(res.body.baseline).toMatchObject({ pointCount: 4, pointOrder: 'PENZD', linearUnit: 'foot' });
    const file = await (await as('subcontractor')).get(res.body.baseline.downloadUrl);
    expect(file.headers['content-type']).toMatch(/^text\/csv/);
  });

  it('asks the column order of a point file without a header, and refuses NaN, infinite values and two heights at one plan point, naming the line', async () => {
    const asked = await recordFile(square, 'points.csv', { area: 'Points B', unit: 'ft' });
    expect([asked.status, asked.body.error.code, asked.body.error.details[0].path]).toEqual([
      400,
      'BASELINE_ORDER_REQUIRED',
      'order',
    ]);
    const told = await recordFile(square, 'points.csv', { area: 'Points B', unit: 'ft', order: 'PNEZD' });
    expect([told.status, told.body.baseline.pointOrder]).toEqual([201, 'PNEZD']);
    const before = (await t.database.db.select().from(auditEvents)).length;
    const nan = await recordFile(`${square}\n5,50,NaN,100,EG`, 'points.csv', {
      area: 'Points C',
      unit: 'ft',
      order: 'PNEZD',
    });
    expect(nan.status).toBe(400);
    expect(nan.body.error.details[0].message).toBe(
      'Line 5, easting: "NaN" is not a finite number (NaN and infinite values are refused)',
    );
    const inf = await recordFile(`${square}\n5,50,1e400,100,EG`, 'points.csv', {
      area: 'Points C',
      unit: 'ft',
      order: 'PNEZD',
    });
    expect(inf.body.error.details[0].message).toContain('Line 5, easting: "1e400" is not a finite number');
    const twice = await recordFile(`${square}\n5,100,100,101,EG`, 'points.csv', {
      area: 'Points C',
      unit: 'ft',
      order: 'PNEZD',
    });
    expect(twice.body.error.details[0].message).toBe(
      'Line 5, elevation: Point 5 has the plan position of point 3 (line 3) with another elevation (101 against 100)',
    );
    expect((await t.database.db.select().from(auditEvents)).length).toBe(before);
  });

  it('reads a point file over 1 MB in the compute pool: the same refusals by line, and the points as sent', async () => {
    // 220 x 220 points 5 ft apart (about 1.1 MB), PNEZD with a header: northing = row, easting = column.
    const rows: string[] = ['P,N,E,Z,D'];
    for (let i = 0; i < 220; i++)
      for (let j = 0; j < 220; j++) rows.push(`${i * 220 + j + 1},${5 * i},${5 * j},${100 + i / 100},EG`);
    const text = rows.join('\n');
    expect(text.length).toBeGreaterThan(1024 * 1024);
    const bad = `${text}\n48401,5,abc,100,EG`;
    const refused = await recordFile(bad, 'dense-points.csv', { area: 'Dense points', unit: 'ft' });
    expect([refused.status, refused.body.error.code]).toEqual([400, 'BASELINE_FILE_INVALID']);
    expect(refused.body.error.details).toEqual([
      { path: 'file', message: 'Line 48402, easting: "abc" is not a number' },
    ]);
    const res = await recordFile(text, 'dense-points.csv', { area: 'Dense points', unit: 'ft' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.baseline).toMatchObject({ pointCount: 48_400, pointOrder: 'PNEZD', linearUnit: 'foot' });
    // The packed points were read back whole: the last point is easting 1,095, northing 1,095, elevation 102.19.
    const [row] = await t.database.db
      .select({ points: surfaceBaselines.points })
      .from(surfaceBaselines)
      .where(eq(surfaceBaselines.id, res.body.baseline.id));
    const copy = new Uint8Array(row!.points.byteLength);
    copy.set(row!.points);
    const xyz = new Float64Array(copy.buffer);
    expect(xyz.length).toBe(3 * 48_400);
    expect(Array.from(xyz.slice(-3))).toEqual([1095, 1095, 102.19]);
  }, 60_000);

  it('refuses a LandXML surface whose faces overlap in plan without sharing an edge, naming the faces and the surface', async () => {
    // Faces 1-2-3 and 1-3-4 cover the square; a third face over points 2, 4 and the centre lies across both.
    const folded = ground(30.48)
      .toString()
      .replace('</Pnts>', '<P id="5">40 70 30.48</P></Pnts>')
      .replace('<F>1 3 4</F>', '<F>1 3 4</F><F>2 4 5</F>');
    const before = (await t.database.db.select().from(auditEvents)).length;
    const res = await recordFile(folded, 'folded.xml', { area: 'Folded' });
    expect([res.status, res.body.error.code]).toEqual([400, 'BASELINE_FILE_INVALID']);
    expect(res.body.error.message).toBe(
      'folded.xml, surface "Original ground": Faces 1 and 3 overlap in plan without sharing an edge: the surface would have two heights there',
    );
    expect((await t.database.db.select().from(auditEvents)).length).toBe(before);
  });

  it('checks a large face set off the request thread (compute pool) and refuses one overlapping face by name', async () => {
    // 110 x 110 points 1 ft apart, two faces a square (23,762 faces, above the inline limit of 20,000), and one
    // more face over points two apart in the middle rows, sharing no edge with the rest.
    const n = 110;
    const pts: string[] = [];
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) pts.push(`<P id="${i * n + j + 1}">${i} ${j} 30</P>`);
    const faces: string[] = [];
    for (let i = 0; i + 1 < n; i++)
      for (let j = 0; j + 1 < n; j++) {
        const a = i * n + j + 1;
        faces.push(`<F>${a} ${a + 1} ${a + n + 1}</F><F>${a} ${a + n + 1} ${a + n}</F>`);
      }
    const mid = 55 * n + 55 + 1;
    const file = (extra: string) =>
      `<?xml version="1.0"?><LandXML xmlns="http://www.landxml.org/schema/LandXML-1.2" version="1.2"><Units><Metric linearUnit="meter"/></Units><Surfaces><Surface name="Dense ground"><Definition surfType="TIN"><Pnts>${pts.join('')}</Pnts><Faces>${faces.join('')}${extra}</Faces></Definition></Surface></Surfaces></LandXML>`;
    const res = await recordFile(file(`<F>${mid} ${mid + 2} ${mid + 2 * n + 1}</F>`), 'dense.xml', { area: 'Dense' });
    expect([res.status, res.body.error.code]).toEqual([400, 'BASELINE_FILE_INVALID']);
    expect(res.body.error.message).toMatch(
      new RegExp(`^dense\\.xml, surface "Dense ground": Faces \\d+ and ${faces.length * 2 + 1} overlap in plan`),
    );
    const fine = await recordFile(file(''), 'dense.xml', { area: 'Dense' });
    expect([fine.status, fine.body.baseline.pointCount]).toEqual([201, n * n]);
  }, 60_000);

  it("a locked LandXML baseline with faces is measured on its faces as given (one face: half the square's cut)", async () => {
    const item = await makeBidItem(t.database.db, w.home.id, { payUnit: 'CY', basis: 'bank', method: 'surface' });
    // One face over the square's corners 1, 2, 3: a right triangle of 5,000 sq ft at 100 ft, design at 99 ft:
    // 5,000 cu ft (hand computation); Delaunay of the four points would cover the whole square (10,000 cu ft).
    const oneFace = ground(30.48).toString().replace('<F>1 2 3</F><F>1 3 4</F>', '<F>1 2 3</F>');
    const id = (await recordFile(oneFace, 'one-face.xml', { area: 'Faces' })).body.baseline.id as string;
    await accept('subcontractor', id);
    await accept('general_contractor', id);
    const design = [
      [0, 0, 99],
      [100, 0, 99],
      [100, 100, 99],
      [0, 100, 99],
    ];
    const res = await (await as('subcontractor')).post(`/api/projects/${w.home.id}/tallies`).send({
      bidItemId: item.id,
      measuredOn: '2026-10-21',
      method: 'surface',
      component: 'cut',
      inputs: { unit: 'ft', existing: design, design, baselineId: id },
    });
    expect(res.status).toBe(201);
    expect(res.body.tally.result.engine.cut).toBeCloseTo(5_000 / 27, 6);
    expect(res.body.tally.result.engine.footprintArea).toBeCloseTo(5_000, 6);
  });
});
