import { eq } from 'drizzle-orm';
import type { Page } from 'playwright-core';
import { beforeAll, describe, expect, it } from 'vitest';
import { projects, user } from '../../server/db/schema';
import { makeCertifiedPayApp } from '../setup/payment-factories';
import { waitForMail } from '../setup/payment-flow';
import { browserTest } from './browser';

// Test values: Stripe's testing documentation (reference.md section 8). The demo has no certified application
// yet, so this test writes two into the test server's database (numbers far from the demo's own).
const e2e = browserTest({ server: { achSettleMs: 4000 } });
const { snap: shot } = e2e;
let projectId: string;

beforeAll(async () => {
  const { db } = e2e.server.database;
  const [project] = await db.select().from(projects).limit(1);
  const [sub] = await db.select().from(user).where(eq(user.email, 'sub@tallyard.test'));
  projectId = project!.id;
  await makeCertifiedPayApp(db, projectId, sub!.id, { number: 901 });
  await makeCertifiedPayApp(db, projectId, sub!.id, { number: 902 });
});

async function payThroughCheckout(page: Page, number: number, choice: RegExp) {
  await page.goto(`${e2e.server.url}/projects/${projectId}/payments`);
  const card = page.getByRole('region', { name: `Pay application ${number}`, exact: true });
  await card.getByRole('button', { name: 'Continue to payment' }).waitFor();
  // The payer chooses the method first and sees its processing fee and the total (issue 11, item 7).
  await card.getByRole('radio', { name: choice.source.includes('4242') ? /^Card/ : /^ACH/ }).check();
  await card
    .getByText(/Processing fee \$[\d,.]+ added; you are charged \$[\d,.]+\./)
    .first()
    .waitFor();
  await shot(page, `before-${number}`);
  await card.getByRole('button', { name: 'Continue to payment' }).click();
  await page.waitForURL(`${e2e.server.standinUrl}/pay/**`);
  expect(await page.textContent('body')).toContain('Local test checkout — no real money moves');
  // The demo's payer bears the processing fee: the checkout charges $13,621.90 plus the quoted fee (card
  // 2.9 % + $0.30 grossed up; ACH 0.8 % capped at $5; src/shared/domain/payment-fees.ts).
  expect(await page.textContent('body')).toContain(choice.source.includes('4242') ? '$14,029.04' : '$13,626.90');
  await page.getByLabel(choice).check();
  await shot(page, `checkout-${number}`);
  await page.getByRole('button', { name: 'Confirm test payment' }).click();
  await page.waitForURL(`${e2e.server.url}/projects/${projectId}/payments?**`);
  return card;
}

describe('paying a certified application in the browser', () => {
  it('the owner pays by card (4242 4242 4242 4242) and sees it succeed', async () => {
    const page = await e2e.signedIn('owner@tallyard.test');
    const card = await payThroughCheckout(page, 901, /4242 4242 4242 4242/);
    await card.getByText('Succeeded').waitFor();
    await expect.poll(() => card.getByTestId('pay-app-status').textContent()).toBe('Paid');
    await page.getByText('Payment received.').waitFor();
    await shot(page, 'after-card');
    const receipt = await waitForMail(e2e.server.mailbox, (m) => m.subject.startsWith('Receipt: pay application 901'));
    expect(receipt.to).toEqual(
      expect.arrayContaining(['owner@tallyard.test', 'gc@tallyard.test', 'sub@tallyard.test']),
    );
    await page.close();
  });

  it('the owner pays by ACH (000123456789) and sees processing, then succeeded', async () => {
    const page = await e2e.signedIn('owner@tallyard.test');
    const card = await payThroughCheckout(page, 902, /000123456789/);
    await card.getByText('Processing', { exact: true }).first().waitFor();
    expect(await card.getByTestId('pay-app-status').textContent()).toBe('Payment processing');
    await shot(page, 'ach-processing');
    // The stand-in settles after 4 s; the screen asks again every few seconds while a payment is processing.
    await card.getByText('Succeeded').waitFor({ timeout: 20_000 });
    await expect.poll(() => card.getByTestId('pay-app-status').textContent()).toBe('Paid');
    await shot(page, 'ach-succeeded');
    await page.close();
  });

  it('the subcontractor sees the payments and issues a conditional waiver on the Waivers tab', async () => {
    const page = await e2e.signedIn('sub@tallyard.test');
    await page.goto(`${e2e.server.url}/projects/${projectId}/payments`);
    await page.getByRole('table', { name: 'Payment history' }).getByText('Succeeded').first().waitFor();
    expect(await page.getByRole('button', { name: 'Continue to payment' }).count()).toBe(0);
    await shot(page, 'sub-payments');
    await page.getByRole('navigation', { name: 'Project' }).getByRole('link', { name: 'Waivers' }).click();
    const section = page.getByRole('region', { name: 'Waivers for pay application 901' });
    await section
      .getByRole('button', { name: /Issue for/ })
      .first()
      .click();
    await section.getByLabel('Type your full name to sign').fill('Rosa Delgado');
    await shot(page, 'waiver-sign');
    await section.getByRole('button', { name: 'Sign and issue' }).click();
    await section.getByRole('link', { name: 'PDF' }).first().waitFor();
    expect(await page.textContent('body')).toContain('not legal advice');
    await shot(page, 'waivers');
    await page.close();
  });
});
