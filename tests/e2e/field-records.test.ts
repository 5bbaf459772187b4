import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { browserTest } from './browser';

// The demo job, driven as its people would: field records typed into the Pay basis forms, then the pay
// application's package (schedule of values, summary lines, change orders) read on screen against the API.
// E2E_SCREENSHOTS=<dir> keeps a screenshot of each step.
const e2e = browserTest({ prefix: 'field-records-', context: { viewport: { width: 1366, height: 900 } } });
const { signedIn: as, snap, projectPath } = e2e;

const card = (page: Page, title: string) =>
  page.locator('section', { has: page.getByRole('heading', { name: title }) });

describe('field records through the forms, and the pay application package on screen', () => {
  it('the general contractor records liquidated damages; the form names a bad field first', async () => {
    const page = await as('gc@tallyard.test');
    await page.goto(`${e2e.server.url}${await projectPath(page)}/pay-basis`);
    await page.getByRole('button', { name: 'Record a deduction or adjustment' }).click();
    const form = page.getByRole('form', { name: 'Record a deduction or adjustment' });
    await form.getByLabel('Applies on').fill('2026-11-20');
    await form.getByLabel('Description').fill('Milestone 2 late by three days');
    await form.getByLabel('Days late').fill('3');
    await form.getByLabel('Daily amount ($)').fill('150.5.0');
    await form.getByRole('button', { name: 'Record' }).click();
    await expect
      .poll(() => form.getByRole('list', { name: 'What to correct' }).textContent())
      .toContain('Daily amount: Type dollars like 62.50');
    await form.getByLabel('Daily amount ($)').fill('150.00');
    await form.getByRole('button', { name: 'Record' }).click();
    // 3 days x $150.00 = -$450.00 (days times the daily amount).
    await card(page, 'Deductions and adjustments').getByText('Milestone 2 late by three days').waitFor();
    expect(await card(page, 'Deductions and adjustments').textContent()).toContain('-$450.00');
    await snap(page, 'gc-deduction');
    await page.context().close();
  });

  it('the subcontractor records a load and a delivery of stored material', async () => {
    const page = await as('sub@tallyard.test');
    await page.goto(`${e2e.server.url}${await projectPath(page)}/pay-basis`);
    await page.getByRole('button', { name: 'Record a load' }).click();
    const form = page.getByRole('form', { name: 'Record a load ticket' });
    await form.getByLabel('Delivered on').fill('2026-11-03');
    for (const [label, text] of [
      ['Truck', 'H-07'],
      ['Material', 'Unsuitable muck'],
      ['Source', 'Basin outlet'],
      ['Loaded at', 'Sta 3+40'],
      ['Delivered to', 'Spoil site B'],
      ['Load checker (initials)', 'RD'],
      ['Delivery checker (initials)', 'OH'],
    ] as const) {
      await form.getByLabel(label, { exact: true }).fill(text);
    }
    await form.getByRole('button', { name: 'Save load' }).click();
    // The truck's measured bed (12.42 CY) stands for the load: the day's row shows it.
    const haul = card(page, 'Trucks and load tickets');
    await haul.getByText('Nov 3, 2026').waitFor();
    expect(await haul.getByRole('row', { name: /Nov 3, 2026/ }).textContent()).toContain('12.42');

    const stored = card(page, 'Materials on hand');
    const before = await stored.getByRole('row', { name: /Class 2 riprap/ }).textContent();
    await stored
      .getByRole('row', { name: /Class 2 riprap/ })
      .getByRole('button', { name: 'Record' })
      .click();
    const move = page.getByRole('form', { name: /Record a movement of/ });
    await move.getByLabel('Dated').fill('2026-11-04');
    await move.getByLabel(/Quantity/).fill('10');
    await move.getByRole('button', { name: 'Record' }).click();
    await expect
      .poll(() => move.getByRole('list', { name: 'What to correct' }).textContent())
      .toContain('Paid invoice');
    await move.getByLabel('Paid invoice number').fill('INV-2291');
    await move.getByRole('button', { name: 'Record' }).click();
    await expect.poll(() => stored.getByRole('row', { name: /Class 2 riprap/ }).textContent()).not.toBe(before);
    await snap(page, 'sub-records');
    await page.context().close();
  });

  it('shows the schedule of values, the summary lines and the change orders of the API on the pay application', async () => {
    const page = await as('gc@tallyard.test');
    const path = await projectPath(page);
    const apps = await page.evaluate(
      async (p) => (await fetch(`/api/projects/${p.split('/')[2]}/pay-apps`)).json(),
      path,
    );
    const list = (apps.payApps ?? apps.items) as { id: string; number: number }[];
    const latest = list.reduce((a, b) => (a.number > b.number ? a : b));
    const detail = (await page.evaluate(async (id) => (await fetch(`/api/pay-apps/${id}`)).json(), latest.id)).payApp;
    await page.goto(`${e2e.server.url}${path}/pay-apps/${latest.id}`);
    const sov = page.getByRole('table', { name: `Schedule of values of pay application ${latest.number}` });
    await sov.waitFor();
    expect(await sov.locator('tbody tr').count()).toBe(detail.lines.length);
    const money = (cents: number) =>
      `${cents < 0 ? '-' : ''}$${(Math.abs(cents) / 100).toLocaleString('en-US', { minimumFractionDigits: 2 })}`;
    for (const s of detail.package.summary as { key: string; amountCents: number }[]) {
      expect(await page.locator(`[data-summary="${s.key}"] dd`).textContent(), s.key).toBe(money(s.amountCents));
    }
    const cos = page.getByRole('region', { name: 'Change order summary' });
    for (const co of detail.package.changeOrders.lines as { number: number }[]) {
      expect(await cos.textContent()).toContain(`CO ${co.number}`);
    }
    await snap(page, 'gc-pay-app');
    await page.context().close();
  });
});
