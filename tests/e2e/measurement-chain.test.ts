import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { MEASUREMENT_METHODS, METHOD_BILLING, type MeasurementMethod } from '../../src/shared/constants';
import type { PayAppDetail, PayAppSummary } from '../../src/shared/schemas/pay-app';
import { browserTest, openTab } from './browser';

// Issue 12, the end-to-end proof of the measurement chain, in headless Chromium on the demo job: the subcontractor
// makes a tally from "New tally" through each worksheet whose method bills (METHOD_BILLING), surface to surface
// included from two LandXML files written here, and a direct quantity for the manual method; the bill line is
// checked as typed, in the save dialog and on the saved tally. One draft is reopened and edited (its first save stays
// in its history). The tallies go on a new pay application, which is submitted; the general contractor opens a
// line's backup, a tally read-only in its worksheet with its drawing, and downloads its evidence file.
// The measurements are invented for this test; the expected quantities are worked by hand beside each one.
// Setup that is not the journey (clearing the demo's open application) goes through the API.

const PERIOD = { start: '2026-11-01', end: '2026-11-30' } as const;
const e2e = browserTest({
  shots: '/tmp/shots-e2echain',
  context: { viewport: { width: 1440, height: 1000 }, acceptDownloads: true },
  timeout: 300_000,
});
const { signedIn, api, snap } = e2e;
let projectId = '';

/** A LandXML 1.2 TIN surface (points written northing easting elevation, LandXML 1.2 schema, element P), in feet. */
function landXml(name: string, z: (x: number, y: number) => number): Buffer {
  const pts: string[] = [];
  let id = 1;
  for (let y = 0; y <= 150; y += 30)
    for (let x = 0; x <= 150; x += 30) pts.push(`<P id="${id++}">${y} ${x} ${z(x, y).toFixed(3)}</P>`);
  return Buffer.from(`<?xml version="1.0" encoding="UTF-8"?>
<LandXML xmlns="http://www.landxml.org/schema/LandXML-1.2" version="1.2"><Units><Imperial linearUnit="foot" elevationUnit="foot"/></Units>
<Surfaces><Surface name="${name}"><Definition surfType="TIN"><Pnts>${pts.join('')}</Pnts></Definition></Surface></Surfaces></LandXML>`);
}
const ground = (x: number, y: number) => 100 + 0.01 * x + 0.005 * y;
const BASIN_GROUND = landXml('Lot 7 basin ground', ground);
/** The as-dug surface: 2 ft below the ground everywhere over 150 x 150 ft, so the cut is 150 x 150 x 2 / 27 CY. */
const BASIN_DUG = landXml('Lot 7 basin dug', (x, y) => ground(x, y) - 2);

/**
 * Two cross sections 100 ft apart, each a flat cut 40 ft wide and 4 ft deep: 160 sq ft, so the average end area
 * gives 100 x 160 / 27 = 592.59 CY (average end area method, FHWA FP Section 109 as the worksheet trail cites;
 * the arithmetic is hand-worked).
 */
const SECTIONS_CSV = [
  'station,surface,offset,elevation',
  ...[1000, 1100].flatMap((s) => [
    `${s},ground,-20,100`,
    `${s},ground,20,100`,
    `${s},design,-20,96`,
    `${s},design,20,96`,
  ]),
].join('\n');
/** A 4 x 4 node grid at 25 ft, every node 1 ft deep: 75 x 75 x 1 / 27 = 208.33 CY (borrow-pit method, common practice; hand-worked). */
const GRID_DEPTHS = ['1,1,1,1', '1,1,1,1', '1,1,1,1', '1,1,1,1'].join('\n');
/** Truck tickets: 10 loads of 14 LCY and 5 of 18 LCY = 230 loose CY (swell 25 %: 184 bank CY, Nichols and Day). */
const TICKETS_CSV = ['capacity,loads', '14,10', '18,5'].join('\n');

/** "New tally" on the Tallies tab with the bid item chosen; answers the dialog. */
async function newTallyFor(page: Page, itemNumber: string) {
  await openTab(page, 'Tallies');
  await page.getByRole('button', { name: 'New tally' }).click();
  const dialog = page.getByRole('dialog', { name: 'New tally' });
  const select = dialog.getByLabel('Bid item');
  const value = await select.locator('option', { hasText: new RegExp(`^${itemNumber} `) }).getAttribute('value');
  await select.selectOption(value!);
  return dialog;
}

/** Setup: the demo leaves its last application returned; the next one waits for it, so it is settled here. */
async function settleDemoApplication(sub: Page, gc: Page) {
  const { payApps } = await api<{ payApps: PayAppSummary[] }>(sub, 'GET', `/projects/${projectId}/pay-apps`);
  const open = payApps.find((a) => a.status !== 'certified' && a.status !== 'paid');
  if (!open) return;
  let app = (await api<{ payApp: PayAppDetail }>(sub, 'GET', `/pay-apps/${open.id}`)).payApp;
  if (app.status === 'returned') {
    const lines = app.disputes.filter((d) => d.status === 'open').map((d) => ({ lineId: d.lineId, action: 'accept' }));
    app = (
      await api<{ payApp: PayAppDetail }>(sub, 'POST', `/pay-apps/${app.id}/revise`, {
        expectedRevision: app.revision,
        lines,
      })
    ).payApp;
  }
  if (app.status === 'draft')
    app = (await api<{ payApp: PayAppDetail }>(sub, 'POST', `/pay-apps/${app.id}/submit`, {})).payApp;
  app = (
    await api<{ payApp: PayAppDetail }>(gc, 'POST', `/pay-apps/${app.id}/review`, {
      expectedRevision: app.revision,
      lines: app.lines.map((l) => ({ lineId: l.id, decision: 'approve' })),
    })
  ).payApp;
  await api(gc, 'POST', `/pay-apps/${app.id}/certify`, { acknowledgedFlags: app.flags.map((f) => f.key) });
}

type Made = { itemNumber: string; method: MeasurementMethod; url: string; quantity: string; files: string[] };
const made: Made[] = [];

/**
 * On an open worksheet: the bill line says `bills` as typed, the save dialog repeats it, the saved message links
 * to the tally, whose page shows the same quantity and the files loaded into the worksheet as evidence.
 */
async function saveWorksheet(
  page: Page,
  m: { itemNumber: string; method: MeasurementMethod; bills: string; title: string; day: string; files?: string[] },
) {
  const line = `Bills ${m.bills} to item ${m.itemNumber}`;
  const bar = page.getByRole('region', { name: 'Billing' }).getByTestId('bill-line');
  await expect.poll(() => bar.textContent(), { timeout: 20_000 }).toContain(line);
  await snap(page, `${m.method}-worksheet`);
  await page.getByRole('button', { name: 'Save as tally' }).click();
  const save = page.getByRole('form', { name: 'Save as tally' });
  expect(await save.getByTestId('bill-line').textContent()).toContain(line);
  for (const f of m.files ?? []) await save.getByText(`${f} (stored with the tally and its SHA-256)`).waitFor();
  await save.getByLabel('Measured on').fill(`2026-11-${m.day}`);
  await save.getByLabel('Title').fill(m.title);
  await snap(page, `${m.method}-save-dialog`);
  await save.getByRole('button', { name: 'Save tally' }).click();
  const saved = page.getByText(/Saved as a draft tally/);
  await saved.waitFor();
  expect(await saved.textContent()).toContain(`Saved as a draft tally: ${m.bills} to item ${m.itemNumber}`);
  await saved.getByRole('link', { name: 'Open the tally' }).click();
  await page.waitForURL(/\/tallies\/[\w-]+$/);
  await page.getByRole('heading', { name: m.title }).waitFor();
  await page.getByText(m.bills).first().waitFor();
  for (const f of m.files ?? []) await page.getByText(f, { exact: true }).first().waitFor();
  expect(await page.getByText(/"unit"|spacingX|cornerDepths|\[object Object\]/).count()).toBe(0);
  await snap(page, `${m.method}-tally-page`);
  made.push({ itemNumber: m.itemNumber, method: m.method, url: page.url(), quantity: m.bills, files: m.files ?? [] });
}

async function openWorksheet(page: Page, itemNumber: string, method: MeasurementMethod) {
  const dialog = await newTallyFor(page, itemNumber);
  await dialog.getByRole('link', { name: 'Open the worksheet' }).click();
  await page.waitForURL(new RegExp(`/worksheets\\?method=${method}&item=`));
}

describe('the measurement chain from worksheet to the backup of a pay application line', () => {
  it('a tally from each billing worksheet, one edited, all on a submitted pay application, reviewed from its backup', async () => {
    const sub = await signedIn('sub@tallyard.test');
    const gc = await signedIn('gc@tallyard.test');
    await openTab(sub, 'Tallies');
    await sub.waitForURL(/\/projects\/[\w-]+\/tallies$/);
    projectId = sub.url().match(/\/projects\/([\w-]+)\//)![1]!;
    await settleDemoApplication(sub, gc);

    // 1. A tally through each worksheet whose method bills.
    const billing = MEASUREMENT_METHODS.filter((m) => METHOD_BILLING[m].bills);
    expect(billing).toEqual(['end-area', 'grid', 'pit', 'trench', 'load-count', 'surface', 'manual']);

    await openWorksheet(sub, '203', 'end-area');
    await sub.getByLabel('Upload a file for Cross sections (CSV or LandXML)').setInputFiles({
      name: 'road-b-sections.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from(SECTIONS_CSV),
    });
    await sub.getByText('Attached as evidence when saved: road-b-sections.csv').waitFor();
    await saveWorksheet(sub, {
      itemNumber: '203',
      method: 'end-area',
      bills: '592.59 CY bank',
      title: 'Road B cut, sta 10+00 to 11+00',
      day: '04',
      files: ['road-b-sections.csv'],
    });

    await openWorksheet(sub, '202', 'grid');
    await sub.getByLabel('Node spacing across (x)').fill('25');
    await sub.getByLabel('Node spacing down (y)').fill('25');
    await sub.getByLabel('Upload a file for Node depths (ft), one grid row a line').setInputFiles({
      name: 'lot-7-topsoil-depths.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from(GRID_DEPTHS),
    });
    await saveWorksheet(sub, {
      itemNumber: '202',
      method: 'grid',
      bills: '208.33 CY bank',
      title: 'Topsoil strip, lot 7',
      day: '06',
      files: ['lot-7-topsoil-depths.csv'],
    });

    // Pit: 16 x 12 ft, 5 ft at each corner, vertical sides: 16 x 12 x 5 / 27 = 35.56 CY (prism, common practice).
    await openWorksheet(sub, '207', 'pit');
    await sub.getByLabel('Bottom length').fill('16');
    await sub.getByLabel('Bottom width').fill('12');
    await sub.getByLabel('Side slope').fill('');
    await saveWorksheet(sub, {
      itemNumber: '207',
      method: 'pit',
      bills: '35.56 CY bank',
      title: 'Outlet pit, lot 7',
      day: '09',
    });

    // Trench paid by the foot: 180 + 80 ft of runs = 260.0 LF.
    await openWorksheet(sub, '301', 'trench');
    await sub.getByLabel('Run 1 length').fill('180');
    await saveWorksheet(sub, {
      itemNumber: '301',
      method: 'trench',
      bills: '260.0 LF',
      title: 'Storm line, MH 4 to MH 6',
      day: '10',
    });

    // Item 303 is paid from its truck tickets (field records, its measurement profile): the worksheet says a tally
    // bills it nothing. The same tickets billed to the borrow item: 230 loose CY / 1.25 = 184.0 bank CY.
    await openWorksheet(sub, '303', 'load-count');
    await sub.getByLabel('Upload a file for Tickets from a spreadsheet').setInputFiles({
      name: 'tickets-nov-12.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from(TICKETS_CSV),
    });
    const billLine = sub.getByRole('region', { name: 'Billing' }).getByTestId('bill-line');
    await expect
      .poll(() => billLine.textContent())
      .toMatch(/^Item 303 is paid as “Counted loads \(truck register\)”, not from tallies/);
    await snap(sub, 'load-count-ticket-item');
    const billsItem = sub.getByRole('region', { name: 'Billing' }).getByLabel('Bills item');
    await billsItem.selectOption((await billsItem.locator('option', { hasText: /^205 · / }).getAttribute('value'))!);
    await saveWorksheet(sub, {
      itemNumber: '205',
      method: 'load-count',
      bills: '184.00 CY bank',
      title: 'Borrow hauled to the east fill, 12 Nov tickets',
      day: '12',
      files: ['tickets-nov-12.csv'],
    });

    // Surface to surface from two LandXML files: 150 x 150 ft, 2 ft deep everywhere: 150 x 150 x 2 / 27 = 1,666.67 CY.
    await openWorksheet(sub, '206', 'surface');
    await sub.getByLabel('Upload a file for Existing survey (ft)').setInputFiles({
      name: 'lot-7-basin-ground.xml',
      mimeType: 'application/xml',
      buffer: BASIN_GROUND,
    });
    await sub.getByLabel('Upload a file for Design survey (ft)').setInputFiles({
      name: 'lot-7-basin-dug.xml',
      mimeType: 'application/xml',
      buffer: BASIN_DUG,
    });
    await sub.getByTestId('cut-fill-map').waitFor();
    await saveWorksheet(sub, {
      itemNumber: '206',
      method: 'surface',
      bills: '1,666.67 CY bank',
      title: 'Lot 7 basin, as dug',
      day: '16',
      files: ['lot-7-basin-ground.xml', 'lot-7-basin-dug.xml'],
    });
    await sub.getByTestId('cut-fill-map').waitFor();

    // The manual method: a direct quantity with its basis and a file (item 503, silt fence by the foot).
    const direct = await newTallyFor(sub, '503');
    await direct.getByLabel('Quantity (LF)').fill('1,240');
    await direct.getByLabel('Measured on').fill('2026-11-18');
    await direct.getByLabel('Title').fill('Silt fence, lot 7 perimeter');
    await direct.getByLabel('Basis').fill('Walked with the wheel along the lot 7 fence on 18 Nov; 1,240 ft installed');
    await direct.getByLabel('Evidence files').setInputFiles({
      name: 'silt-fence-walk.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from('segment,feet\nnorth,420\neast,400\nsouth,420\n'),
    });
    await snap(sub, 'manual-direct-form');
    await direct.getByRole('button', { name: 'Save draft tally' }).click();
    await sub.getByRole('heading', { name: 'Silt fence, lot 7 perimeter' }).waitFor();
    await sub.getByText('1,240.0 LF').first().waitFor();
    await snap(sub, 'manual-tally-page');
    made.push({
      itemNumber: '503',
      method: 'manual',
      url: sub.url(),
      quantity: '1,240.0 LF',
      files: ['silt-fence-walk.csv'],
    });

    // 2. The pit reopens in its worksheet; an edited input saves as a change and the first save is kept.
    const pit = made.find((t) => t.method === 'pit')!;
    await sub.goto(pit.url);
    await sub.getByRole('link', { name: 'Edit in its worksheet' }).click();
    await sub.waitForURL(/\/worksheets\?tally=/);
    await sub.getByText(/Editing the draft tally/).waitFor();
    await sub.getByLabel('Bottom length').fill('18');
    // 18 x 12 x 5 / 27 = 40.00 CY.
    await expect
      .poll(() => sub.getByTestId('bill-line').first().textContent())
      .toContain('Bills 40.00 CY bank to item 207');
    await sub.getByRole('button', { name: 'Save changes' }).click();
    const change = sub.getByRole('form', { name: 'Save as tally' });
    expect(await change.getByTestId('bill-line').textContent()).toContain('Bills 40.00 CY bank to item 207');
    await snap(sub, 'pit-save-changes');
    await change.getByRole('button', { name: 'Save changes' }).click();
    await sub
      .getByText(/Saved as a draft tally/)
      .getByRole('link')
      .click();
    const history = sub.getByRole('table', { name: 'Earlier saves' });
    await history.waitFor();
    expect(await history.locator('tbody tr').count()).toBe(1);
    expect(await history.textContent()).toContain('35.56');
    expect(await history.textContent()).toContain('Length 16 ft → 18 ft');
    await snap(sub, 'pit-history');
    pit.quantity = '40.00 CY bank';

    // Each tally is marked ready to bill from its page.
    for (const t of made) {
      await sub.goto(t.url);
      await sub.getByRole('button', { name: 'Mark ready to bill' }).click();
      await sub
        .getByRole('dialog', { name: 'Mark this tally ready to bill?' })
        .getByRole('button', { name: 'Mark ready' })
        .click();
      await sub.getByRole('button', { name: 'Mark ready to bill' }).waitFor({ state: 'detached' });
    }

    // 3. A pay application for November carries the tallies; the subcontractor submits it.
    await openTab(sub, 'Pay apps');
    await sub.getByRole('button', { name: 'New pay application' }).click();
    const compile = sub.getByRole('dialog', { name: 'New pay application' });
    await compile.getByLabel('Period starts').fill(PERIOD.start);
    await compile.getByLabel('Period ends').fill(PERIOD.end);
    await snap(sub, 'new-pay-app');
    await compile.getByRole('button', { name: 'Compile pay application' }).click();
    await sub.waitForURL(/\/pay-apps\/[\w-]+$/);
    const payAppId = sub.url().split('/').at(-1)!;
    let app = (await api<{ payApp: PayAppDetail }>(sub, 'GET', `/pay-apps/${payAppId}`)).payApp;
    const expected: Record<string, number> = {
      '203': 592.5926,
      '202': 208.3333,
      '207': 40,
      '301': 260,
      '205': 184,
      '206': 1666.6667,
      '503': 1240,
    };
    for (const [itemNumber, quantity] of Object.entries(expected))
      expect(app.lines.find((l) => l.itemNumber === itemNumber)?.thisPeriodQuantity).toBeCloseTo(quantity, 2);
    await sub.getByRole('heading', { name: new RegExp(`^Pay application ${app.number}\\s+Draft$`) }).waitFor();
    await snap(sub, 'pay-app-draft');
    await sub.getByRole('button', { name: 'Submit', exact: true }).click();
    await sub
      .getByRole('dialog', { name: `Submit pay application ${app.number}?` })
      .getByRole('button', { name: 'Submit', exact: true })
      .click();
    await sub.getByRole('heading', { name: new RegExp(`^Pay application ${app.number}\\s+Submitted$`) }).waitFor();
    await snap(sub, 'pay-app-submitted');
    app = (await api<{ payApp: PayAppDetail }>(sub, 'GET', `/pay-apps/${payAppId}`)).payApp;
    expect(app.status).toBe('submitted');

    // 4. The general contractor opens the surface line's backup, the tally read-only in its worksheet, and a file.
    await openTab(gc, 'Pay apps');
    await gc
      .getByRole('table', { name: 'Pay applications' })
      .getByRole('link', { name: `Pay app ${app.number}`, exact: true })
      .click();
    await gc.getByRole('button', { name: 'Backup of item 206' }).click();
    const backup = gc.getByRole('table', { name: 'Backup of item 206' });
    await backup.waitFor();
    const row = backup.locator('tbody tr');
    expect(await row.count()).toBe(1);
    const cells = await row.locator('td').allTextContents();
    expect(cells.map((c) => c.trim())).toEqual([
      'Nov 16, 2026',
      'Lot 7 basin, as dug',
      expect.any(String),
      'Surface to surface',
      '1,666.67 CY',
      '2 files',
    ]);
    await snap(gc, 'gc-line-backup');
    await snap(backup, 'gc-line-backup-close');
    await backup.getByRole('link', { name: 'Lot 7 basin, as dug' }).click();
    await gc.waitForURL(/\/tallies\/[\w-]+$/);
    await gc.getByTestId('cut-fill-map').waitFor();
    expect(await gc.getByRole('link', { name: 'Edit in its worksheet' }).count()).toBe(0);
    await snap(gc, 'gc-tally-page');
    const download = gc.waitForEvent('download');
    await gc.getByRole('link', { name: 'Download lot-7-basin-dug.xml' }).click();
    const file = await download;
    expect(file.suggestedFilename()).toBe('lot-7-basin-dug.xml');
    const sha = (b: Buffer) => createHash('sha256').update(b).digest('hex');
    expect(sha(readFileSync((await file.path())!))).toBe(sha(BASIN_DUG));
    expect(await gc.getByRole('link', { name: 'Open the pay application' }).getAttribute('href')).toBe(
      `/projects/${projectId}/pay-apps/${payAppId}`,
    );
    await gc.getByRole('link', { name: 'Open in its worksheet' }).click();
    await gc.waitForURL(/\/worksheets\?tally=/);
    await gc.getByText(/Read-only: the tally/).waitFor();
    await gc.getByTestId('cut-fill-map').waitFor();
    expect(await gc.getByRole('button', { name: /Save/ }).count()).toBe(0);
    // Read-only: the tally's files are listed to download, and nothing offers to load another one.
    await gc.getByRole('link', { name: 'Download lot-7-basin-ground.xml' }).waitFor();
    expect(await gc.getByText('Upload file').count()).toBe(0);
    expect(await gc.getByText(/Calculator only/).count()).toBe(0);
    await snap(gc, 'gc-worksheet-read-only');
  }, 240_000);
});
