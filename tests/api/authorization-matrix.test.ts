import { count } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  auditEvents,
  changeOrderDocuments,
  changeOrders,
  disputes,
  invitations,
  payAppLines,
  surfaceBaselines,
  tallyEvidence,
} from '../../server/db/schema';
import { makeBidItem, makeWorld } from '../setup/factories';
import { makeTally } from '../setup/pay-cycle-factories';
import { makeCertifiedPayApp } from '../setup/payment-factories';
import { makeChangeOrder, makeDailySheet, makeStoredMaterial } from '../setup/provisions-factories';
import { registeredRoutes } from '../setup/routes';
import { createTestApp, signedInAgent, TEST_ORIGIN, type TestApp } from '../setup/test-app';

// OWASP API Security Top 10 (2023) API1 (object level) and API5 (function level) authorization; OWASP ASVS
// 4.0.3 section 4.1 and 4.2: every route says who may reach it, and a person of another project reads nothing.
type Scope = 'public' | 'signed-in' | 'project' | 'company';
/** Every route the app registers. A new route without an entry here fails the first test. */
const ROUTES: Record<string, Scope> = {
  'GET /api/health': 'public',
  'GET /api/session': 'public',
  'GET /api/invitations/:token': 'public',
  'POST /api/invitations/:token/accept': 'public',
  'POST /api/webhooks/stripe': 'public',
  'POST /api/calc/:method': 'signed-in',
  'GET /api/me': 'signed-in',
  'GET /api/companies': 'signed-in',
  'GET /api/inbox': 'signed-in',
  'GET /api/projects': 'signed-in',
  'POST /api/projects': 'signed-in',
  'GET /api/dev/mailbox': 'signed-in',
  'GET /api/projects/:projectId': 'project',
  'PATCH /api/projects/:projectId': 'project',
  'GET /api/projects/:projectId/bid-items': 'project',
  'POST /api/projects/:projectId/bid-items': 'project',
  'POST /api/projects/:projectId/bid-items/import': 'project',
  'PATCH /api/bid-items/:bidItemId': 'project',
  'DELETE /api/bid-items/:bidItemId': 'project',
  'GET /api/projects/:projectId/change-orders': 'project',
  'POST /api/projects/:projectId/change-orders': 'project',
  'GET /api/projects/:projectId/contract-quantities': 'project',
  'GET /api/change-orders/:id': 'project',
  'GET /api/change-orders/:id/documents': 'project',
  'POST /api/change-orders/:id/documents': 'project',
  'GET /api/change-order-documents/:documentId/download': 'project',
  'POST /api/change-orders/:id/approve': 'project',
  'POST /api/change-orders/:id/reject': 'project',
  'GET /api/projects/:projectId/variance': 'project',
  'PUT /api/bid-items/:bidItemId/forecast': 'project',
  'POST /api/bid-items/:bidItemId/variance-change-order': 'project',
  'GET /api/projects/:projectId/invitations': 'project',
  'POST /api/projects/:projectId/invitations': 'project',
  'DELETE /api/invitations/:id': 'project',
  'DELETE /api/projects/:projectId/members/:userId': 'project',
  'GET /api/companies/:companyId': 'company',
  'GET /api/companies/:companyId/members': 'company',
  'DELETE /api/companies/:companyId/members/:userId': 'company',
  'GET /api/projects/:projectId/audit': 'project',
  'GET /api/projects/:projectId/audit.csv': 'project',
  'GET /api/pay-apps/:payAppId/audit': 'project',
  'GET /api/projects/:projectId/tallies': 'project',
  'POST /api/projects/:projectId/tallies': 'project',
  'GET /api/tallies/:tallyId': 'project',
  'PATCH /api/tallies/:tallyId': 'project',
  'POST /api/tallies/:tallyId/ready': 'project',
  'DELETE /api/tallies/:tallyId': 'project',
  'POST /api/tallies/:tallyId/evidence': 'project',
  'GET /api/evidence/:evidenceId/download': 'project',
  'DELETE /api/evidence/:evidenceId': 'project',
  'GET /api/projects/:projectId/pay-apps': 'project',
  'POST /api/projects/:projectId/pay-apps': 'project',
  'GET /api/pay-apps/:payAppId': 'project',
  'GET /api/pay-apps/:payAppId/lines/:lineId/tallies': 'project',
  'POST /api/pay-apps/:payAppId/submit': 'project',
  'POST /api/pay-apps/:payAppId/review': 'project',
  'POST /api/pay-apps/:payAppId/revise': 'project',
  'POST /api/pay-apps/:payAppId/certify': 'project',
  'POST /api/disputes/:disputeId/comments': 'project',
  'PATCH /api/disputes/:disputeId': 'project',
  'POST /api/disputes/:disputeId/withdraw': 'project',
  'GET /api/pay-apps/:payAppId/export.pdf': 'project',
  'GET /api/pay-apps/:payAppId/export.csv': 'project',
  'POST /api/pay-apps/:payAppId/payments': 'project',
  'GET /api/pay-apps/:payAppId/payments': 'project',
  'GET /api/projects/:projectId/payments': 'project',
  'POST /api/pay-apps/:payAppId/lien-waivers': 'project',
  'GET /api/projects/:projectId/lien-waivers': 'project',
  'GET /api/lien-waivers/:waiverId/pdf': 'project',
  // Measurement and payment provisions (issue 15).
  'GET /api/projects/:projectId/measurement-profiles': 'project',
  'PUT /api/bid-items/:bidItemId/measurement-profile': 'project',
  'PUT /api/bid-items/:bidItemId/lump-sum-stages': 'project',
  'GET /api/projects/:projectId/trucks': 'project',
  'POST /api/projects/:projectId/trucks': 'project',
  'GET /api/projects/:projectId/truck-tickets': 'project',
  'GET /api/projects/:projectId/truck-tickets/totals': 'project',
  'POST /api/projects/:projectId/truck-tickets': 'project',
  'POST /api/projects/:projectId/truck-tickets/import': 'project',
  'GET /api/projects/:projectId/material-sources': 'project',
  'POST /api/projects/:projectId/material-sources': 'project',
  'GET /api/projects/:projectId/scale-tickets': 'project',
  'POST /api/projects/:projectId/scale-tickets': 'project',
  'GET /api/projects/:projectId/daily-sheets': 'project',
  'POST /api/projects/:projectId/daily-sheets': 'project',
  'POST /api/daily-sheets/:sheetId/sign': 'project',
  'GET /api/projects/:projectId/stored-materials': 'project',
  'POST /api/projects/:projectId/stored-materials': 'project',
  'POST /api/stored-materials/:storedMaterialId/movements': 'project',
  'GET /api/projects/:projectId/pay-adjustments': 'project',
  'POST /api/projects/:projectId/pay-adjustments': 'project',
  'GET /api/projects/:projectId/surface-baselines': 'project',
  'POST /api/projects/:projectId/surface-baselines': 'project',
  'POST /api/surface-baselines/:baselineId/accept': 'project',
  'GET /api/surface-baselines/:baselineId/download': 'project',
};

let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
let params: Record<string, string>;

beforeAll(async () => {
  t = await createTestApp();
  const db = t.database.db;
  w = await makeWorld(db, t.auth);
  const gc = w.people.general_contractor.id;
  const item = await makeBidItem(db, w.home.id);
  const tally = await makeTally(db, {
    projectId: w.home.id,
    bidItemId: item.id,
    authorUserId: w.people.subcontractor.id,
    measuredOn: '2026-10-05',
    quantity: 10,
    status: 'draft',
  });
  const [evidence] = await db
    .insert(tallyEvidence)
    .values({
      tallyId: tally.id,
      fileName: 'a.csv',
      contentType: 'text/csv',
      kind: 'csv',
      sizeBytes: 3,
      sha256: 'x',
      storageKey: 'evidence/00000000-0000-4000-8000-000000000001',
      uploadedByUserId: w.people.subcontractor.id,
    })
    .returning();
  const app = await makeCertifiedPayApp(db, w.home.id, w.people.subcontractor.id);
  const [line] = await db.select().from(payAppLines).limit(1);
  const [dispute] = await db
    .insert(disputes)
    .values({ payAppId: app.id, lineId: line!.id, revision: 0, reason: 'r', counterQuantity: 1, openedByUserId: gc })
    .returning();
  const [co] = await db
    .insert(changeOrders)
    .values({ projectId: w.home.id, number: 1, title: 'CO', proposedByUserId: gc })
    .returning();
  const [document] = await db
    .insert(changeOrderDocuments)
    .values({
      changeOrderId: co!.id,
      fileName: 'a.pdf',
      contentType: 'application/pdf',
      kind: 'pdf',
      sizeBytes: 3,
      sha256: 'x',
      storageKey: 'change-order/00000000-0000-4000-8000-000000000002',
      uploadedByUserId: gc,
    })
    .returning();
  const [invitation] = await db
    .insert(invitations)
    .values({
      projectId: w.home.id,
      email: 'x@example.test',
      role: 'owner',
      tokenHash: 'h',
      invitedByUserId: gc,
      expiresAt: new Date(Date.now() + 86_400_000),
    })
    .returning();
  const [baseline] = await db
    .insert(surfaceBaselines)
    .values({
      projectId: w.home.id,
      fileName: 'og.xml',
      contentType: 'application/xml',
      sizeBytes: 3,
      sha256: 'x',
      storageKey: 'baseline/00000000-0000-4000-8000-000000000003',
      surfaceName: 'OG',
      pointCount: 0,
      linearUnit: 'foot',
      elevationUnit: 'foot',
      unitsFrom: 'file',
      points: Buffer.alloc(0),
      recordedByUserId: gc,
    })
    .returning();
  params = {
    projectId: w.home.id,
    baselineId: baseline!.id,
    bidItemId: item.id,
    tallyId: tally.id,
    evidenceId: evidence!.id,
    documentId: document!.id,
    payAppId: app.id,
    disputeId: dispute!.id,
    lineId: line!.id,
    waiverId: '00000000-0000-4000-8000-000000000009',
    token: 'not-a-token',
    method: 'grid',
    userId: w.people.subcontractor.id,
    companyId: w.companies.sub.id,
    'change-orders/:id': co!.id,
    sheetId: (await makeDailySheet(db, w.home.id, (await makeChangeOrder(db, w.home.id, gc)).id, gc)).id,
    storedMaterialId: (await makeStoredMaterial(db, w.home.id, item.id)).id,
    'invitations/:id': invitation!.id,
  };
});
afterAll(() => t.close());

const NOWHERE = '00000000-0000-4000-8000-00000000dead';

/** The route with this project's object ids, or (nowhere) with ids that exist on no project at all. */
function concrete(route: string, nowhere = false): { method: string; path: string } {
  const [method, template] = route.split(' ') as [string, string];
  const path = template
    .replace(
      /(change-orders|invitations)\/:id/,
      (_m, kind: string) => `${kind}/${nowhere ? NOWHERE : params[`${kind}/:id`]}`,
    )
    .replace(/:(\w+)/g, (_m, name: string) =>
      nowhere && name !== 'method' && name !== 'token' ? NOWHERE : (params[name] ?? 'missing'),
    );
  return { method: method.toLowerCase(), path };
}

type Agent = ReturnType<typeof request.agent> | ReturnType<typeof request>;
const send = (agent: Agent, route: string, nowhere = false) => {
  const { method, path } = concrete(route, nowhere);
  const req = (agent as unknown as Record<string, (p: string) => request.Test>)[method]!(path).set(
    'Origin',
    TEST_ORIGIN,
  );
  return method === 'get' || method === 'delete' ? req : req.send({});
};

async function writes() {
  const [row] = await t.database.db.select({ n: count() }).from(auditEvents);
  return row!.n;
}

describe('the authorization matrix', () => {
  it('has an entry for every route the server registers', () => {
    const routes = registeredRoutes(t.app);
    expect(routes.filter((r) => !(r in ROUTES))).toEqual([]);
    // ...and no entry for a route that is gone, so the table stays the list of what exists.
    expect(Object.keys(ROUTES).filter((r) => !routes.includes(r))).toEqual([]);
  });

  it('answers 401 to every non-public route without a session', async () => {
    for (const route of registeredRoutes(t.app).filter((r) => ROUTES[r] !== 'public')) {
      const res = await send(request(t.app), route);
      expect(res.status, route).toBe(401);
      expect(res.body.error.code, route).toBe('UNAUTHENTICATED');
    }
  });

  it("never lets a member of another project see that this project's objects exist, and writes nothing", async () => {
    const outsider = await signedInAgent(t.app, w.outsider.email);
    const before = await writes();
    // A company's own routes (its people) answer the same to anyone outside the company.
    for (const route of registeredRoutes(t.app).filter((r) => ROUTES[r] === 'project' || ROUTES[r] === 'company')) {
      const res = await send(outsider, route);
      const absent = await send(outsider, route, true);
      // 404, or a body refused by its schema before any lookup: either way the same answer as for an id that
      // exists nowhere, so the response is no oracle for existence.
      expect([404, 400], route).toContain(res.status);
      expect({ status: res.status, code: res.body.error?.code }, route).toEqual({
        status: absent.status,
        code: absent.body.error?.code,
      });
      if (route.startsWith('GET')) expect(res.status, route).toBe(404);
    }
    expect(await writes()).toBe(before);
  });
});
