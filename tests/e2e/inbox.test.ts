import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { browserTest } from './browser';

// Each role starts at the inbox (the first screen after sign-in), opens one entry and finishes that step; the
// entry is then gone from the inbox. The demo (server/db/demo) leaves one step for each: the subcontractor's
// conditional waiver on pay application 2, the general contractor's drafted change order, the owner's payment of
// pay application 2. Card number: Stripe's testing documentation (reference.md section 8).
const e2e = browserTest({ prefix: 'inbox-', context: { viewport: { width: 1366, height: 900 } } });

async function atInbox(email: string): Promise<Page> {
  const page = await e2e.signedIn(email);
  await page.getByRole('heading', { name: 'Inbox' }).waitFor();
  return page;
}

const entry = (page: Page, title: string) =>
  page.getByRole('list', { name: 'Waiting on you' }).getByRole('listitem').filter({ hasText: title });

async function backToInbox(page: Page) {
  await page
    .getByRole('navigation', { name: 'Main' })
    .getByRole('link', { name: /^Inbox/ })
    .click();
  await page.getByRole('heading', { name: 'Inbox' }).waitFor();
  await page.getByRole('list', { name: 'Waiting on you' }).waitFor();
}

describe('starting from the inbox', () => {
  it('the subcontractor signs the conditional waiver it asks for', async () => {
    const page = await atInbox('sub@tallyard.test');
    const title = 'Sign the conditional progress waiver on pay application 2';
    await entry(page, title)
      .getByRole('link', { name: /^Open waivers/ })
      .click();
    await page.waitForURL(/\/waivers$/);
    const card = page.getByRole('region').filter({ hasText: 'Pay application No. 2' });
    await card
      .getByRole('button', { name: /^Issue for/ })
      .first()
      .click();
    await page.getByLabel('Type your full name to sign').fill('Rosa Delgado');
    await page.getByRole('button', { name: 'Sign and issue' }).click();
    await card.getByText('Rosa Delgado').first().waitFor();
    await backToInbox(page);
    await expect.poll(() => entry(page, title).count()).toBe(0);
    await e2e.snap(page, 'sub-after');
  });

  it('the general contractor decides the drafted change order', async () => {
    const page = await atInbox('gc@tallyard.test');
    const item = entry(page, 'Decide change order');
    await item.first().waitFor();
    const title = (await item.first().getByRole('link').first().textContent())!;
    await item
      .first()
      .getByRole('link', { name: /^Open to decide/ })
      .click();
    await page.waitForURL(/\/change-orders\/[\w-]+$/);
    await page.getByRole('button', { name: 'Approve' }).click();
    await page
      .getByText(/Approved and applied|Your approval is recorded/)
      .first()
      .waitFor();
    await backToInbox(page);
    await expect.poll(() => entry(page, title).count()).toBe(0);
  });

  it('the owner pays the certified application from its entry', async () => {
    const page = await atInbox('owner@tallyard.test');
    const title = 'Payment due on pay application 2';
    await entry(page, title)
      .getByRole('link', { name: /^Open to pay/ })
      .click();
    await page.waitForURL(/\/pay-apps\/[^/]+$/);
    await page.getByText('Certified: $25,096.09 waits on your payment.').waitFor();
    const card = page.getByRole('region', { name: 'Pay application 2', exact: true });
    await card.getByRole('radio', { name: /^Card/ }).check();
    await card.getByRole('button', { name: 'Continue to payment' }).click();
    await page.waitForURL(`${e2e.server.standinUrl}/pay/**`);
    await page.getByLabel(/4242 4242 4242 4242/).check();
    await page.getByRole('button', { name: 'Confirm test payment' }).click();
    await page.waitForURL(`${e2e.server.url}/projects/**/payments?**`);
    await card.getByText('Succeeded').waitFor();
    await backToInbox(page);
    await expect.poll(() => entry(page, title).count()).toBe(0);
  });
});
