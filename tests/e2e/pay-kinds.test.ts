import { writeFileSync } from 'node:fs';
import { PDFParse } from 'pdf-parse';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { browserTest } from './browser';

// The demo job (invented data) has one item of each way of paying, with its records dated before November and
// not yet on any application: plan quantity (402), measured on a worksheet (203), truck measure (303, one load on a
// truck not on the register), weight (401), a lump sum with stages (201), force account days drawing on the
// allowance item of their change order (FA-1), stored riprap (501) and a fuel adjustment and a credit. The October
// application is settled first through the API, then November is compiled on screen and its PDF read back.
// E2E_SCREENSHOTS=<dir> keeps a screenshot of each step.
const e2e = browserTest({ prefix: 'pay-kinds-', context: { viewport: { width: 1366, height: 900 } } });
const { signedIn: as, snap, projectPath } = e2e;
const SHOTS = process.env.E2E_SCREENSHOTS;

/** One API call from the page's own session (writes carry an idempotency key, as the client sends). */
async function call(page: Page, method: string, path: string, body?: unknown) {
  return page.evaluate(
    async ({ method, path, body }) => {
      const res = await fetch(path, {
        method,
        headers: {
          Accept: 'application/json',
          ...(body === undefined ? {} : { 'Content-Type': 'application/json' }),
          ...(method === 'GET' ? {} : { 'Idempotency-Key': crypto.randomUUID() }),
        },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
      return { status: res.status, body: await res.json().catch(() => null) };
    },
    { method, path, body },
  );
}
const money = (cents: number) =>
  `${cents < 0 ? '-' : ''}$${(Math.abs(cents) / 100).toLocaleString('en-US', { minimumFractionDigits: 2 })}`;

type Row = {
  kind: string;
  itemNumber: string;
  thisPeriodCents: number;
  storedMaterialsCents: number;
  completedAndStoredCents: number;
};

describe('one item of each way of paying through a new pay application, read back from its PDF', () => {
  let path: string;
  let projectId: string;
  let sub: Page;
  let gc: Page;

  it('settles the open October application (the subcontractor takes the counter, the contractor certifies)', async () => {
    sub = await as('sub@tallyard.test');
    gc = await as('gc@tallyard.test');
    path = await projectPath(sub);
    projectId = path.split('/')[2]!;
    const apps = (await call(sub, 'GET', `/api/projects/${projectId}/pay-apps`)).body;
    const list = (apps.payApps ?? apps.items) as { id: string; status: string }[];
    const open = list.find((a) => !['certified', 'paid', 'partially_paid'].includes(a.status))!;
    let app = (await call(sub, 'GET', `/api/pay-apps/${open.id}`)).body.payApp;
    const disputed = (app.disputes as { lineId: string; status: string }[]).filter((d) => d.status === 'open');
    const revised = await call(sub, 'POST', `/api/pay-apps/${app.id}/revise`, {
      expectedRevision: app.revision,
      lines: disputed.map((d) => ({ lineId: d.lineId, action: 'accept' })),
    });
    expect(revised.status).toBe(200);
    app = revised.body.payApp;
    expect((await call(sub, 'POST', `/api/pay-apps/${app.id}/submit`, { expectedRevision: app.revision })).status).toBe(
      200,
    );
    const lines = (app.lines as { id: string }[]).map((l) => ({ lineId: l.id, decision: 'approve' }));
    expect(
      (await call(gc, 'POST', `/api/pay-apps/${app.id}/review`, { expectedRevision: app.revision, lines })).status,
    ).toBe(200);
    const flags = (await call(gc, 'GET', `/api/pay-apps/${app.id}`)).body.payApp.flags as { key: string }[];
    const certified = await call(gc, 'POST', `/api/pay-apps/${app.id}/certify`, {
      expectedRevision: app.revision,
      reauthPassword: 'tallyard-demo',
      acknowledgedFlags: flags.map((f) => f.key),
    });
    expect(certified.status).toBe(200);
  });

  it('the contractor dates the last stage of item 201 in the stage editor; a wrong share is named first', async () => {
    await gc.goto(`${e2e.server.url}${path}/pay-basis`);
    await gc.getByRole('button', { name: 'Edit stages' }).click();
    const form = gc.getByRole('form', { name: 'Stages of item 201' });
    await form.getByLabel('Stage 3 share of the lump sum, percent').fill('25');
    await form.getByRole('button', { name: 'Save stages' }).click();
    await expect
      .poll(() => form.getByRole('list', { name: 'What to correct' }).textContent())
      .toContain('The stages add up to 105 %; they must add up to 100 %');
    await snap(gc, 'stage-editor-refused');
    // On a phone each row stacks its boxes with their labels.
    await gc.setViewportSize({ width: 390, height: 844 });
    await form.getByLabel('Stage 3 day done').waitFor();
    await snap(gc, 'stage-editor-phone');
    await gc.setViewportSize({ width: 1366, height: 900 });
    await form.getByLabel('Stage 3 share of the lump sum, percent').fill('20');
    await form.getByLabel('Stage 3 day done').fill('2026-11-20');
    await form.getByRole('button', { name: 'Save stages' }).click();
    await gc.getByText('3 stages, 3 done.').waitFor();
    await snap(gc, 'pay-basis');
  });

  it('the subcontractor compiles November on screen: every kind has its line', async () => {
    await sub.goto(`${e2e.server.url}${path}/pay-apps`);
    await sub.getByRole('button', { name: 'New pay application' }).click();
    await sub.getByLabel('Period starts').fill('2026-11-01');
    await sub.getByLabel('Period ends').fill('2026-11-30');
    await sub.getByRole('button', { name: 'Compile pay application' }).click();
    const sov = sub.getByRole('table', { name: /Schedule of values of pay application/ });
    await sov.waitFor();
    await sub.getByRole('heading', { name: /held out of this application/ }).waitFor();
    // Lines paid from tickets have the tickets as backup: no "no tally behind it" flag on 303 or 401.
    expect(await sub.getByText(/Item 303: .* no tally behind it/).count()).toBe(0);
    await sub.getByText(/Compiled from \d+ tallies, \d+ tickets and 1 force account day/).waitFor();
    await snap(sub, 'new-application');
  });

  it('pays each kind from its own record, and the PDF prints the same totals', async () => {
    const apps = (await call(gc, 'GET', `/api/projects/${projectId}/pay-apps`)).body;
    const list = (apps.payApps ?? apps.items) as { id: string; number: number }[];
    const latest = list.reduce((a, b) => (a.number > b.number ? a : b));
    const app = (await call(sub, 'GET', `/api/pay-apps/${latest.id}`)).body.payApp;
    const row = (item: string) => (app.package.schedule as Row[]).find((r) => r.itemNumber === item)!;
    // Truck measure (303) and weight (401) from their tickets; the H-19 load is held out with its reason.
    expect(row('303').thisPeriodCents).toBeGreaterThan(0);
    expect(row('401').thisPeriodCents).toBeGreaterThan(0);
    expect(app.ticketHolds).toEqual([
      expect.objectContaining({ itemNumber: '303', label: 'H-19', reasons: ['Truck not on the register'] }),
    ]);
    // The lump sum by stages: every stage now has its day, so it stands at its whole value (the demo's August
    // application had already paid it in full from a tally, so nothing more is due on it).
    expect(row('201').completedAndStoredCents).toBe(
      (row('201') as Row & { scheduledValueCents: number }).scheduledValueCents,
    );
    // Plan quantity (402) at its percent complete; stored riprap on 501; the signed force account day on FA-1.
    expect(row('402').completedAndStoredCents).toBeGreaterThan(0);
    expect(row('501').storedMaterialsCents).toBeGreaterThan(0);
    expect(row('FA-1')).toMatchObject({ kind: 'force_account' });
    expect(row('FA-1').thisPeriodCents).toBeGreaterThan(0);
    expect(row('203')).toBeTruthy();
    const amount = (key: string) =>
      (app.package.summary as { key: string; amountCents: number }[]).find((s) => s.key === key)!.amountCents;
    expect(amount('adjustments')).not.toBe(0);
    // The screen's summary lines equal the API's.
    await sub.reload();
    for (const s of app.package.summary as { key: string; amountCents: number }[]) {
      expect(await sub.locator(`[data-summary="${s.key}"] dd`).textContent(), s.key).toBe(money(s.amountCents));
    }
    // The PDF, fetched as the contractor would download it, read back as text.
    const b64 = await gc.evaluate(async (id) => {
      const bytes = new Uint8Array(await (await fetch(`/api/pay-apps/${id}/export.pdf`)).arrayBuffer());
      let text = '';
      for (const b of bytes) text += String.fromCharCode(b);
      return btoa(text);
    }, app.id);
    if (SHOTS) writeFileSync(`${SHOTS}/pay-kinds-application.pdf`, Buffer.from(b64, 'base64'));
    const parser = new PDFParse({ data: new Uint8Array(Buffer.from(b64, 'base64')) });
    const text = (await parser.getText()).text.replace(/\s+/g, ' ');
    await parser.destroy();
    for (const key of ['completedAndStored', 'retainage', 'adjustments', 'currentDue', 'balanceToFinish'])
      expect(text).toContain(money(amount(key)));
    expect(text).toContain(`Due on this application ${money(amount('currentDue'))}`);
    const t = app.package.totals as { scheduledValueCents: number; thisPeriodCents: number; retainageCents: number };
    expect(text).toMatch(
      new RegExp(
        `Total ${money(t.scheduledValueCents).replace(/[$.]/g, '\\$&')} .*${money(t.thisPeriodCents).replace(/[$.]/g, '\\$&')}`,
      ),
    );
    expect(text).toContain('Tickets held out');
    expect(text).toContain('Held: Truck not on the register');
    await sub.getByRole('table', { name: /Schedule of values/ }).scrollIntoViewIfNeeded();
    await snap(sub, 'schedule');
    await sub.context().close();
    await gc.context().close();
  });
});
