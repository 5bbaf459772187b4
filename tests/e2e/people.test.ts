import { beforeAll, describe, expect, it } from 'vitest';
import { projects } from '../../server/db/schema';
import { browserTest } from './browser';

// The People screen as each side sees it (issue 10): a company's admin invites to and removes from its own
// company's seat only; a person of a seat manages nobody.
const e2e = browserTest();
const { snap: shot } = e2e;
let projectId: string;

beforeAll(async () => {
  const [project] = await e2e.server.database.db.select().from(projects).limit(1);
  projectId = project!.id;
});

async function people(email: string) {
  const page = await e2e.signedIn(email);
  await page.goto(`${e2e.server.url}/projects/${projectId}/people`);
  await page.getByRole('table', { name: 'People on this job' }).waitFor();
  return page;
}

describe('People screen', () => {
  it("the general contractor's admin invites to its own seat and may remove its own people only", async () => {
    const page = await people('admin@tallyard.test');
    const table = page.getByRole('table', { name: 'People on this job' });
    const owen = table.getByRole('row', { name: /Owen Halvorsen/ });
    await owen.getByRole('button', { name: 'Remove from job' }).waitFor();
    expect(
      await table
        .getByRole('row', { name: /Rosa Delgado/ })
        .getByRole('button')
        .count(),
    ).toBe(0);
    const invite = page.getByRole('form', { name: 'Invite someone' });
    expect(await invite.getByLabel('Role on this job').inputValue()).toBe('General contractor');
    await shot(page, 'people-gc-admin');
    await owen.getByRole('button', { name: 'Remove from job' }).click();
    await page.getByRole('dialog', { name: 'Remove Owen Halvorsen from this job?' }).waitFor();
    await shot(page, 'people-remove-confirm');
    await page.getByRole('button', { name: 'Keep' }).click();
    await page.close();
  });

  it('a person of a seat sees the people and manages nobody', async () => {
    for (const email of ['gc@tallyard.test', 'owner@tallyard.test']) {
      const page = await people(email);
      expect(await page.getByRole('button', { name: /Remove from/ }).count()).toBe(0);
      expect(await page.getByRole('form', { name: 'Invite someone' }).count()).toBe(0);
      await shot(page, `people-${email.split('@')[0]}`);
      await page.close();
    }
  });
});
