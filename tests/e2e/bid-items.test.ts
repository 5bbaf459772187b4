import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer } from '../setup/test-server';
import { ensureClientBuilt, launchBrowser } from './browser';

let server: Awaited<ReturnType<typeof startTestServer>>;
let browser: Browser;

beforeAll(async () => {
  await ensureClientBuilt();
  server = await startTestServer();
  browser = await launchBrowser();
}, 180_000);

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

async function signIn(page: Page, email: string) {
  await page.goto(`${server.url}/`);
  await page.waitForURL('**/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('tallyard-demo');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL('**/inbox');
}

describe('bid schedule in the browser', () => {
  it('lets the general contractor add a bid item through the form and shows it in the table', async () => {
    const page = await browser.newPage();
    await signIn(page, 'gc@tallyard.test');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Jobs' }).click();
  await page.getByRole('table', { name: 'Jobs' }).getByRole('link').first().click();
    await page.getByRole('navigation', { name: 'Project' }).getByRole('link', { name: 'Bid schedule' }).click();
    const table = page.getByRole('table', { name: 'Bid schedule' });
    await table.waitFor();
    const sumBefore = await page.getByTestId('contract-sum').textContent();

    await page.getByRole('button', { name: 'Add bid item' }).click();
    const form = page.getByRole('form', { name: 'Bid item' });
    await form.getByLabel('Item number').fill('E2E-1');
    await form.getByLabel('Description').fill('Keyway excavation under the basin berm');
    await form.getByLabel(/Contract quantity/).fill('2,480');
    await form.getByLabel(/Unit price/).fill('11.35');
    await form.getByRole('button', { name: 'Add bid item' }).click();

    // 2,480 CY x $11.35 = $28,148.00 (worked by hand).
    const row = table.getByRole('row').filter({ hasText: 'Keyway excavation under the basin berm' });
    await row.waitFor();
    expect(await row.textContent()).toContain('E2E-1');
    expect(await row.textContent()).toContain('2,480.00CY');
    expect(await row.textContent()).toContain('$28,148.00');
    await expect.poll(() => page.getByTestId('contract-sum').textContent()).not.toBe(sumBefore);

    // It was saved, not only drawn: a fresh load shows it too.
    await page.reload();
    await table.getByRole('row').filter({ hasText: 'E2E-1' }).waitFor();
    await page.close();
  });
});
