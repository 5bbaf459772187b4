import { existsSync } from 'node:fs';
import { chromium, type Browser, type Page } from 'playwright-core';
import { buildClientIfStale } from '../../scripts/build-client';

/** Debian's chromium package; never a downloaded browser. CHROMIUM_PATH overrides it. */
const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

/**
 * The test server serves dist/: build it first when it is missing or older than the sources. Vitest sets
 * NODE_ENV=test, which would make Vite bundle React's development build; the build runs as production.
 */
export async function ensureClientBuilt(): Promise<void> {
  const nodeEnv = process.env.NODE_ENV;
  process.env.NODE_ENV = 'production';
  try {
    await buildClientIfStale();
  } finally {
    process.env.NODE_ENV = nodeEnv;
  }
}

/** Headless Chromium with the flags this closed network needs (no background connections, no GPU). */
export async function launchBrowser(): Promise<Browser> {
  if (!existsSync(CHROMIUM)) {
    throw new Error(`No Chromium at ${CHROMIUM}. Install it with: apt-get update && apt-get install -y chromium`);
  }
  return chromium.launch({
    executablePath: CHROMIUM,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

/** Signs a page in as one of the demo people (password tallyard-demo) and waits for the Inbox, the first screen. */
export async function signInDemo(page: Page, baseUrl: string, email: string): Promise<void> {
  await page.goto(`${baseUrl}/`);
  await page.waitForURL('**/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('tallyard-demo');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL('**/inbox');
}
