import type { BrowserContext, Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { PROJECT_TABS } from '../../src/app/project-tabs';
import { browserTest, signInDemo } from './browser';

// Every main screen of the demo job, for each role, at a phone width (390 px) and a laptop width (1366 px): the page
// is never wider than the window (wide tables scroll inside their own box or turn into cards), and no page logs a
// console error or throws; on the laptop every project tab is in sight. E2E_SCREENSHOTS=<dir> keeps a screenshot of each screen at each width.
const e2e = browserTest();
const WIDTHS = [390, 1366] as const;

type Problem = string;

/** Opens a screen and waits until it has settled: its heading is drawn and nothing is loading. */
async function openScreen(page: Page, path: string): Promise<void> {
  await page.goto(`${e2e.server.url}${path}`);
  await page.waitForLoadState('networkidle');
  await page.locator('main h1, main h2').first().waitFor();
  await page.waitForFunction(() => !document.querySelector('[aria-busy="true"]'), undefined, { timeout: 10_000 });
}

async function overflow(page: Page): Promise<number> {
  return page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
}

/** On a laptop every project tab is in sight: none hidden behind the tab bar's own sideways scroll. */
async function hiddenTabs(page: Page): Promise<string[]> {
  return page.getByRole('navigation', { name: 'Project' }).evaluate((nav) => {
    const box = nav.getBoundingClientRect();
    return [...nav.querySelectorAll('a')]
      .filter((a) => {
        const r = a.getBoundingClientRect();
        return r.left < box.left - 1 || r.right > box.right + 1;
      })
      .map((a) => a.textContent ?? '');
  });
}

/** The screens a person of the demo job can open: the tabs, and one of each detail screen they can see. */
async function screensOf(page: Page): Promise<string[]> {
  await page.goto(`${e2e.server.url}/jobs`);
  const jobLink = page.getByRole('main').getByRole('link').first();
  await jobLink.waitFor();
  const href = (await jobLink.getAttribute('href'))!;
  const projectPath = /\/projects\/[^/]+/.exec(href)![0];
  const paths = [
    '/inbox',
    '/jobs',
    '/account/password',
    ...PROJECT_TABS.map((t) => `${projectPath}${t.path ? `/${t.path}` : ''}`),
  ];
  for (const [tab, pattern] of [
    ['pay-apps', /\/pay-apps\/[^/?#]+$/],
    ['tallies', /\/tallies\/[^/?#]+$/],
    ['change-orders', /\/change-orders\/[^/?#]+$/],
  ] as const) {
    await openScreen(page, `${projectPath}/${tab}`);
    const hrefs = await page
      .getByRole('main')
      .locator('a[href]')
      .evaluateAll((as) => as.map((a) => a.getAttribute('href')!));
    const detail = hrefs.find((h) => pattern.test(h));
    if (detail) paths.push(detail);
  }
  return paths;
}

async function walk(
  context: BrowserContext,
  email: string,
  pathsOf: (page: Page) => Promise<string[]> = screensOf,
): Promise<{ problems: Problem[]; seen: number }> {
  const page = await context.newPage();
  const problems: Problem[] = [];
  let where = 'sign-in';
  page.on('console', (m) => {
    if (m.type() === 'error') problems.push(`${email} ${where}: console error: ${m.text()}`);
  });
  page.on('pageerror', (e) => problems.push(`${email} ${where}: uncaught ${e.message}`));
  await signInDemo(page, e2e.server.url, email);
  const paths = await pathsOf(page);
  for (const width of WIDTHS) {
    await page.setViewportSize({ width, height: 900 });
    for (const path of paths) {
      where = `${path} at ${width} px`;
      await openScreen(page, path);
      const extra = await overflow(page);
      if (extra > 1) problems.push(`${email} ${where}: the page is ${extra} px wider than the window`);
      if (width >= 1024 && path.startsWith('/projects/')) {
        const hidden = await hiddenTabs(page);
        if (hidden.length > 0) problems.push(`${email} ${where}: tabs out of sight: ${hidden.join(', ')}`);
      }
      const name = `${email.split('@')[0]}-${width}-${path.replace(/^\/projects\/[^/]+/, 'job').replace(/[^a-z0-9]+/gi, '-')}`;
      await e2e.snap(page, name);
    }
  }
  await page.close();
  return { problems, seen: paths.length };
}

describe('every main screen at 390 px and 1366 px', () => {
  for (const email of ['sub@tallyard.test', 'gc@tallyard.test', 'owner@tallyard.test']) {
    it(`fits the window and logs no console error, for ${email}`, async () => {
      const context = await e2e.browser.newContext();
      const { problems, seen } = await walk(context, email);
      await context.close();
      expect(seen).toBeGreaterThan(PROJECT_TABS.length);
      expect(problems).toEqual([]);
    }, 240_000);
  }

  it('fits the window and logs no console error, for the company admin (admin@tallyard.test), company page included', async () => {
    const context = await e2e.browser.newContext();
    const { problems, seen } = await walk(context, 'admin@tallyard.test', async (page) => {
      await openScreen(page, '/company');
      // The demo company's people, with their seats, and the admin link in the header.
      await page.getByRole('table', { name: 'People of the company' }).waitFor();
      await page.getByRole('link', { name: 'Company' }).first().waitFor();
      return ['/inbox', '/jobs', '/company', '/account/password'];
    });
    await context.close();
    expect(seen).toBe(4);
    expect(problems).toEqual([]);
  }, 240_000);
});
