import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { browserTest } from './browser';

const e2e = browserTest();

/** A new project set up by the signed-in general contractor (its contract is not locked yet); returns its id. */
async function newProject(page: Page): Promise<string> {
  return page.evaluate(async () => {
    const { companies } = (await (await fetch('/api/companies')).json()) as {
      companies: { id: string; kind: string }[];
    };
    const pick = (kind: string) => companies.find((c) => c.kind === kind)!.id;
    const res = await fetch('/api/projects', {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({
        name: 'Keyway test job',
        subcontractorCompanyId: pick('subcontractor'),
        ownerCompanyId: pick('owner'),
      }),
    });
    return ((await res.json()) as { project: { id: string } }).project.id;
  });
}

describe('bid schedule in the browser', () => {
  it('offers a change order instead of editing once the contract is locked (the demo job)', async () => {
    const page = await e2e.signedIn('gc@tallyard.test');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Jobs' }).click();
    await page.getByRole('table', { name: 'Jobs' }).getByRole('link').first().click();
    await page.getByRole('navigation', { name: 'Project' }).getByRole('link', { name: 'Bid schedule' }).click();
    await page.getByRole('table', { name: 'Bid schedule' }).waitFor();
    await page.getByRole('note').filter({ hasText: 'Contract locked' }).waitFor();
    expect(await page.getByRole('button', { name: 'Add bid item' }).count()).toBe(0);
    expect(await page.getByRole('button', { name: /^Edit / }).count()).toBe(0);
    await page.getByRole('link', { name: 'Propose a change order for 205' }).click();
    await page.getByRole('form', { name: 'Propose a change order' }).waitFor();
    await page.close();
  });

  it('lets the general contractor add a bid item through the form and shows it in the table', async () => {
    const page = await e2e.signedIn('gc@tallyard.test');
    const projectId = await newProject(page);
    await page.goto(`${e2e.server.url}/projects/${projectId}/bid-items`);
    const table = page.getByRole('table', { name: 'Bid schedule' });
    await page.getByText('No bid items yet').waitFor();

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
    await expect.poll(() => page.getByTestId('contract-sum').textContent()).toBe('$28,148.00');

    // It was saved, not only drawn: a fresh load shows it too.
    await page.reload();
    await table.getByRole('row').filter({ hasText: 'E2E-1' }).waitFor();
    await page.close();
  });
});
