import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEvents, payAppLines } from '../../server/db/schema';
import { makeWorld } from '../setup/factories';
import { makeCertifiedPayApp } from '../setup/payment-factories';
import { registeredRoutes } from '../setup/routes';
import { createTestApp, signedInAgent, TEST_ORIGIN, type TestApp } from '../setup/test-app';

// Product brief (roles): the owner sees certified applications. OWASP API Security Top 10 (2023) API1 (object
// level authorization) and API3 (object property level): what the application answers 404 for must not be
// readable through its audit, its payments, its exports or the project trail either. The routes are read from the
// router, so a new route that names a pay application is checked without being listed here.

let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
let appId: string;
let lineIds: string[];

beforeAll(async () => {
  t = await createTestApp();
  const db = t.database.db;
  w = await makeWorld(db, t.auth);
  const app = await makeCertifiedPayApp(db, w.home.id, w.people.subcontractor.id, { status: 'draft' });
  appId = app.id;
  lineIds = (await db.select().from(payAppLines).where(eq(payAppLines.payAppId, app.id))).map((l) => l.id);
  // A real hand-off leaves events: submitted, then reviewed with a dispute (returned).
  const sub = await signedInAgent(t.app, w.people.subcontractor.email);
  expect((await sub.post(`/api/pay-apps/${app.id}/submit`).send({ expectedRevision: 0 })).status).toBe(200);
  const gc = await signedInAgent(t.app, w.people.general_contractor.email);
  const review = { expectedRevision: 0, lines: [{ lineId: lineIds[0], decision: 'dispute', reason: 'Short of the survey', counterQuantity: 1000 }] };
  expect((await gc.post(`/api/pay-apps/${app.id}/review`).send(review)).status).toBe(200);
}, 60_000);
afterAll(() => t?.close());

/** A body each write route accepts, so the answer is the visibility rule's and not the schema's. */
const BODIES: Record<string, () => object> = {
  'POST /api/pay-apps/:payAppId/submit': () => ({ expectedRevision: 1 }),
  'POST /api/pay-apps/:payAppId/review': () => ({ expectedRevision: 1, lines: [{ lineId: lineIds[1], decision: 'approve' }] }),
  'POST /api/pay-apps/:payAppId/revise': () => ({ expectedRevision: 0, lines: [{ lineId: lineIds[0], action: 'accept' }] }),
  'POST /api/pay-apps/:payAppId/certify': () => ({ expectedRevision: 0 }),
  'POST /api/pay-apps/:payAppId/payments': () => ({}),
  'POST /api/pay-apps/:payAppId/lien-waivers': () => ({ kind: 'conditional_progress', signedName: 'Owner Person' }),
};

async function writes() {
  const [row] = await t.database.db.select({ n: count() }).from(auditEvents);
  return row!.n;
}

describe("the owner's side and an application not yet certified", () => {
  it('answers 404 on every route that names a pay application, as for one that does not exist, and writes nothing', async () => {
    const routes = registeredRoutes(t.app).filter((r) => r.includes(':payAppId'));
    expect(routes.length).toBeGreaterThanOrEqual(10);
    const leaks: string[] = [];
    for (const who of ['owner', 'owner_admin'] as const) {
      const agent = await signedInAgent(t.app, w.people[who].email);
      for (const route of routes) {
        const [method, template] = route.split(' ') as [string, string];
        let req = (agent as unknown as Record<string, (p: string) => import('supertest').Test>)[method.toLowerCase()]!(template.replace(':payAppId', appId)).set('Origin', TEST_ORIGIN);
        if (method !== 'GET' && method !== 'DELETE') req = req.send(BODIES[route]?.() ?? {});
        const before = await writes();
        const res = await req;
        if (res.status !== 404) leaks.push(`${route} as ${who}: ${res.status}${res.status === 400 ? ' (give it a valid body in BODIES)' : ''}`);
        if ((await writes()) !== before) leaks.push(`${route} as ${who}: wrote`);
      }
    }
    expect(leaks).toEqual([]);
  });

  it('keeps its events out of the project trail (and its object types out of the filter), for the owner only', async () => {
    const names = (events: { objectType: string; objectId: string; after: unknown; before: unknown }[]) =>
      events.filter((e) => e.objectId === appId || JSON.stringify([e.after, e.before]).includes(appId) || e.objectType === 'dispute');
    for (const who of ['owner', 'owner_admin'] as const) {
      const res = await (await signedInAgent(t.app, w.people[who].email)).get(`/api/projects/${w.home.id}/audit?pageSize=100`);
      expect(res.status).toBe(200);
      expect(names(res.body.events), who).toEqual([]);
      expect(res.body.objectTypes, who).not.toContain('pay_app');
      const csv = await (await signedInAgent(t.app, w.people[who].email)).get(`/api/projects/${w.home.id}/audit.csv`);
      expect(csv.status).toBe(200);
      expect(csv.text, who).not.toMatch(/pay application 1(?!\d)/i);
    }
    const gc = await (await signedInAgent(t.app, w.people.general_contractor.email)).get(`/api/projects/${w.home.id}/audit?pageSize=100`);
    expect(names(gc.body.events).map((e) => e.objectType)).toContain('pay_app');
    const gcCsv = await (await signedInAgent(t.app, w.people.general_contractor.email)).get(`/api/projects/${w.home.id}/audit.csv`);
    // The CSV names objects by label: the hidden application is pay application 1.
    expect(gcCsv.text).toMatch(/pay application 1(?!\d)/i);
  });

  it('shows the owner the application and its whole trail once certified', async () => {
    const db = t.database.db;
    const certified = await makeCertifiedPayApp(db, w.home.id, w.people.subcontractor.id, { number: 7 });
    const owner = await signedInAgent(t.app, w.people.owner.email);
    expect((await owner.get(`/api/pay-apps/${certified.id}/audit`)).status).toBe(200);
    expect((await owner.get(`/api/pay-apps/${certified.id}/payments`)).status).toBe(200);
  });
});
