import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { browserTest, openTab } from './browser';

// Issue 13, items 3 and 5 in headless Chromium with the demo job: the subcontractor records the original ground
// (LandXML), both sides accept it, the subcontractor measures an as-built surface against it in the surface
// worksheet, saves a tally, and the cut and fill map shows on the worksheet and on the tally. Screenshots land in
// /tmp, never in the repository. The surfaces are invented for this test.

const e2e = browserTest({
  shots: '/tmp/shots-surfaces',
  context: { viewport: { width: 1440, height: 1000 } },
  timeout: 300_000,
});
const { signedIn, snap } = e2e;

/** A 300 x 300 ft grid every 30 ft; LandXML writes northing easting elevation (LandXML 1.2 schema, P). */
function landXml(name: string, units: string, z: (x: number, y: number) => number, extra = ''): Buffer {
  const pts: string[] = [];
  let id = 1;
  for (let y = 0; y <= 300; y += 30)
    for (let x = 0; x <= 300; x += 30) pts.push(`<P id="${id++}">${y} ${x} ${z(x, y).toFixed(4)}</P>`);
  return Buffer.from(`<?xml version="1.0" encoding="UTF-8"?>
<LandXML xmlns="http://www.landxml.org/schema/LandXML-1.2" version="1.2"><Units>${units}</Units>
<Surfaces><Surface name="${name}">${extra}<Definition surfType="TIN"><Pnts>${pts.join('')}</Pnts></Definition></Surface></Surfaces></LandXML>`);
}
const groundFt = (x: number, y: number) => 100 + 0.01 * x + 0.004 * y;

/** Pixels of the cut and fill map's canvas that were painted (not left transparent). */
const paintedPixels = (page: Page) =>
  page
    .getByTestId('cut-fill-map')
    .locator('canvas')
    .evaluate((c: HTMLCanvasElement) => {
      const data = c.getContext('2d')!.getImageData(0, 0, c.width, c.height).data;
      let n = 0;
      for (let i = 3; i < data.length; i += 4) if (data[i]! > 0) n++;
      return n;
    });
/** Original ground: Imperial without elevationUnit, so the elevations are written in metres (the schema default). */
const ORIGINAL = landXml(
  'Basin original ground',
  '<Imperial linearUnit="foot" areaUnit="squareFoot" volumeUnit="cubicYard"/>',
  (x, y) => groundFt(x, y) * 0.3048,
);
/** As-built: the basin floor 4 ft down between x, y = 90 and 210, in feet, with pay limits and a void. */
const AS_BUILT = landXml(
  'Basin as-built',
  '<Imperial linearUnit="foot" elevationUnit="foot"/>',
  (x, y) => groundFt(x, y) - (x >= 90 && x <= 210 && y >= 90 && y <= 210 ? 4 : 0),
  `<SourceData><Boundaries><Boundary name="pay" bndType="outer"><PntList2D>15 15 15 285 285 285 285 15</PntList2D></Boundary>
   <Boundary name="inlet" bndType="void"><PntList2D>130 130 130 170 170 170 170 130</PntList2D></Boundary></Boundaries></SourceData>`,
);

describe('original ground, as-built surface, tally and map', () => {
  it('records and locks the original ground, measures the as-built against it, and shows the map', async () => {
    const sub = await signedIn('sub@tallyard.test');
    await openTab(sub, 'Original ground');
    await sub.getByLabel('Surface file', { exact: true }).setInputFiles({
      name: 'basin-original-ground.xml',
      mimeType: 'application/xml',
      buffer: ORIGINAL,
    });
    await sub.getByRole('button', { name: 'Record' }).click();
    await expect.poll(() => sub.getByText('Awaiting acceptance').count()).toBe(1);
    await expect.poll(() => sub.getByText('elevations in metres').count()).toBe(1);
    await sub.getByRole('button', { name: 'Accept this surface for my side' }).click();
    await expect.poll(() => sub.getByRole('button', { name: 'Accept this surface for my side' }).count()).toBe(0);
    await snap(sub, 'baseline-sub-accepted');

    const gc = await signedIn('gc@tallyard.test');
    await openTab(gc, 'Original ground');
    await gc.getByRole('button', { name: 'Accept this surface for my side' }).click();
    await expect.poll(() => gc.getByText('Not yet accepted').count()).toBe(0);
    await expect.poll(() => gc.getByText('Awaiting acceptance').count()).toBe(0);
    const sha = await gc.getByTestId('baseline-sha256').textContent();
    expect(sha).toMatch(/^[0-9a-f]{64}$/);
    await snap(gc, 'baseline-locked');

    // From the Tallies tab: a new tally for the surface item opens its worksheet with the item chosen.
    await openTab(sub, 'Tallies');
    await sub.getByRole('button', { name: 'New tally' }).click();
    const dialog = sub.getByRole('dialog', { name: 'New tally' });
    const select = dialog.getByLabel('Bid item');
    await select.selectOption((await select.locator('option', { hasText: /^206 / }).getAttribute('value'))!);
    await dialog.getByRole('link', { name: 'Open the worksheet' }).click();
    await sub.waitForURL(/\/worksheets\?method=surface&item=/);
    await sub.getByLabel('Measure from the locked original ground').selectOption({ index: 1 });
    await expect.poll(() => sub.getByText(/LandXML surface "Basin original ground": 121 points/).count()).toBe(1);
    await sub.locator('input[type=file]').nth(1).setInputFiles({
      name: 'basin-as-built.xml',
      mimeType: 'application/xml',
      buffer: AS_BUILT,
    });
    await expect.poll(() => sub.getByText(/pay limits from its boundaries/).count()).toBe(1);
    await sub.getByTestId('cut-fill-map').waitFor();
    // Drawn from the overlay's pieces on a canvas: painted, and the caption says from how many pieces.
    await expect.poll(() => paintedPixels(sub)).toBeGreaterThan(10_000);
    await expect.poll(() => sub.getByText(/Drawn from the [\d,]+ pieces of the overlay/).count()).toBe(1);
    await sub.getByLabel('Part billed').selectOption('cut');
    await snap(sub, 'worksheet-map');

    await sub.getByRole('button', { name: 'Save as tally' }).click();
    const save = sub.getByRole('form', { name: 'Save as tally' });
    await save.getByLabel('Title').fill('Basin, as-built against the original ground');
    await save.getByRole('button', { name: 'Save tally' }).click();
    await sub
      .getByText(/Saved as a draft tally/)
      .getByRole('link')
      .click();
    await sub.getByTestId('cut-fill-map').waitFor();
    await expect.poll(() => paintedPixels(sub)).toBeGreaterThan(10_000);
    await expect.poll(() => sub.getByText(/locked original ground "basin-original-ground.xml"/).count()).toBe(1);
    await snap(sub, 'tally-map');
  }, 240_000);

  it('streams a LandXML upload over 4 MiB in the worker, naming the file instead of holding its text', async () => {
    // 400 x 400 shots 1 ft apart (160,000 points, about 5.5 MB): a plane 1 ft below the basin's original ground.
    const rows: string[] = [];
    let id = 1;
    for (let y = 0; y < 400; y++)
      for (let x = 0; x < 400; x++) rows.push(`<P id="${id++}">${y} ${x} ${(groundFt(x, y) - 1).toFixed(4)}</P>`);
    const big = Buffer.from(`<?xml version="1.0" encoding="UTF-8"?>
<LandXML xmlns="http://www.landxml.org/schema/LandXML-1.2" version="1.2"><Units><Imperial linearUnit="foot" elevationUnit="foot"/></Units>
<Surfaces><Surface name="Dense as-built"><Definition surfType="TIN"><Pnts>${rows.join('\n')}</Pnts></Definition></Surface></Surfaces></LandXML>`);
    expect(big.length).toBeGreaterThan(4 * 1024 * 1024);
    const sub = await signedIn('sub@tallyard.test');
    await openTab(sub, 'Worksheets');
    await sub.getByRole('link', { name: 'Surface to surface', exact: true }).click();
    await sub.getByLabel('Upload a file for Design survey (ft)').setInputFiles({
      name: 'dense-as-built.xml',
      mimeType: 'application/xml',
      buffer: big,
    });
    await expect.poll(() => sub.getByText(/dense-as-built\.xml \(\d+(\.\d)? MB\) is read in pieces/).count()).toBe(1);
    await expect
      .poll(() => sub.getByText(/LandXML surface "Dense as-built": 160,000 points/).count(), { timeout: 120_000 })
      .toBe(1);
    expect(await sub.getByLabel('Design survey (ft)', { exact: true }).inputValue()).toBe('');
    await snap(sub, 'worksheet-streamed');
  }, 240_000);
});
