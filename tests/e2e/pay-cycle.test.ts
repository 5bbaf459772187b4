import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import type { CaughtMail } from '../../server/integrations/mailer/smtp-sink';
import type { PayAppStatus } from '../../src/shared/constants';
import type { PayAppDetail, PayAppSummary } from '../../src/shared/schemas/pay-app';
import { browserTest, openTab } from './browser';

// The monthly loop in headless Chromium, three people in three browser contexts: the subcontractor submits, the
// general contractor disputes a line, the subcontractor proposes a third quantity and submits the revision, the
// general contractor approves every line and certifies, and the owner sees the certified application. Data that
// is only setup (a ready tally) goes through the API with the person's own session; every step of the journey
// goes through the screens. Screenshots land in /tmp, never in the repository.

const EMAIL = { sub: 'sub@tallyard.test', gc: 'gc@tallyard.test', owner: 'owner@tallyard.test' } as const;
const REASON = 'Survey pickup shows less than the tally; see the cross sections of 28 Oct';
const OPEN: readonly PayAppStatus[] = ['draft', 'submitted', 'in_review', 'returned'];

const e2e = browserTest({ shots: '/tmp/tallyard-e2e/pay-cycle', context: { viewport: { width: 1440, height: 1000 } } });
const { signedIn, api, snap, mailTo } = e2e;

const detailOf = async (page: Page, id: string) =>
  (await api<{ payApp: PayAppDetail }>(page, 'GET', `/pay-apps/${id}`)).payApp;

/** The link to the pay application in a hand-off e-mail; the person follows it. */
function linkIn(mail: CaughtMail, payAppId: string): string {
  const link = mail.text.match(/https?:\/\/\S+\/pay-apps\/[\w-]+/)?.[0];
  expect(link).toBe(`${e2e.server.url}/projects/${projectId}/pay-apps/${payAppId}`);
  return link!;
}

/** The detail screen's heading carries the status label: wait until it reads `label`. */
async function statusIs(page: Page, number: number, label: string) {
  await page.getByRole('heading', { name: new RegExp(`^Pay application ${number}\\s+${label}$`) }).waitFor();
}

/** From the Jobs list, through the job and its Pay apps tab, to the list of applications. */
async function openPayAppsTab(page: Page) {
  await openTab(page, 'Pay apps');
  await page.waitForURL(/\/projects\/[\w-]+\/pay-apps$/);
}

const iso = (d: Date) => d.toISOString().slice(0, 10);

/** The next period: the day after the last one ended through the end of that month (this month when none). */
function nextPeriod(apps: PayAppSummary[]) {
  const lastEnd = apps
    .map((a) => a.periodEnd)
    .sort()
    .at(-1);
  const now = new Date();
  const start = lastEnd
    ? new Date(`${lastEnd}T00:00:00Z`)
    : new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), 0));
  start.setUTCDate(start.getUTCDate() + 1);
  return {
    periodStart: iso(start),
    periodEnd: iso(new Date(Date.UTC(start.getUTCFullYear(), start.getUTCMonth() + 1, 0))),
  };
}

/** The subcontractor submits the draft through its Submit button and the confirmation. */
async function submitThroughScreen(sub: Page, app: PayAppDetail) {
  const name = app.revision > 0 ? `Submit revision ${app.revision}` : 'Submit';
  await sub.getByRole('button', { name, exact: true }).click();
  const dialog = sub.getByRole('dialog', { name: `Submit pay application ${app.number}?` });
  await dialog.waitFor();
  await snap(sub, `sub-confirms-submit-rev${app.revision}`);
  await dialog.getByRole('button', { name: 'Submit', exact: true }).click();
  await statusIs(sub, app.number, 'Submitted');
}

let projectId = '';

describe('pay cycle in the browser', () => {
  it('runs submit, dispute, revise, certify across the three roles with an e-mail at each hand-off', async () => {
    const sub = await signedIn(EMAIL.sub);
    const gc = await signedIn(EMAIL.gc);
    const owner = await signedIn(EMAIL.owner);

    // The subcontractor opens the job's Pay apps tab.
    await openPayAppsTab(sub);
    projectId = sub.url().match(/\/projects\/([\w-]+)\/pay-apps$/)![1]!;
    const apps = (await api<{ payApps: PayAppSummary[] }>(sub, 'GET', `/projects/${projectId}/pay-apps`)).payApps;
    const open = apps.find((a) => OPEN.includes(a.status));
    await snap(sub, 'sub-pay-apps-list');

    let app: PayAppDetail;
    if (open) {
      // The demo holds an open application: the journey runs on it.
      await sub
        .getByRole('table', { name: 'Pay applications' })
        .getByRole('link', { name: `Pay app ${open.number}`, exact: true })
        .click();
      app = await detailOf(sub, open.id);
      await statusIs(
        sub,
        app.number,
        open.status === 'in_review' ? 'In review' : open.status[0]!.toUpperCase() + open.status.slice(1),
      );
    } else {
      // Setup: a ready tally in the next period, through the API.
      const period = nextPeriod(apps);
      const { bidItems } = await api<{ bidItems: { id: string; itemNumber: string; payUnit: string }[] }>(
        sub,
        'GET',
        `/projects/${projectId}/bid-items`,
      );
      const item = bidItems.find((b) => b.payUnit === 'CY') ?? bidItems[0]!;
      const { tally } = await api<{ tally: { id: string } }>(sub, 'POST', `/projects/${projectId}/tallies`, {
        bidItemId: item.id,
        measuredOn: period.periodStart,
        title: 'End-of-month pickup, browser test',
        method: 'manual',
        quantity: 1240.5,
        manualBasis: 'Loads counted at the spoil pile by the foreman, browser test',
      });
      await api(sub, 'POST', `/tallies/${tally.id}/ready`);

      // Journey: compile the period's application through the dialog.
      await sub.getByRole('button', { name: 'New pay application' }).click();
      const dialog = sub.getByRole('dialog', { name: 'New pay application' });
      await dialog.getByLabel('Period starts').fill(period.periodStart);
      await dialog.getByLabel('Period ends').fill(period.periodEnd);
      await snap(sub, 'sub-new-pay-app');
      await dialog.getByRole('button', { name: 'Compile pay application' }).click();
      await sub.waitForURL(/\/pay-apps\/[\w-]+$/);
      const id = sub.url().split('/').at(-1)!;
      app = await detailOf(sub, id);
      expect(app.status).toBe('draft');
      expect(app.periodStart).toBe(period.periodStart);
      expect(app.lines.find((l) => l.bidItemId === item.id)?.thisPeriodQuantity).toBe(1240.5);
      await statusIs(sub, app.number, 'Draft');
    }
    const number = app.number;
    const linesTable = (page: Page) => page.getByRole('table', { name: `Lines of pay application ${number}` });

    // Not yet certified: the owner does not see it.
    await openPayAppsTab(owner);
    await owner.getByText(/Certified applications, ready for payment/).waitFor();
    expect(await owner.getByRole('link', { name: `Pay app ${number}`, exact: true }).count()).toBe(0);

    // A demo application left returned goes back through the subcontractor first.
    if (app.status === 'returned') {
      // No answer is chosen for the subcontractor: it takes each counter quantity here.
      const takes = sub.getByRole('radio', { name: /Take the counter quantity/ });
      for (let i = 0; i < (await takes.count()); i++) await takes.nth(i).check();
      await sub.getByRole('button', { name: `Save revision ${app.revision + 1}` }).click();
      await statusIs(sub, number, 'Draft');
      app = await detailOf(sub, app.id);
    }

    // 1. The subcontractor submits; the general contractor is told by e-mail.
    // (A demo application seeded as submitted or in review skips this step: it sent no e-mail here.)
    let mails = e2e.server.mailbox.messages().length;
    let reviewLink = `${e2e.server.url}/projects/${projectId}/pay-apps/${app.id}`;
    if (app.status === 'draft') {
      await snap(sub, 'sub-draft');
      await submitThroughScreen(sub, app);
      await snap(sub, 'sub-submitted');
      app = await detailOf(sub, app.id);
      reviewLink = linkIn(
        await mailTo(mails, EMAIL.gc, new RegExp(`^Pay application ${number}\\b.*ready for review$`)),
        app.id,
      );
    }
    expect(['submitted', 'in_review']).toContain(app.status);

    // 2. The general contractor follows the e-mail's link and disputes one line with a counter quantity.
    const line =
      app.lines.find((l) => l.thisPeriodQuantity > 0 && l.reviewStatus !== 'approved') ??
      app.lines.find((l) => l.thisPeriodQuantity > 0)!;
    expect(line).toBeDefined();
    const counter = Math.floor(line.thisPeriodQuantity * 0.9);
    await gc.goto(reviewLink);
    await statusIs(gc, number, app.status === 'in_review' ? 'In review' : 'Submitted');
    await linesTable(gc)
      .getByRole('combobox', { name: `Review of item ${line.itemNumber}` })
      .selectOption('dispute');
    await gc.getByLabel(`Reason for the dispute of item ${line.itemNumber}`).fill(REASON);
    await gc.getByLabel(`Counter quantity this period (${line.payUnit})`).fill(String(counter));
    await snap(gc, 'gc-disputes-line');
    mails = e2e.server.mailbox.messages().length;
    await gc.getByRole('button', { name: 'Save review of 1 line', exact: true }).click();
    // Returning asks first and lists the disputed line.
    const ask = gc.getByRole('dialog', { name: `Return pay application ${number} with 1 disputed line?` });
    await ask.getByText(`Item ${line.itemNumber}: counter`).waitFor();
    await snap(gc, 'gc-confirms-return');
    await ask.getByRole('button', { name: 'Return to the subcontractor' }).click();
    await statusIs(gc, number, 'Returned');
    // The line may carry an earlier, resolved dispute from the demo: this one is told apart by its reason.
    const thread = (page: Page) =>
      page.getByRole('article', { name: `Dispute on item ${line.itemNumber}` }).filter({ hasText: REASON });
    await thread(gc).getByText('Open', { exact: true }).waitFor();
    await snap(gc, 'gc-returned');
    const returned = await mailTo(
      mails,
      EMAIL.sub,
      new RegExp(`^Pay application ${number}\\b.*returned with \\d+ disputed line`),
    );
    expect(returned.text).toContain(`Item ${line.itemNumber}: ${REASON}`);

    // 3. The subcontractor follows the link, proposes a third quantity with its reason, and submits the revision.
    await sub.goto(linkIn(returned, app.id));
    await statusIs(sub, number, 'Returned');
    const answer = sub.getByRole('group', { name: new RegExp(`^Item ${line.itemNumber}: `) });
    // Nothing is chosen for the subcontractor: the save waits for an answer.
    expect(await sub.getByRole('button', { name: `Save revision ${app.revision + 1}`, exact: true }).isDisabled()).toBe(
      true,
    );
    // Any other open dispute (the demo's own) takes its counter quantity.
    const takes = sub.getByRole('radio', { name: /Take the counter quantity/ });
    for (let i = 0; i < (await takes.count()); i++) await takes.nth(i).check();
    const proposed = Math.floor(line.thisPeriodQuantity * 0.95);
    await answer.getByRole('radio', { name: 'Propose another quantity' }).check();
    await answer.getByLabel(`Quantity this period (${line.payUnit})`).fill(String(proposed));
    await answer
      .getByLabel('Reason for this quantity (required)')
      .fill('Walked the cut with the survey crew: the last section was short of the plan.');
    await snap(sub, 'sub-answers-dispute');
    await sub.getByRole('button', { name: `Save revision ${app.revision + 1}`, exact: true }).click();
    await statusIs(sub, number, 'Draft');
    const revised = await detailOf(sub, app.id);
    expect(revised.revision).toBe(app.revision + 1);
    expect(revised.lines.find((l) => l.id === line.id)?.thisPeriodQuantity).toBe(proposed);
    expect(revised.disputes.find((d) => d.lineId === line.id && d.revision === app.revision)?.resolution).toBe(
      'quantity_proposed',
    );
    await thread(sub).getByText('Another quantity proposed').waitFor();
    mails = e2e.server.mailbox.messages().length;
    await submitThroughScreen(sub, revised);
    await snap(sub, 'sub-resubmitted');
    const resubmitted = await mailTo(
      mails,
      EMAIL.gc,
      new RegExp(`^Pay application ${number} \\(revision ${revised.revision}\\).*ready for review$`),
    );

    // 4. The general contractor approves every line and certifies; the owner is asked for payment.
    await gc.goto(linkIn(resubmitted, app.id));
    await statusIs(gc, number, 'Submitted');
    const certifyButton = gc.getByRole('button', { name: 'Certify for payment' });
    expect(await certifyButton.isDisabled()).toBe(true);
    // Lines approved in the first review stay approved; the bulk button approves the others, and the review saves those.
    const bulk = gc.getByRole('button', { name: /^Approve \d+ undecided lines?$/ });
    const undecided = Number((await bulk.textContent())!.match(/\d+/)![0]);
    expect(undecided).toBeGreaterThan(0);
    await bulk.click();
    await gc
      .getByRole('button', { name: `Save review of ${undecided} line${undecided === 1 ? '' : 's'}`, exact: true })
      .click();
    await statusIs(gc, number, 'In review');
    await linesTable(gc).getByText(`${revised.lines.length} of ${revised.lines.length} approved`).waitFor();
    await snap(gc, 'gc-all-approved');
    mails = e2e.server.mailbox.messages().length;
    await certifyButton.click();
    const confirm = gc.getByRole('dialog', { name: `Certify pay application ${number}?` });
    await confirm.waitFor();
    // Each flag (beyond the band, no evidence) is acknowledged before the certify button opens.
    const flags = confirm.getByRole('checkbox');
    const flagCount = await flags.count();
    expect(flagCount).toBeGreaterThan(0);
    expect(await confirm.getByRole('button', { name: 'Certify', exact: true }).isDisabled()).toBe(true);
    for (let i = 0; i < flagCount; i++) await flags.nth(i).check();
    await snap(gc, 'gc-confirms-certify');
    await confirm.getByRole('button', { name: 'Certify', exact: true }).click();
    await statusIs(gc, number, 'Certified');
    await snap(gc, 'gc-certified');
    const certified = await detailOf(gc, app.id);
    expect(certified.status).toBe('certified');
    expect(certified.certifiedBy).toBe('Owen Halvorsen');
    const askForPayment = await mailTo(
      mails,
      EMAIL.owner,
      new RegExp(`^Pay application ${number} \\(revision ${revised.revision}\\).*is certified`),
    );
    const currentDue = (await gc
      .locator('dt', { hasText: /^Due on this application$/ })
      .locator('xpath=following-sibling::dd')
      .textContent())!.trim();
    expect(askForPayment.subject).toContain(`${currentDue} due`);

    // 5. The owner sees it on the Pay apps tab, certified, and opens it: read only, the same amount due.
    await owner.reload();
    const row = owner
      .getByRole('table', { name: 'Pay applications' })
      .getByRole('row')
      .filter({ has: owner.getByRole('link', { name: `Pay app ${number}`, exact: true }) });
    await row.waitFor();
    expect(await row.textContent()).toContain('Certified');
    expect(await row.textContent()).toContain(currentDue);
    await snap(owner, 'owner-list');
    await row.getByRole('link', { name: `Pay app ${number}`, exact: true }).click();
    await statusIs(owner, number, 'Certified');
    expect(
      (await owner
        .locator('dt', { hasText: /^Due on this application$/ })
        .locator('xpath=following-sibling::dd')
        .textContent())!.trim(),
    ).toBe(currentDue);
    expect(await owner.getByRole('button', { name: /Certify|Submit|undecided line|Save review/ }).count()).toBe(0);
    expect(await linesTable(owner).getByRole('combobox').count()).toBe(0);
    await snap(owner, 'owner-detail');
    expect(linkIn(askForPayment, app.id)).toBe(owner.url());

    await Promise.all([sub, gc, owner].map((p) => p.context().close()));
  }, 120_000);
});
