import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import type { PayAppDetail, PayAppSummary } from '../../src/shared/schemas/pay-app';
import { browserTest } from './browser';

// The contract of record in headless Chromium (issue 11): on the demo job, where the owner is set to approve change
// orders too, the general contractor proposes a change order from the locked bid schedule and approves its side,
// the owner follows the e-mail's link and approves, and the bid schedule and the overview carry it; the
// subcontractor answers the demo's disputed line with a third quantity, and the general contractor certifies with
// each flag acknowledged. Then the owner's pay form (with its fee), the processing fees card and a waiver with its
// exceptions are photographed. Setup only (the project setting) goes through the API; the journey through screens.

const EMAIL = { sub: 'sub@tallyard.test', gc: 'gc@tallyard.test', owner: 'owner@tallyard.test' } as const;
const ITEM = '205';
const ADDED = 400;

const e2e = browserTest({ shots: '/tmp/shots-record', context: { viewport: { width: 1440, height: 1000 } } });
const { signedIn, api, snap } = e2e;
const mailTo = (since: number, to: string, subject: RegExp) => e2e.mailTo(since, to, subject, 15_000);

const tab = async (page: Page, projectId: string, path: string) => {
  await page.goto(`${e2e.server.url}/projects/${projectId}${path ? `/${path}` : ''}`);
};
const statusIs = (page: Page, number: number, label: string) =>
  page.getByRole('heading', { name: new RegExp(`^Pay application ${number}\\s+${label}$`) }).waitFor();

type BidItem = { id: string; itemNumber: string; contractQuantity: number; originalQuantity: number };

describe('the contract of record in the browser', () => {
  it('change order proposed and approved by both sides reaches the bid schedule and the overview; a third quantity; certify with flags acknowledged', async () => {
    const gc = await signedIn(EMAIL.gc);
    const owner = await signedIn(EMAIL.owner);
    const sub = await signedIn(EMAIL.sub);
    const { projects } = await api<{ projects: { id: string }[] }>(gc, 'GET', '/projects');
    const projectId = projects[0]!.id;
    // Setup: on this job the owner approves change orders too (a contract setting).
    await api(gc, 'PATCH', `/projects/${projectId}`, { ownerApprovesChangeOrders: true });
    const items = async () =>
      (await api<{ bidItems: BidItem[] }>(gc, 'GET', `/projects/${projectId}/bid-items`)).bidItems;
    const before = (await items()).find((i) => i.itemNumber === ITEM)!;

    // 1. The general contractor proposes from the locked bid schedule.
    await tab(gc, projectId, 'bid-items');
    await gc.getByRole('note').filter({ hasText: 'Contract locked' }).waitFor();
    await gc.getByRole('link', { name: `Propose a change order for ${ITEM}` }).click();
    const form = gc.getByRole('form', { name: 'Propose a change order' });
    await form.waitFor();
    await form.getByLabel('Title').fill('Borrow area east extension');
    await form
      .getByLabel('Reason (required)')
      .fill('Unsuitable material found below the east pad; the survey of 2 Dec shows the extra volume.');
    await form.getByLabel(/^Change \(CY, minus to reduce\)/).fill(String(ADDED));
    await snap(gc, 'gc-proposes-change-order');
    let mails = e2e.server.mailbox.messages().length;
    await form.getByRole('button', { name: 'Propose change order' }).click();
    const proposed = await mailTo(mails, EMAIL.owner, /^Change order \d+ proposed: Borrow area east extension/);
    const link = proposed.text.match(/https?:\/\/\S+\/change-orders\/[\w-]+/)![0];
    expect(link.startsWith(`${e2e.server.url}/projects/${projectId}/change-orders/`)).toBe(true);
    const number = Number(proposed.subject.match(/^Change order (\d+)/)![1]);

    // The general contractor approves its side on the change order's page.
    const changeOrderId = link.split('/').at(-1)!;
    const decided = async (side: 'gcApproval' | 'ownerApproval') =>
      (await api<{ changeOrder: Record<string, unknown> }>(gc, 'GET', `/change-orders/${changeOrderId}`)).changeOrder[
        side
      ] !== null;
    await gc.goto(link);
    await gc.getByRole('heading', { name: 'Your decision (general contractor)' }).waitFor();
    await gc.getByRole('button', { name: 'Approve', exact: true }).click();
    await snap(gc, 'gc-approved-its-side');
    await expect.poll(() => decided('gcApproval'), { timeout: 15_000 }).toBe(true);

    // 2. The owner follows the e-mail's link and gives the last approval; the subcontractor is told.
    mails = e2e.server.mailbox.messages().length;
    await owner.goto(link);
    await snap(owner, 'owner-change-order');
    await owner.getByRole('heading', { name: 'Your decision (owner)' }).waitFor();
    await owner.getByLabel('Note').fill('Funded from the owner contingency.');
    await owner.getByRole('button', { name: 'Approve', exact: true }).click();
    await expect.poll(() => decided('ownerApproval'), { timeout: 15_000 }).toBe(true);
    await snap(owner, 'owner-approved');
    const approved = await mailTo(mails, EMAIL.sub, new RegExp(`^Change order ${number} approved`));
    expect(approved.text).toContain('Note: Funded from the owner contingency.');

    // 3. The bid schedule shows the current quantity with the original and the change order's number.
    const after = (await items()).find((i) => i.itemNumber === ITEM)!;
    expect(after.contractQuantity).toBeCloseTo(before.contractQuantity + ADDED, 4);
    expect(after.originalQuantity).toBe(before.originalQuantity);
    await tab(gc, projectId, 'bid-items');
    const row = gc
      .getByRole('table', { name: 'Bid schedule' })
      .getByRole('row')
      .filter({ hasText: `CO ` })
      .filter({
        has: gc.getByRole('cell', { name: ITEM, exact: true }),
      });
    await row.waitFor();
    expect(await row.textContent()).toMatch(new RegExp(`CO [\\d, ]*\\b${number}\\b`));
    await snap(gc, 'gc-bid-schedule-after');
    // The overview: original, approved change orders, current.
    await tab(gc, projectId, '');
    await gc.getByText('Approved change orders', { exact: true }).first().waitFor();
    await gc.getByText('Current contract sum', { exact: true }).first().waitFor();
    await snap(gc, 'gc-overview-after');

    // 4. The subcontractor answers the demo's disputed line with a third quantity and submits the revision.
    const apps = (await api<{ payApps: PayAppSummary[] }>(sub, 'GET', `/projects/${projectId}/pay-apps`)).payApps;
    const open = apps.find((a) => a.status === 'returned')!;
    expect(open).toBeDefined();
    let app = (await api<{ payApp: PayAppDetail }>(sub, 'GET', `/pay-apps/${open.id}`)).payApp;
    const dispute = app.disputes.find((d) => d.status === 'open')!;
    const line = app.lines.find((l) => l.id === dispute.lineId)!;
    const third = Math.round(((line.thisPeriodQuantity + dispute.counterQuantity) / 2) * 10) / 10;
    await sub.goto(`${e2e.server.url}/projects/${projectId}/pay-apps/${app.id}`);
    await statusIs(sub, app.number, 'Returned');
    const answer = sub.getByRole('group', { name: new RegExp(`^Item ${line.itemNumber}: `) });
    await answer.getByRole('radio', { name: 'Propose another quantity' }).check();
    await answer.getByLabel(`Quantity this period (${line.payUnit})`).fill(String(third));
    await answer
      .getByLabel('Reason for this quantity (required)')
      .fill('Re-measured with the inspector: the haul road section was half done at period end.');
    await snap(sub, 'sub-proposes-third-quantity');
    await sub.getByRole('button', { name: `Save revision ${app.revision + 1}`, exact: true }).click();
    await statusIs(sub, app.number, 'Draft');
    app = (await api<{ payApp: PayAppDetail }>(sub, 'GET', `/pay-apps/${app.id}`)).payApp;
    expect(app.lines.find((l) => l.id === line.id)!.thisPeriodQuantity).toBe(third);
    await sub.getByRole('button', { name: `Submit revision ${app.revision}`, exact: true }).click();
    await sub
      .getByRole('dialog', { name: `Submit pay application ${app.number}?` })
      .getByRole('button', { name: 'Submit', exact: true })
      .click();
    await statusIs(sub, app.number, 'Submitted');

    // 5. The general contractor approves every line and certifies, acknowledging each flag.
    await gc.goto(`${e2e.server.url}/projects/${projectId}/pay-apps/${app.id}`);
    await statusIs(gc, app.number, 'Submitted');
    const bulk = gc.getByRole('button', { name: /^Approve \d+ undecided lines?$/ });
    const undecided = Number((await bulk.textContent())!.match(/\d+/)![0]);
    await bulk.click();
    await gc
      .getByRole('button', { name: `Save review of ${undecided} line${undecided === 1 ? '' : 's'}`, exact: true })
      .click();
    await statusIs(gc, app.number, 'In review');
    await gc.getByRole('button', { name: 'Certify for payment' }).click();
    const confirm = gc.getByRole('dialog', { name: `Certify pay application ${app.number}?` });
    await confirm.waitFor();
    const flags = confirm.getByRole('checkbox');
    expect(await flags.count()).toBeGreaterThan(0);
    expect(await confirm.getByRole('button', { name: 'Certify', exact: true }).isDisabled()).toBe(true);
    await flags.first().check();
    await snap(gc, 'gc-certify-flags');
    for (let i = 1; i < (await flags.count()); i++) await flags.nth(i).check();
    mails = e2e.server.mailbox.messages().length;
    await confirm.getByRole('button', { name: 'Certify', exact: true }).click();
    await statusIs(gc, app.number, 'Certified');
    await snap(gc, 'gc-certified');
    await mailTo(mails, EMAIL.sub, new RegExp(`^Conditional lien waiver requested: pay application ${app.number}`));

    // 6. Pictures of the money screens: the owner's pay form with its fee, the fees card, a waiver's exceptions.
    await tab(owner, projectId, 'payments');
    const payForm = owner.getByRole('form', { name: `Pay application ${app.number}` });
    await payForm.getByRole('radio', { name: /Card/ }).check();
    await payForm.getByLabel('What you are charged').waitFor();
    await snap(owner, 'owner-pay-form-with-fee');
    await tab(gc, projectId, 'payments');
    await gc.getByRole('form', { name: 'Who bears processing fees' }).waitFor();
    await snap(gc, 'gc-processing-fees');
    await tab(sub, projectId, 'waivers');
    const waivers = sub.getByRole('region', { name: `Waivers for pay application ${app.number}` });
    await waivers
      .getByRole('button', { name: /^Issue for / })
      .first()
      .click();
    await waivers.getByRole('form').first().waitFor();
    await snap(sub, 'sub-waiver-exceptions');
    await Promise.all([sub, gc, owner].map((p) => p.context().close()));
  }, 180_000);
});
