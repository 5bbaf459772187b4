import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { payAppLines, tallies } from '../../server/db/schema';
import { makeWorld } from '../setup/factories';
import { FILES, makeTally } from '../setup/pay-cycle-factories';
import { makeCertifiedPayApp } from '../setup/payment-factories';
import { createTestApp, signedInAgent, TEST_ORIGIN, type TestApp } from '../setup/test-app';

// Product brief (roles) and issue 12 item 5: every line shows its backup to every role that can see the
// application; OWASP API Security Top 10 (2023) API1 (object level authorization): another project's person gets
// 404, and the owner sees nothing of an application before it is certified (tests/api/owner-visibility.test.ts).

let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
type Fixture = { appId: string; lineId: string; otherLineId: string; tallyId: string; evidenceId: string };
let certified: Fixture;
let inReview: Fixture;

async function billedApp(number: number, status: 'certified' | 'in_review'): Promise<Fixture> {
  const db = t.database.db;
  const app = await makeCertifiedPayApp(db, w.home.id, w.people.subcontractor.id, { number, status });
  const lines = await db.select().from(payAppLines).where(eq(payAppLines.payAppId, app.id));
  const [line, other] = lines as [(typeof lines)[0], (typeof lines)[0]];
  const base = { projectId: w.home.id, bidItemId: line.bidItemId, authorUserId: w.people.subcontractor.id };
  const first = await makeTally(db, { ...base, measuredOn: '2026-10-20', quantity: 700, status: 'draft' });
  const second = await makeTally(db, { ...base, measuredOn: '2026-10-05', quantity: 500, status: 'draft' });
  // A tally of the same item that is not billed on this application is not part of the line's backup.
  await makeTally(db, { ...base, measuredOn: '2026-10-06', quantity: 9, status: 'ready' });
  const sub = await signedInAgent(t.app, w.people.subcontractor.email);
  const upload = await sub
    .post(`/api/tallies/${first.id}/evidence`)
    .set('Origin', TEST_ORIGIN)
    .attach('files', FILES.pdf, 'ticket.pdf');
  expect(upload.status).toBe(201);
  for (const id of [first.id, second.id])
    await db.update(tallies).set({ status: 'billed', payAppId: app.id }).where(eq(tallies.id, id));
  return {
    appId: app.id,
    lineId: line.id,
    otherLineId: other.id,
    tallyId: first.id,
    evidenceId: upload.body.evidence[0].id,
  };
}

beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
  certified = await billedApp(1, 'certified');
  inReview = await billedApp(2, 'in_review');
}, 60_000);
afterAll(() => t.close());

const ROLES = ['subcontractor', 'general_contractor', 'owner', 'admin', 'subcontractor_admin', 'owner_admin'] as const;
const backup = (f: Fixture, lineId = f.lineId) => `/api/pay-apps/${f.appId}/lines/${lineId}/tallies`;

describe("a pay application line's backup", () => {
  it.each(ROLES)(
    'lists the billed tallies of the line, oldest first, with author, method and evidence count, for %s',
    async (role) => {
      const res = await (await signedInAgent(t.app, w.people[role].email)).get(backup(certified));
      expect(res.status).toBe(200);
      expect(res.body.line).toMatchObject({ id: certified.lineId, payAppId: certified.appId, payAppNumber: 1 });
      expect(
        res.body.tallies.map(
          (x: {
            measuredOn: string;
            quantity: number;
            method: string;
            evidenceCount: number;
            author: { name: string };
          }) => [x.measuredOn, x.quantity, x.method, x.evidenceCount, x.author.name],
        ),
      ).toEqual([
        ['2026-10-05', 500, 'manual', 0, w.people.subcontractor.email.split('@')[0]],
        ['2026-10-20', 700, 'manual', 1, w.people.subcontractor.email.split('@')[0]],
      ]);
    },
  );

  it('gives each role that sees the line its tallies and evidence files, served as attachments with nosniff', async () => {
    for (const role of ROLES) {
      const agent = await signedInAgent(t.app, w.people[role].email);
      const tally = await agent.get(`/api/tallies/${certified.tallyId}`);
      expect(tally.status, role).toBe(200);
      expect(tally.body.evidence.map((e: { fileName: string }) => e.fileName)).toEqual(['ticket.pdf']);
      const file = await agent.get(`/api/evidence/${certified.evidenceId}/download`);
      expect(file.status, role).toBe(200);
      expect(file.headers['content-disposition']).toMatch(/^attachment;/);
      expect(file.headers['x-content-type-options']).toBe('nosniff');
    }
  });

  it('answers 404 to a line of another application and to a line id that is not a line', async () => {
    const gc = await signedInAgent(t.app, w.people.general_contractor.email);
    expect((await gc.get(`/api/pay-apps/${certified.appId}/lines/${inReview.lineId}/tallies`)).status).toBe(404);
    expect((await gc.get(`/api/pay-apps/${certified.appId}/lines/not-a-line/tallies`)).status).toBe(404);
    const other = await gc.get(backup(certified, certified.otherLineId));
    expect(other.status).toBe(200);
    expect(other.body.tallies).toEqual([]);
  });

  it("answers 404 to another project's person for the backup, the tally and the file, as for ones that do not exist", async () => {
    const outsider = await signedInAgent(t.app, w.outsider.email);
    expect((await outsider.get(backup(certified))).status).toBe(404);
    expect((await outsider.get(`/api/tallies/${certified.tallyId}`)).status).toBe(404);
    expect((await outsider.get(`/api/evidence/${certified.evidenceId}/download`)).status).toBe(404);
  });

  it('shows the owner nothing of an application in review: no backup, no tally, no file, not in the tally list', async () => {
    for (const role of ['owner', 'owner_admin'] as const) {
      const agent = await signedInAgent(t.app, w.people[role].email);
      expect((await agent.get(backup(inReview))).status, role).toBe(404);
      expect((await agent.get(`/api/tallies/${inReview.tallyId}`)).status, role).toBe(404);
      expect((await agent.get(`/api/evidence/${inReview.evidenceId}/download`)).status, role).toBe(404);
      const list = await agent.get(`/api/projects/${w.home.id}/tallies`);
      const payApps = new Set(list.body.items.map((x: { payAppId: string | null }) => x.payAppId));
      expect(payApps.has(inReview.appId), role).toBe(false);
      expect(payApps.has(certified.appId), role).toBe(true);
    }
    for (const role of ['subcontractor', 'general_contractor'] as const) {
      const res = await (await signedInAgent(t.app, w.people[role].email)).get(backup(inReview));
      expect(res.status, role).toBe(200);
      expect(res.body.tallies).toHaveLength(2);
      // Lean: a backup lists summaries; inputs and the engine result come with GET of the one tally.
      for (const x of res.body.tallies as object[])
        expect(Object.keys(x)).not.toEqual(expect.arrayContaining(['inputs']));
      for (const x of res.body.tallies as object[])
        expect(Object.keys(x)).not.toEqual(expect.arrayContaining(['result']));
    }
  });
});
