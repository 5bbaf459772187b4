import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { waitForMail } from '../setup/payment-flow';
import { browserTest } from './browser';

const e2e = browserTest();
const { snap: shot } = e2e;

async function signInWith(page: Page, email: string, password: string) {
  await page.goto(`${e2e.server.url}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

describe('passwords in the browser', () => {
  it('a forgotten password: the link from the e-mail sets a new one, and the new one signs in', async () => {
    const page = await e2e.browser.newPage();
    await page.goto(`${e2e.server.url}/sign-in`);
    await page.getByRole('link', { name: 'Forgot your password?' }).click();
    await page.waitForURL('**/forgot-password');
    await page.getByLabel('E-mail').fill('sub@tallyard.test');
    await shot(page, 'forgot-password');
    await page.getByRole('button', { name: 'Send me a link' }).click();
    await page.getByText('If an account uses sub@tallyard.test').waitFor();
    await shot(page, 'forgot-password-sent');

    const mail = await waitForMail(
      e2e.server.mailbox,
      (m) => m.to.includes('sub@tallyard.test') && m.subject.includes('password'),
    );
    const link = /http:\/\/\S+\/reset-password\?token=[A-Za-z0-9_-]+/.exec(mail.text)![0];
    await page.goto(link);
    await page.getByLabel('New password', { exact: true }).fill('password1234');
    await page.getByLabel('Type it again').fill('password1234');
    await page.getByRole('button', { name: 'Set my new password' }).click();
    await page.getByText(/list of common passwords/).waitFor();
    await shot(page, 'reset-password-refused');
    await page.getByLabel('New password', { exact: true }).fill('borrow-pit-lift-2027');
    await page.getByLabel('Type it again').fill('borrow-pit-lift-2027');
    await page.getByRole('button', { name: 'Set my new password' }).click();
    await page.getByText('Your new password is set.').waitFor();
    await shot(page, 'reset-password-done');

    await signInWith(page, 'sub@tallyard.test', 'tallyard-demo');
    await page.getByText('That e-mail and password do not match an account.').waitFor();
    await signInWith(page, 'sub@tallyard.test', 'borrow-pit-lift-2027');
    await page.waitForURL('**/inbox');
    await page.close();
  }, 120_000);

  it('changing the password signs out the other browser', async () => {
    const elsewhere = await e2e.signedIn('owner@tallyard.test');
    const page = await e2e.signedIn('owner@tallyard.test');
    await page.getByRole('link', { name: 'Password' }).click();
    await page.waitForURL('**/account/password');
    await page.getByLabel('Current password').fill('tallyard-demo');
    await page.getByLabel('New password', { exact: true }).fill('basin-outlet-riprap-8');
    await page.getByLabel('Type the new one again').fill('basin-outlet-riprap-9');
    await page.getByRole('button', { name: 'Change password' }).click();
    await page.getByText('The two passwords differ').waitFor();
    await page.getByLabel('Type the new one again').fill('basin-outlet-riprap-8');
    await page.getByRole('button', { name: 'Change password' }).click();
    await page.getByText('Password changed.').waitFor();
    await shot(page, 'change-password-done');

    await page.goto(`${e2e.server.url}/jobs`);
    await page.waitForURL('**/jobs');
    await elsewhere.goto(`${e2e.server.url}/jobs`);
    await elsewhere.waitForURL('**/sign-in?next=%2Fjobs');
    await elsewhere.getByRole('heading', { name: 'Sign in' }).waitFor();
    // One navigation only: the lapsed session goes to Sign in inside the app, keeping where it was.
    expect(elsewhere.url()).toBe(`${e2e.server.url}/sign-in?next=%2Fjobs`);
    await elsewhere.context().close();
    await page.close();
  }, 120_000);
});
