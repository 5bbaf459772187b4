import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { count, eq } from 'drizzle-orm';
import Papa from 'papaparse';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MAX_CSV_UPLOAD_BYTES, MAX_EVIDENCE_BYTES, MAX_EVIDENCE_FILES_PER_TALLY } from '../../src/shared/constants';
import { auditEvents, bidItems, tallyEvidence } from '../../server/db/schema';
import { localStorage } from '../../server/integrations/storage/storage';
import { neutralise } from '../../server/modules/pay-apps/pay-app-csv';
import { makeBidItem, makeWorld } from '../setup/factories';
import { expectErrorShape } from '../setup/hostile-json';
import { elfHeader, filesUnder, gzipBomb, tinyPng, zipBomb } from '../setup/hostile-files';
import { FILES, makeTally } from '../setup/pay-cycle-factories';
import { registeredRoutes } from '../setup/routes';
import { createTestApp, signedInAgent, TEST_ORIGIN, type TestApp } from '../setup/test-app';

// Hostile files at the upload routes. Sources: OWASP File Upload Cheat Sheet (size limits, content checked by its
// signature and not by its name or declared type, generated storage names, sanitised display names); OWASP ASVS
// 4.0.3 12.1.1 (size), 12.1.2 (compressed files checked before expansion), 12.2.1 (content matches the type),
// 12.3.1 and 12.3.2 (no path or name from the user reaches the file system); OWASP API Security Top 10 (2023) API4;
// OWASP "CSV Injection" (cells starting = + - @ tab CR are neutralised); RFC 3629 section 3 (well-formed UTF-8)
// and Unicode 15 section 23.8 (byte-order marks); Microsoft "Naming Files, Paths, and Namespaces" (device names).

/**
 * The routes that take a multipart form; every other route refuses one (415, server/middleware/json-bodies-only.ts).
 * POST /api/calc/surface (of `POST /api/calc/:method`) also takes one: its cases are at the end of this file.
 */
const UPLOAD_ROUTES = [
  'POST /api/tallies/:tallyId/evidence',
  'POST /api/change-orders/:id/documents',
  'POST /api/projects/:projectId/bid-items/import',
  // A tally with its worksheet files in one request (tally-revisions.test.ts).
  'POST /api/projects/:projectId/tallies',
  'PATCH /api/tallies/:tallyId',
  // A surveyed baseline surface (LandXML) of the project.
  'POST /api/projects/:projectId/surface-baselines',
];
const HEADER = 'item_number,description,pay_unit,basis,unit_price,contract_quantity,major,method';

let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
let parent: string;
let root: string;
let sub: ReturnType<typeof request.agent>;
let gc: ReturnType<typeof request.agent>;

beforeAll(async () => {
  parent = mkdtempSync(path.join(tmpdir(), 'tallyard-uploads-'));
  root = path.join(parent, 'uploads');
  t = await createTestApp({ storage: localStorage(root) });
  w = await makeWorld(t.database.db, t.auth);
  sub = await signedInAgent(t.app, w.people.subcontractor.email);
  gc = await signedInAgent(t.app, w.people.general_contractor.email);
});
afterAll(async () => {
  await t.close();
  rmSync(parent, { recursive: true, force: true });
});

const draftTally = async () => {
  const item = await makeBidItem(t.database.db, w.home.id);
  return makeTally(t.database.db, {
    projectId: w.home.id,
    bidItemId: item.id,
    authorUserId: w.people.subcontractor.id,
    measuredOn: '2026-10-05',
    quantity: 10,
    status: 'draft',
  });
};

type File = [bytes: Buffer, name: string, contentType?: string];
const evidence = (tallyId: string, ...files: File[]) => {
  let req = sub.post(`/api/tallies/${tallyId}/evidence`);
  for (const [bytes, filename, contentType] of files)
    req = req.attach('files', bytes, contentType ? { filename, contentType } : filename);
  return req;
};
const importCsv = (bytes: Buffer | string, filename = 'schedule.csv', contentType = 'text/csv') =>
  gc
    .post(`/api/projects/${w.home.id}/bid-items/import`)
    .attach('file', Buffer.isBuffer(bytes) ? bytes : Buffer.from(bytes), { filename, contentType });

async function saved() {
  const db = t.database.db;
  const [e] = await db.select({ n: count() }).from(tallyEvidence);
  const [a] = await db.select({ n: count() }).from(auditEvents);
  const [b] = await db.select({ n: count() }).from(bidItems);
  return { evidence: e!.n, audit: a!.n, bidItems: b!.n, files: filesUnder(parent) };
}

/** The answer is a refusal in the error shape, and nothing was saved: no row, no audit event, no file anywhere. */
async function expectRefused(send: () => Promise<request.Response>, status: number, code: string, message?: RegExp) {
  const before = await saved();
  const res = await send();
  const context = `${status} ${code}: ${JSON.stringify(res.body).slice(0, 300)}`;
  expect(res.status, context).toBe(status);
  expectErrorShape(res, context);
  expect(res.body.error.code, context).toBe(code);
  if (message) expect(JSON.stringify(res.body.error), context).toMatch(message);
  expect(await saved(), context).toEqual(before);
  return res;
}

describe('the upload routes', () => {
  it('are exactly the evidence and change order document uploads, the bid schedule import, a tally with its files and a baseline surface: every other route refuses a multipart form with 415', async () => {
    const routes = registeredRoutes(t.app).filter(
      (r) => /^(POST|PUT|PATCH) /.test(r) && r !== 'POST /api/webhooks/stripe',
    );
    for (const route of routes.filter((r) => !UPLOAD_ROUTES.includes(r))) {
      const [method, template] = route.split(' ') as [string, string];
      const target = template.replace(/:(\w+)/g, () => w.home.id);
      const agent = sub as unknown as Record<string, (p: string) => request.Test>;
      const res = await agent[method.toLowerCase()]!(target)
        .set('Origin', TEST_ORIGIN)
        .attach('file', FILES.csv, 'a.csv');
      expect(res.status, route).toBe(415);
      expectErrorShape(res, route);
    }
    for (const route of UPLOAD_ROUTES) expect(registeredRoutes(t.app), route).toContain(route);
  });
});

describe('oversized uploads (OWASP ASVS 4.0.3 12.1.1, API4:2023)', () => {
  it('refuses evidence over MAX_EVIDENCE_BYTES with 413, even after a good file in the same upload', async () => {
    const tally = await draftTally();
    const huge = Buffer.alloc(MAX_EVIDENCE_BYTES + 1, 0x41);
    await expectRefused(() => evidence(tally.id, [huge, 'survey.csv']), 413, 'UPLOAD_FILE_SIZE');
    await expectRefused(() => evidence(tally.id, [FILES.pdf, 'ok.pdf'], [huge, 'big.pdf']), 413, 'UPLOAD_FILE_SIZE');
  });

  it('refuses a bid schedule over MAX_CSV_UPLOAD_BYTES with 413', async () => {
    await expectRefused(
      () => importCsv(`${HEADER}\n${'A,'.repeat(MAX_CSV_UPLOAD_BYTES / 2 + 1)}`),
      413,
      'UPLOAD_FILE_SIZE',
    );
  });

  it(`refuses more than ${MAX_EVIDENCE_FILES_PER_TALLY} files in one upload, a second file to the import, and a cut-off form`, async () => {
    const tally = await draftTally();
    const many: File[] = Array.from({ length: MAX_EVIDENCE_FILES_PER_TALLY + 1 }, (_, i) => [FILES.csv, `s${i}.csv`]);
    await expectRefused(() => evidence(tally.id, ...many), 400, 'UPLOAD_FILE_COUNT');
    await expectRefused(() => importCsv(FILES.csv).attach('file', FILES.csv, 'second.csv'), 400, 'UPLOAD_FILE_COUNT');
    const cut = `--x\r\nContent-Disposition: form-data; name="files"; filename="a.csv"\r\nContent-Type: text/csv\r\n\r\nstation,cut`;
    await expectRefused(
      () =>
        sub.post(`/api/tallies/${tally.id}/evidence`).set('Content-Type', 'multipart/form-data; boundary=x').send(cut),
      400,
      'UPLOAD_MALFORMED',
    );
  });
});

describe('a wrong type behind a right extension (content checked by its magic bytes, ASVS 12.2.1)', () => {
  const disguised: [what: string, file: File, names: RegExp][] = [
    ['a PNG named .pdf', [tinyPng(), 'ticket.pdf'], /%PDF-/],
    ['an ELF executable named .pdf', [elfHeader(), 'ticket.pdf'], /%PDF-/],
    ['a JPEG named .png', [FILES.jpeg, 'photo.png'], /PNG signature/],
    ['a PNG named .jpg', [tinyPng(), 'photo.jpg'], /JPEG signature/],
    ['a PNG named .csv', [tinyPng(), 'survey.csv'], /image\/png/],
    ['an ELF executable named .csv', [elfHeader(), 'survey.csv'], /x-elf/],
    ['a text-only PDF named .csv', [FILES.pdf, 'survey.csv'], /application\/pdf/],
    ['a PNG named .xml', [tinyPng(), 'surface.xml'], /not UTF-8/],
    ['HTML named .xml', [Buffer.from('<html><script>alert(1)</script></html>'), 'surface.xml'], /LandXML/],
  ];

  it.each(disguised)('refuses %s as evidence, naming the file, and saves nothing', async (_what, file, names) => {
    const tally = await draftTally();
    const res = await expectRefused(
      () => evidence(tally.id, [FILES.csv, 'good.csv'], file),
      400,
      'EVIDENCE_REJECTED',
      names,
    );
    expect(res.body.error.details).toEqual([
      { path: 'files.1', message: expect.stringContaining(file[1].split('.')[0]!) },
    ]);
  });

  it.each([
    ['a PNG', tinyPng(), /image\/png/],
    ['an ELF executable', elfHeader(), /x-elf/],
    ['a PDF', FILES.pdf, /application\/pdf/],
    [
      'a Windows executable',
      Buffer.concat([Buffer.from('MZ'), Buffer.alloc(62, 0), Buffer.from('PE\0\0')]),
      /x-msdownload/,
    ],
  ])(
    'refuses %s named schedule.csv at the import with 400 UPLOAD_NOT_CSV naming its real type',
    async (_what, bytes, names) => {
      await expectRefused(() => importCsv(bytes), 400, 'UPLOAD_NOT_CSV', names);
    },
  );
});

describe('compressed files renamed .csv (ASVS 12.1.2: refused before anything expands them)', () => {
  const bomb = zipBomb(200 * 1024 * 1024); // about 200 kB of zip that inflates to 200 MB
  it('refuses a zip bomb named .csv at both routes, naming the zip, within the upload limits', async () => {
    expect(bomb.length).toBeLessThan(MAX_CSV_UPLOAD_BYTES);
    await expectRefused(() => importCsv(bomb), 400, 'UPLOAD_NOT_CSV', /application\/zip/);
    const tally = await draftTally();
    await expectRefused(() => evidence(tally.id, [bomb, 'tickets.csv']), 400, 'EVIDENCE_REJECTED', /application\/zip/);
  });

  it('refuses a gzip stream named .csv', async () => {
    await expectRefused(() => importCsv(gzipBomb(50 * 1024 * 1024)), 400, 'UPLOAD_NOT_CSV', /application\/gzip/);
  });
});

describe('CSV encodings (RFC 3629 well-formed UTF-8; Unicode 15 section 23.8 byte-order marks)', () => {
  const schedule = `${HEADER}\nE-1,Déblai ordinaire,CY,bank,6.85,100,no,end-area\n`;
  const utf16le = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(schedule, 'utf16le')]);
  const utf16be = Buffer.from(utf16le.subarray(2)).swap16();
  const bad: [what: string, bytes: Buffer, names: RegExp][] = [
    ['UTF-16LE with its byte-order mark', utf16le, /UTF-16 text \(byte-order mark FFFE\)/],
    [
      'UTF-16BE with its byte-order mark',
      Buffer.concat([Buffer.from([0xfe, 0xff]), utf16be]),
      /UTF-16 text \(byte-order mark FEFF\)/,
    ],
    ['UTF-16LE without a byte-order mark', Buffer.from(schedule, 'utf16le'), /looks like UTF-16/],
    ['Windows-1252 (é as byte E9) on line 2', Buffer.from(schedule, 'latin1'), /byte 0xE9 on line 2/],
    [
      'an overlong encoding of "/" (C0 AF)',
      Buffer.concat([
        Buffer.from(`${HEADER}\nE-1,a`),
        Buffer.from([0xc0, 0xaf]),
        Buffer.from(',CY,bank,1,1,no,grid\n'),
      ]),
      /byte 0xC0 on line 2/,
    ],
    [
      'an encoded surrogate (ED A0 80, CESU-8)',
      Buffer.concat([
        Buffer.from(`${HEADER}\n\nE-1,a`),
        Buffer.from([0xed, 0xa0, 0x80]),
        Buffer.from(',CY,bank,1,1,no,grid\n'),
      ]),
      /byte 0xED on line 3/,
    ],
  ];

  it.each(bad)('refuses %s at the import, naming the encoding problem', async (_what, bytes, names) => {
    await expectRefused(() => importCsv(bytes), 400, 'UPLOAD_NOT_CSV', names);
  });

  it.each(bad)('refuses %s as evidence', async (_what, bytes, names) => {
    const tally = await draftTally();
    await expectRefused(() => evidence(tally.id, [bytes, 'survey.csv']), 400, 'EVIDENCE_REJECTED', names);
  });

  it('imports UTF-8 with a byte-order mark, the text intact', async () => {
    const res = await importCsv(
      Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(schedule.replace('E-1', 'BOM-1'))]),
    );
    expect(res.status).toBe(201);
    expect(res.body.bidItems[0]).toMatchObject({ itemNumber: 'BOM-1', description: 'Déblai ordinaire' });
  });
});

describe('formula injection (OWASP "CSV Injection"): stored as written, neutralised on the pay application CSV export', () => {
  const attacks = [
    '=HYPERLINK("http://x.test","pay here")',
    "+1+cmd|' /C calc'!A0",
    "-2+3+cmd|' /C calc'!A0",
    "@SUM(1+1)*cmd|' /C calc'!A0",
    '=1+1',
  ];

  it('keeps each cell as text on import and prefixes an apostrophe in the export', async () => {
    const rows = attacks.map((a, i) => `INJ-${i},"${a.replace(/"/g, '""')}",CY,bank,2.50,100,no,manual`);
    const imported = await importCsv([HEADER, ...rows].join('\r\n'));
    expect(imported.status).toBe(201);
    expect(imported.body.bidItems.map((b: { description: string }) => b.description)).toEqual(attacks);
    for (const item of imported.body.bidItems as { id: string }[]) {
      await makeTally(t.database.db, {
        projectId: w.home.id,
        bidItemId: item.id,
        authorUserId: w.people.subcontractor.id,
        measuredOn: '2026-10-12',
        quantity: 12.5,
      });
    }
    const created = await sub
      .post(`/api/projects/${w.home.id}/pay-apps`)
      .send({ periodStart: '2026-10-01', periodEnd: '2026-10-31' });
    expect(created.status).toBe(201);
    const csv = await sub.get(`/api/pay-apps/${created.body.payApp.id}/export.csv`);
    expect(csv.status).toBe(200);
    const parsed = Papa.parse<string[]>(csv.text, { skipEmptyLines: true }).data;
    for (const cell of parsed.flat()) {
      // A number we wrote (plain decimal, maybe negative) is a number cell; any other cell never starts a formula.
      if (!/^-?\d+(\.\d+)?$/.test(cell)) expect(cell, cell).not.toMatch(/^[=+\-@\t\r]/);
    }
    const descriptions = parsed.filter((r) => r[0]?.startsWith('INJ-')).map((r) => r[1]);
    expect(descriptions).toEqual(attacks.map((a) => `'${a}`));
  });

  it('neutralises a leading tab or carriage return too (they cannot reach a trimmed description)', () => {
    expect(['\t=1+1', '\r=1+1', '=x', '+x', '-x', '@x'].map(neutralise)).toEqual([
      "'\t=1+1",
      "'\r=1+1",
      "'=x",
      "'+x",
      "'-x",
      "'@x",
    ]);
    expect(neutralise('Excavation')).toBe('Excavation');
  });
});

describe('path tricks in file names (ASVS 12.3.1, 12.3.2)', () => {
  const names = [
    '../../etc/passwd.csv',
    '..\\..\\windows\\win.ini.csv',
    '/etc/passwd.csv',
    'C:\\Windows\\System32\\drivers.csv',
    '....//....//x.csv',
    '%2e%2e%2fpasswd.csv',
    'CON.csv',
    'nul.csv',
    'LPT1.csv',
    'com1.tar.csv',
    'AUX.CSV',
    `${'x'.repeat(500)}.csv`,
    '.htaccess.csv',
    'invoice\u202Evsc.csv',
    'a"b;c.csv',
    '. .report.csv',
    'ü\u0308ber.csv',
  ];
  const RESERVED = /^(con|prn|aux|nul|com\d|lpt\d)$/i;

  it('stores each upload under a generated key inside the storage root, and shows and downloads a sanitised name', async () => {
    const tally = await draftTally();
    const before = filesUnder(parent);
    const res = await evidence(tally.id, ...names.map((n): File => [FILES.csv, n, 'text/csv']));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const shown = (res.body.evidence as { id: string; fileName: string }[]).map((e) => e.fileName);
    expect(shown).toHaveLength(names.length);
    for (const name of shown) {
      expect(name, name).toMatch(/^[\w][\w.\- ]*$/);
      expect(name.length, name).toBeLessThanOrEqual(125);
      expect(RESERVED.test(name.split('.')[0]!), name).toBe(false);
      expect(name, name).not.toMatch(/\.\.|[. ]$/);
    }
    const rows = await t.database.db.select().from(tallyEvidence).where(eq(tallyEvidence.tallyId, tally.id));
    for (const row of rows) {
      expect(row.storageKey).toMatch(/^evidence\/[0-9a-f-]{36}$/);
      expect(readFileSync(path.join(root, row.storageKey)).equals(FILES.csv)).toBe(true);
      const dl = await sub.get(`/api/evidence/${row.id}/download`);
      expect(dl.status).toBe(200);
      expect(dl.headers['content-disposition']).toMatch(
        /^attachment; filename="[\w.\- ]+"; filename\*=UTF-8''[\w.\-%]+$/,
      );
    }
    const added = filesUnder(parent).filter((f) => !before.includes(f));
    expect(added.sort()).toEqual(rows.map((r) => path.join('uploads', r.storageKey)).sort());
  });

  it('refuses a part header with a NUL or a line break in the file name as a malformed form, saving nothing', async () => {
    const tally = await draftTally();
    for (const name of ['a\u0000b.csv', 'a.csv"\r\nContent-Type: text/html\r\nX: "']) {
      const form = `--x\r\nContent-Disposition: form-data; name="files"; filename="${name}"\r\nContent-Type: text/csv\r\n\r\n${FILES.csv.toString()}\r\n--x--\r\n`;
      const send = () =>
        sub.post(`/api/tallies/${tally.id}/evidence`).set('Content-Type', 'multipart/form-data; boundary=x').send(form);
      const before = await saved();
      const res = await send();
      // busboy refuses the header (400 UPLOAD_MALFORMED), or reads a name that is then sanitised like any other.
      if (res.status === 201) expect(res.body.evidence[0].fileName).toMatch(/^[\w][\w.\- ]*$/);
      else {
        expect(res.status, JSON.stringify(res.body)).toBe(400);
        expectErrorShape(res, name);
        expect(await saved()).toEqual(before);
      }
    }
  });
});

describe('the survey upload of POST /api/calc/surface (streamed to a worker; nothing is stored)', () => {
  const points = 'x,y,z\n0,0,1\n10,0,1\n0,10,1\n10,10,2\n';
  const form = (boundary: string, ...parts: string[]) =>
    `${parts.map((p) => `--${boundary}\r\n${p}`).join('\r\n')}\r\n--${boundary}--\r\n`;
  const file = (name: string, body: string | Buffer) =>
    `Content-Disposition: form-data; name="${name}"; filename="${name}.csv"\r\nContent-Type: text/csv\r\n\r\n${body}`;
  const unit = 'Content-Disposition: form-data; name="unit"\r\n\r\nft';
  const send = (body: string | Buffer, boundary = 'x') =>
    sub.post('/api/calc/surface').set('Content-Type', `multipart/form-data; boundary=${boundary}`).send(body);

  it('computes a good form, and refuses a cut-off form, a third file, an unexpected field and a form with no boundary', async () => {
    expect((await send(form('x', unit, file('existing', points), file('design', points)))).status).toBe(200);
    await expectRefused(() => send(`--x\r\n${file('existing', points)}`), 400, 'UPLOAD_MALFORMED');
    await expectRefused(
      () => send(form('x', unit, file('existing', points), file('design', points), file('design', points))),
      400,
      'UPLOAD_PART_COUNT',
    );
    await expectRefused(
      () => send(form('x', unit, file('existing', points), file('other', points))),
      400,
      'UPLOAD_UNEXPECTED_FILE',
    );
    await expectRefused(
      () => sub.post('/api/calc/surface').set('Content-Type', 'multipart/form-data').send(form('x', unit)),
      400,
      'UPLOAD_MALFORMED',
    );
  });

  it('refuses a survey that is not UTF-8 text (UTF-16, a PNG) with the file named, and a gzip bomb with 413', async () => {
    const utf16 = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(points, 'utf16le')]);
    const bin = (b: Buffer) =>
      Buffer.concat([
        Buffer.from(`--x\r\n${unit}\r\n--x\r\n${file('existing', '')}`),
        b,
        Buffer.from(`\r\n--x\r\n${file('design', points)}\r\n--x--\r\n`),
      ]);
    const res = await expectRefused(() => send(bin(utf16)), 400, 'VALIDATION_FAILED');
    expect(res.body.error.details[0].path).toMatch(/^existing/);
    await expectRefused(() => send(bin(tinyPng())), 400, 'VALIDATION_FAILED');
    const bomb = gzipBomb(140 * 1024 * 1024); // past the upload limit of two 64 MB surveys
    const big = await sub
      .post('/api/calc/surface')
      .set('Content-Type', 'multipart/form-data; boundary=x')
      .set('Content-Encoding', 'gzip')
      .send(bomb);
    expect(big.status).toBe(413);
    expectErrorShape(big, 'gzip bomb');
  });
});
