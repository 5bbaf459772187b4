import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { browserTest, openTab } from './browser';

// Issue 12, items 1, 4 and 5 in headless Chromium with the demo job: the subcontractor makes tallies from "New
// tally" (a volume worksheet and the direct-quantity form), reopens the worksheet tally and edits it (the earlier
// save stays in its history); the general contractor opens a pay application line's backup and reaches the tally,
// its evidence and its worksheet drawing. Screenshots land in /tmp, never in the repository.

/** A real 1 x 1 PNG (one spruce-green pixel), so the photo preview has a picture to show. */
const PHOTO = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAIAAACQd1PeAAAADElEQVR4nGPQj/UCAAGVANc/ZvXWAAAAAElFTkSuQmCC',
  'base64',
);
const e2e = browserTest({
  shots: '/tmp/tallyard-e2e/tally-flow',
  context: { viewport: { width: 1440, height: 1000 } },
  timeout: 240_000,
});
const { signedIn, snap } = e2e;

async function newTallyFor(page: Page, itemLabel: RegExp) {
  await openTab(page, 'Tallies');
  await page.getByRole('button', { name: 'New tally' }).click();
  const dialog = page.getByRole('dialog', { name: 'New tally' });
  const select = dialog.getByLabel('Bid item');
  const value = await select.locator('option', { hasText: itemLabel }).getAttribute('value');
  await select.selectOption(value!);
  return dialog;
}

describe('tallies from the worksheets to the pay application line', () => {
  it('the subcontractor makes a worksheet tally and a direct one from New tally, then reopens and edits the first', async () => {
    const sub = await signedIn('sub@tallyard.test');

    // A volume item opens its worksheet with the item chosen.
    const dialog = await newTallyFor(sub, /^207 /);
    await snap(sub, 'new-tally-worksheet-item');
    await dialog.getByRole('link', { name: 'Open the worksheet' }).click();
    await sub.waitForURL(/\/worksheets\?method=pit&item=/);
    // A small pit of our own, well inside the item's contract quantity.
    await sub.getByLabel('Bottom length').fill('16');
    await sub.getByLabel('Bottom width').fill('12');
    await sub.getByRole('button', { name: 'Save as tally' }).click();
    const save = sub.getByRole('form', { name: 'Save as tally' });
    await save.getByLabel('Title').fill('Outlet pit, first lift');
    await snap(sub, 'pit-save-dialog');
    await save.getByRole('button', { name: 'Save tally' }).click();
    const savedLink = sub.getByText(/Saved as a draft tally/).getByRole('link');
    await savedLink.waitFor();
    await snap(sub, 'pit-saved');
    await savedLink.click();
    await sub.waitForURL(/\/tallies\/[\w-]+$/);
    const pitUrl = sub.url();
    await sub.getByRole('heading', { name: 'Outlet pit, first lift' }).waitFor();
    expect(await sub.getByText(/"unit"|spacingX|cornerDepths/).count()).toBe(0);
    await snap(sub, 'pit-tally-page');

    // An item no worksheet measures gets the direct-quantity form, with its basis and a file.
    const direct = await newTallyFor(sub, /^402 /);
    await direct.getByLabel('Quantity (SY)').fill('1,250');
    await direct.getByLabel('Title').fill('Fine grading, east pad');
    await direct.getByLabel('Basis').fill('East pad finished to grade, 50 x 225 ft, checked with the rod on 3 Nov');
    await direct
      .getByLabel('Evidence files')
      .setInputFiles({ name: 'east-pad-photo.png', mimeType: 'image/png', buffer: PHOTO });
    await snap(sub, 'direct-form');
    await direct.getByRole('button', { name: 'Save draft tally' }).click();
    await sub.getByRole('heading', { name: 'Fine grading, east pad' }).waitFor();
    await sub.getByText('east-pad-photo.png').first().waitFor();
    await sub.getByRole('img', { name: 'east-pad-photo.png' }).waitFor();
    expect(
      await sub.getByRole('img', { name: 'east-pad-photo.png' }).evaluate((i: HTMLImageElement) => i.naturalWidth),
    ).toBe(1);
    await snap(sub, 'direct-tally-page');

    // The pit tally reopens in its worksheet; saving changes keeps the first save as a revision.
    await sub.goto(pitUrl);
    await sub.getByRole('link', { name: 'Edit in its worksheet' }).click();
    await sub.waitForURL(/\/worksheets\?tally=/);
    await sub.getByLabel('Bottom length').fill('18');
    await sub.getByRole('button', { name: 'Save changes' }).click();
    await sub.getByRole('form', { name: 'Save as tally' }).getByRole('button', { name: 'Save changes' }).click();
    await sub
      .getByText(/Saved as a draft tally/)
      .getByRole('link')
      .click();
    await sub.getByRole('table', { name: 'Earlier saves' }).waitFor();
    expect(await sub.getByRole('table', { name: 'Earlier saves' }).locator('tbody tr').count()).toBe(1);
    await snap(sub, 'pit-tally-history');
  }, 120_000);

  it("the general contractor opens a line's backup and reaches the tally, its evidence and its worksheet drawing", async () => {
    const gc = await signedIn('gc@tallyard.test');
    await openTab(gc, 'Pay apps');
    await gc.waitForURL(/\/pay-apps$/);
    await gc.getByRole('link', { name: 'Pay app 1', exact: true }).first().click();
    await gc.getByRole('button', { name: 'Backup of item 203' }).click();
    const backup = gc.getByRole('table', { name: 'Backup of item 203' });
    await backup.waitFor();
    await snap(gc, 'line-backup');
    await backup.getByRole('link').first().click();
    await gc.waitForURL(/\/tallies\/[\w-]+$/);
    await gc.getByRole('link', { name: 'Download' }).first().waitFor();
    await gc.getByRole('table', { name: 'Stations' }).waitFor();
    await snap(gc, 'backup-tally-page');
    await gc.getByRole('link', { name: 'Open in its worksheet' }).click();
    await gc.waitForURL(/\/worksheets\?tally=/);
    // The worksheet draws the tally's stations (the end-area profile chart), read-only.
    await gc.getByText(/End-area profile/).waitFor();
    await gc.locator('figure .recharts-surface').first().waitFor();
    await gc.getByText(/Read-only: the tally/).waitFor();
    await snap(gc, 'backup-worksheet');
  }, 90_000);
});
