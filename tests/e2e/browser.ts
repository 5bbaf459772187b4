import { existsSync, mkdirSync, rmSync } from 'node:fs';
import { chromium, type Browser, type BrowserContextOptions, type Locator, type Page } from 'playwright-core';
import { afterAll, beforeAll, expect } from 'vitest';
import { buildClientIfStale } from '../../scripts/build-client';
import type { CaughtMail } from '../../server/integrations/mailer/smtp-sink';
import { startTestServer } from '../setup/test-server';

/** Debian's chromium package; never a downloaded browser. CHROMIUM_PATH overrides it. */
const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

export type TestServer = Awaited<ReturnType<typeof startTestServer>>;

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

/** Jobs, then the first job (the demo job), then one of its tabs, through the navigation as a person would. */
export async function openTab(page: Page, tab: string): Promise<void> {
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Jobs' }).click();
  await page.getByRole('table', { name: 'Jobs' }).getByRole('link').first().click();
  await page.getByRole('navigation', { name: 'Project' }).getByRole('link', { name: tab }).click();
}

export type BrowserTestOptions = {
  /**
   * A folder of this file's own under /tmp, emptied first, for numbered screenshots (`01-name.png`). Without it,
   * screenshots are kept only when E2E_SCREENSHOTS names a folder, as `<prefix><name>.png`.
   */
  shots?: string;
  /** Put before each screenshot's name in the E2E_SCREENSHOTS folder (e.g. `pay-kinds-`). */
  prefix?: string;
  /** Options of every context `signedIn` opens (viewport, downloads). */
  context?: BrowserContextOptions;
  /** Passed to startTestServer. */
  server?: Parameters<typeof startTestServer>[0];
  /** How long the start (build when stale, server, browser) may take. */
  timeout?: number;
};

export type BrowserTest = {
  /** The app on a fresh test database of this file's own, seeded with the demo. */
  readonly server: TestServer;
  readonly browser: Browser;
  /** A page in a new browser context (its own cookies) signed in as one of the demo people. */
  signedIn(email: string, context?: BrowserContextOptions): Promise<Page>;
  /** A screenshot of a page (all of it) or of one element into the shots folder; nothing when there is none. */
  snap(target: Page | Locator, name: string): Promise<void>;
  /** The API with the page's own session cookie (setup and read-back only). The CSRF guard wants the origin. */
  api<T>(page: Page, method: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE', path: string, data?: unknown): Promise<T>;
  /** The path (`/projects/<id>`) of the first job on the signed-in person's Jobs list: the demo job. */
  projectPath(page: Page): Promise<string>;
  /** Waits for a new message (after the first `since`) to `to` whose subject matches, and returns it. */
  mailTo(since: number, to: string, subject: RegExp, timeout?: number): Promise<CaughtMail>;
};

/**
 * The start-up every browser test file shares: builds dist/ when stale, starts a test server of the file's own
 * (its own database, so no file sees another's data) and headless Chromium before the file's tests, and closes
 * both after them. Call it once at the top of a test file; `server` and `browser` are there inside the tests.
 */
export function browserTest(options: BrowserTestOptions = {}): BrowserTest {
  let server: TestServer | undefined;
  let browser: Browser | undefined;
  let shot = 0;
  const envShots = process.env.E2E_SCREENSHOTS;

  beforeAll(async () => {
    if (options.shots) {
      rmSync(options.shots, { recursive: true, force: true });
      mkdirSync(options.shots, { recursive: true });
    } else if (envShots) {
      mkdirSync(envShots, { recursive: true });
    }
    await ensureClientBuilt();
    server = await startTestServer(options.server);
    browser = await launchBrowser();
  }, options.timeout ?? 180_000);

  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  const started = <T>(value: T | undefined, what: string): T => {
    if (value === undefined) throw new Error(`the ${what} is not started: use it inside a test`);
    return value;
  };

  const t: BrowserTest = {
    get server() {
      return started(server, 'test server');
    },
    get browser() {
      return started(browser, 'browser');
    },
    async signedIn(email, context = options.context) {
      const page = await (await t.browser.newContext(context)).newPage();
      await signInDemo(page, t.server.url, email);
      return page;
    },
    async snap(target, name) {
      let path: string;
      if (options.shots) path = `${options.shots}/${String(++shot).padStart(2, '0')}-${name}.png`;
      else if (envShots) path = `${envShots}/${options.prefix ?? ''}${name}.png`;
      else return;
      await target.screenshot('goto' in target ? { path, fullPage: true } : { path });
    },
    async api<T>(page: Page, method: string, path: string, data?: unknown) {
      const url = t.server.url;
      const res = await page.request.fetch(`${url}/api${path}`, { method, data, headers: { origin: url } });
      if (!res.ok()) throw new Error(`${method} ${path} answered ${res.status()}: ${await res.text()}`);
      return (await res.json()) as T;
    },
    async projectPath(page) {
      await page.goto(`${t.server.url}/jobs`);
      const link = page.getByRole('main').getByRole('link').first();
      await link.waitFor();
      return /\/projects\/[^/]+/.exec((await link.getAttribute('href'))!)![0];
    },
    async mailTo(since, to, subject, timeout = 10_000) {
      const find = () =>
        t.server.mailbox
          .messages()
          .slice(since)
          .find((m) => m.to.includes(to) && subject.test(m.subject));
      await expect.poll(() => find()?.subject, { timeout }).toMatch(subject);
      return find()!;
    },
  };
  return t;
}
