import { PDFParse } from 'pdf-parse';
import Papa from 'papaparse';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { projects } from '../../server/db/schema';
import { makeBidItem, makeWorld } from '../setup/factories';
import { makeBillableProject } from '../setup/pay-cycle-factories';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
let app: {
  id: string;
  number: number;
  earnedToDateCents: number;
  retainageCents: number;
  currentDueCents: number;
  lines: { itemNumber: string; amountToDateCents: number }[];
};
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
  await t.database.db
    .update(projects)
    .set({ name: 'Millbrook Commons', contractNumber: 'MB-2026-07' })
    .where(eq(projects.id, w.home.id));
  await makeBillableProject(t.database.db, w.home.id, w.people.subcontractor.id, (o) =>
    makeBidItem(t.database.db, w.home.id, o),
  );
  // A description that a spreadsheet would read as a formula
  await makeBidItem(t.database.db, w.home.id, {
    itemNumber: 'C-3',
    description: '=HYPERLINK("http://x.test","click")',
    unitPriceCents: 100,
    contractQuantity: 10,
  });
  const sub = await signedInAgent(t.app, w.people.subcontractor.email);
  app = (
    await sub.post(`/api/projects/${w.home.id}/pay-apps`).send({ periodStart: '2026-10-01', periodEnd: '2026-10-31' })
  ).body.payApp;
});
afterAll(() => t.close());

const as = (email: string) => signedInAgent(t.app, email);
const dollars = (cents: number) => `$${(cents / 100).toLocaleString('en-US', { minimumFractionDigits: 2 })}`;

describe('pay application exports', () => {
  it('exports a PDF named for the project and period whose totals match the API (text read back with pdf-parse)', async () => {
    const res = await (
      await as(w.people.general_contractor.email)
    )
      .get(`/api/pay-apps/${app.id}/export.pdf`)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toContain('filename="millbrook-commons-pay-app-01-2026-10.pdf"');
    const parser = new PDFParse({ data: new Uint8Array(res.body as Buffer) });
    const { text } = await parser.getText();
    await parser.destroy();
    const flat = text.replace(/\s+/g, ' ');
    expect(flat).toContain('Pay application No. 1');
    expect(flat).toContain('Millbrook Commons');
    expect(flat).toContain('Period 2026-10-01 to 2026-10-31');
    // $7,962.53 earned, $796.25 retainage, $7,166.28 due: the same numbers as GET /api/pay-apps/:id
    expect(flat).toContain(`Work done and materials stored to date ${dollars(app.earnedToDateCents)}`);
    expect(flat).toContain(`Less retainage held (10 %) ${dollars(app.retainageCents)}`);
    expect(flat).toContain(`Due on this application ${dollars(app.currentDueCents)}`);
    expect(flat).toContain(dollars(app.lines.find((l) => l.itemNumber === 'B-2')!.amountToDateCents));
    expect(flat).toMatch(/Subcontractor .*General contractor .*Owner/);
    expect(app.currentDueCents).toBe(716628);
  });

  it('embeds Work Sans in the PDF', async () => {
    const res = await (
      await as(w.people.subcontractor.email)
    )
      .get(`/api/pay-apps/${app.id}/export.pdf`)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect((res.body as Buffer).toString('latin1')).toMatch(/\/FontName \/[A-Z]{6}\+WorkSans/);
  });

  it('exports CSV: one row per line plus totals, formula-like cells neutralised, totals equal the API', async () => {
    const res = await (await as(w.people.subcontractor.email)).get(`/api/pay-apps/${app.id}/export.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-disposition']).toContain('filename="millbrook-commons-pay-app-01-2026-10.csv"');
    const rows = Papa.parse<Record<string, string>>(res.text, { header: true, skipEmptyLines: true }).data;
    expect(rows.slice(0, 3).map((r) => r.item_number)).toEqual(['A-1', 'B-2', 'C-3']);
    expect(rows[2]!.description).toBe(`'=HYPERLINK("http://x.test","click")`);
    const total = rows.find((r) => r.item_number === 'TOTAL')!;
    expect(total.amount_to_date).toBe('7962.53');
    expect(total.retainage).toBe('796.25');
    expect(rows.find((r) => r.item_number === 'SUMMARY_CURRENT_DUE')!.amount_to_date).toBe('7166.28');
    const lineSum = rows.slice(0, 3).reduce((s, r) => s + Math.round(Number(r.amount_to_date) * 100), 0);
    expect(lineSum).toBe(app.earnedToDateCents);
  });

  it('authorizes exports like the application: 404 for an outsider and for the owner before certification', async () => {
    for (const email of [w.outsider.email, w.people.owner.email]) {
      expect((await (await as(email)).get(`/api/pay-apps/${app.id}/export.pdf`)).status).toBe(404);
      expect((await (await as(email)).get(`/api/pay-apps/${app.id}/export.csv`)).status).toBe(404);
    }
  });
});
