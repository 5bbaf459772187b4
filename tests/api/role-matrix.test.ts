import { count } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { PayAppStatus } from '../../src/shared/constants';
import {
  auditEvents,
  changeOrders,
  companyMembers,
  disputes,
  invitations,
  payAppLines,
  projectMembers,
  user,
} from '../../server/db/schema';
import { makeBidItem, makeWorld } from '../setup/factories';
import { FILES, makeTally } from '../setup/pay-cycle-factories';
import { makeCertifiedPayApp } from '../setup/payment-factories';
import {
  makeChangeOrder,
  makeDailySheet,
  makeProfiledItem,
  makeSource,
  makeStoredMaterial,
} from '../setup/provisions-factories';
import { registeredRoutes } from '../setup/routes';
import { createTestApp, signedInAgent, TEST_ORIGIN, type TestApp } from '../setup/test-app';
import { eq } from 'drizzle-orm';

// OWASP API Security Top 10 (2023) API5, broken function level authorization, and API1, object level; OWASP ASVS
// 4.0.3 section 4.1.3 (least privilege) and 4.2.1. The product brief's roles: the subcontractor measures, bills and
// signs waivers; the general contractor manages the contract, reviews and certifies; the owner pays; each party
// company's admin manages its own company's people (its seat's invitations and removals), and only the general
// contractor's admin (`admin`) also manages the contract. Each route is called by each role
// with a body that passes validation, so the answer is the role rule's and not the schema's: a role that may not
// gets 403 and nothing is written; a role that may gets past authorization (a 2xx, or the listed state answer).
type Role = 'subcontractor' | 'general_contractor' | 'owner' | 'admin' | 'subcontractor_admin' | 'owner_admin';
const ROLES: Role[] = ['subcontractor', 'general_contractor', 'owner', 'admin', 'subcontractor_admin', 'owner_admin'];
const ALL = ROLES;
const CONTRACT: Role[] = ['general_contractor', 'admin'];
const SUB: Role[] = ['subcontractor'];
/** Each party company's admin, for its own seat's people. */
const ADMINS: Role[] = ['admin', 'subcontractor_admin', 'owner_admin'];
const SEAT_OF: Partial<Record<Role, string>> = {
  admin: 'general_contractor',
  subcontractor_admin: 'subcontractor',
  owner_admin: 'owner',
};
/** A company's own people list and removals: another company's people do not see the company at all. */
const NOT_OF_SUB_COMPANY: Role[] = ['general_contractor', 'owner', 'admin', 'owner_admin'];
const FIELD: Role[] = ['subcontractor', 'general_contractor'];
const TRUCK_TICKET = {
  deliveredOn: '2026-05-04',
  truckLabel: 'T-12',
  material: 'Select borrow',
  source: 'Hollis pit',
  loadedAt: 'Face 2',
  deliveredTo: 'Sta 14+00',
  loadCheckerInitials: 'RB',
  deliveryCheckerInitials: 'MK',
};
/** A LandXML surface of three points (LandXML 1.2 schema: Units, Surface, Pnts). */
const BASELINE_XML = Buffer.from(
  '<?xml version="1.0"?><LandXML><Units><Metric linearUnit="meter"/></Units><Surfaces><Surface name="OG"><Definition><Pnts><P id="1">0 0 1</P><P id="2">0 10 1</P><P id="3">10 0 1</P></Pnts></Definition></Surface></Surfaces></LandXML>',
);
const TRUCK_TICKET_CSV =
  'delivered_on,truck,material,source,loaded_at,delivered_to,load_checker,delivery_checker\n2026-05-04,T-12,Select borrow,Hollis pit,Face 2,Sta 14+00,RB,MK\n';

type Fixture = {
  projectId: string;
  bidItemId: string;
  tallyId: string;
  evidenceId: string;
  payAppId: string;
  lineId: string;
  /** Keys of every flag of the fixture's application (its lines bill without tallies), for certify. */
  flagKeys: string[];
  disputeId: string;
  changeOrderId: string;
  /** A document of the fixture's proposed change order. */
  documentId: string;
  invitationId: string;
  waiverId: string;
  method: string;
  token: string;
  /** A person of the subcontractor company seated on the project, for the removal routes. */
  userId: string;
  companyId: string;
  truckItemId: string;
  weightItemId: string;
  sourceId: string;
  approvedChangeOrderId: string;
  sheetId: string;
  storedMaterialId: string;
  /** A proposed original ground surface of the home project. */
  baselineId: string;
};
type Rule = {
  may: Role[];
  /** The pay application's state the step needs (default certified). */
  payApp?: PayAppStatus;
  body?: (f: Fixture, role: Role) => object;
  upload?: { field: string; bytes: Buffer; name: string };
  /** Answers other than 2xx that still show the role got through (a state the fixture cannot reach cheaply). */
  passes?: number[];
  /** Roles that do not see the object at all in this state (404, as for a foreign object) rather than 403. */
  hiddenFrom?: Role[];
};
// The owner sees pay applications once certified (product brief, roles): an earlier one is not there for the owner.
const OWNER_SEES_CERTIFIED: Role[] = ['owner', 'owner_admin'];

const RULES: Record<string, Rule> = {
  'POST /api/calc/:method': { may: ALL, body: () => ({ points: [], cellSize: 10 }), passes: [400] },
  'GET /api/me': { may: ALL },
  'GET /api/companies': { may: ALL },
  'GET /api/inbox': { may: ALL },
  'GET /api/projects': { may: ALL },
  'POST /api/projects': { may: CONTRACT },
  'GET /api/dev/mailbox': { may: ALL },
  'GET /api/projects/:projectId': { may: ALL },
  'PATCH /api/projects/:projectId': { may: CONTRACT, body: () => ({ retainageBps: 500 }) },
  'GET /api/projects/:projectId/bid-items': { may: ALL },
  'POST /api/projects/:projectId/bid-items': {
    may: CONTRACT,
    body: () => ({
      itemNumber: `N-${Math.random().toString(36).slice(2, 8)}`,
      description: 'Rock excavation',
      payUnit: 'CY',
      basis: 'bank',
      unitPriceCents: 4200,
      contractQuantity: 300,
      isMajor: false,
      method: 'end-area',
    }),
    passes: [409],
  },
  'POST /api/projects/:projectId/bid-items/import': {
    may: CONTRACT,
    upload: {
      field: 'file',
      bytes: Buffer.from(
        'item_number,description,pay_unit,unit_price,contract_quantity\nZ-1,Topsoil stripping,SY,1.25,4000\n',
      ),
      name: 'items.csv',
    },
    passes: [400],
  },
  'PATCH /api/bid-items/:bidItemId': {
    may: CONTRACT,
    body: () => ({ isMajor: true, reason: 'Corrected after the lock' }),
  },
  'DELETE /api/bid-items/:bidItemId': { may: CONTRACT, passes: [409] },
  'GET /api/projects/:projectId/change-orders': { may: ALL },
  'POST /api/projects/:projectId/change-orders': {
    may: ['subcontractor', 'general_contractor'],
    body: (f) => ({
      title: 'More rock',
      reason: 'Rock met above the planned grade',
      items: [{ kind: 'change_quantity', bidItemId: f.bidItemId, quantityDelta: 50 }],
    }),
  },
  'GET /api/projects/:projectId/contract-quantities': { may: ALL },
  'GET /api/change-orders/:id': { may: ALL },
  // The owner decides too only on a project that asks for the owner's approval (not the home project).
  'POST /api/change-orders/:id/approve': { may: ['general_contractor'], body: () => ({ note: 'Agreed' }) },
  'POST /api/change-orders/:id/reject': { may: ['general_contractor'], body: () => ({ note: 'Not agreed' }) },
  'GET /api/change-orders/:id/documents': { may: ALL },
  // Those who propose attach (the owner only on a project where the owner approves change orders too).
  'POST /api/change-orders/:id/documents': {
    may: ['subcontractor', 'general_contractor'],
    upload: { field: 'files', bytes: FILES.pdf, name: 'survey-note.pdf' },
  },
  'GET /api/change-order-documents/:documentId/download': { may: ALL },
  'GET /api/projects/:projectId/variance': { may: ALL },
  'PUT /api/bid-items/:bidItemId/forecast': {
    may: ['subcontractor', 'general_contractor'],
    body: () => ({ forecastQuantity: 1000 }),
  },
  'POST /api/bid-items/:bidItemId/variance-change-order': {
    may: ['subcontractor', 'general_contractor'],
    passes: [409],
  },
  'GET /api/projects/:projectId/invitations': { may: ADMINS },
  'POST /api/projects/:projectId/invitations': {
    may: ADMINS,
    body: (_f, role) => ({
      email: `new-${Math.random().toString(36).slice(2, 8)}@example.test`,
      role: SEAT_OF[role] ?? 'owner',
    }),
  },
  // The fixture's invitation is to the owner seat: the owner's admin revokes it.
  'DELETE /api/invitations/:id': { may: ['owner_admin'] },
  'DELETE /api/projects/:projectId/members/:userId': { may: ['subcontractor_admin'] },
  'GET /api/companies/:companyId': { may: ['subcontractor_admin'], hiddenFrom: NOT_OF_SUB_COMPANY },
  'GET /api/companies/:companyId/members': { may: ['subcontractor_admin'], hiddenFrom: NOT_OF_SUB_COMPANY },
  'DELETE /api/companies/:companyId/members/:userId': { may: ['subcontractor_admin'], hiddenFrom: NOT_OF_SUB_COMPANY },
  'GET /api/projects/:projectId/audit': { may: ALL },
  'GET /api/projects/:projectId/audit.csv': { may: ALL },
  'GET /api/pay-apps/:payAppId/audit': { may: ALL },
  'GET /api/projects/:projectId/tallies': { may: ALL },
  'POST /api/projects/:projectId/tallies': {
    may: SUB,
    body: (f) => ({
      bidItemId: f.bidItemId,
      measuredOn: '2026-11-04',
      method: 'manual',
      quantity: 12,
      manualBasis: 'Counted at the stockpile',
    }),
  },
  'GET /api/tallies/:tallyId': { may: ALL },
  'PATCH /api/tallies/:tallyId': { may: SUB, body: () => ({ title: 'North cut' }) },
  'POST /api/tallies/:tallyId/ready': { may: SUB },
  'DELETE /api/tallies/:tallyId': { may: SUB },
  'POST /api/tallies/:tallyId/evidence': { may: SUB, upload: { field: 'files', bytes: FILES.pdf, name: 'ticket.pdf' } },
  'GET /api/evidence/:evidenceId/download': { may: ALL },
  'DELETE /api/evidence/:evidenceId': { may: SUB },
  'GET /api/projects/:projectId/pay-apps': { may: ALL },
  'POST /api/projects/:projectId/pay-apps': {
    may: SUB,
    body: () => ({ periodStart: '2027-01-01', periodEnd: '2027-01-31' }),
    passes: [409],
  },
  'GET /api/pay-apps/:payAppId': { may: ALL },
  'GET /api/pay-apps/:payAppId/lines/:lineId/tallies': { may: ALL },
  'POST /api/pay-apps/:payAppId/submit': { hiddenFrom: OWNER_SEES_CERTIFIED, may: SUB, payApp: 'draft' },
  'POST /api/pay-apps/:payAppId/review': {
    hiddenFrom: OWNER_SEES_CERTIFIED,
    may: ['general_contractor'],
    payApp: 'submitted',
    body: (f) => ({ expectedRevision: 0, lines: [{ lineId: f.lineId, decision: 'approve' }] }),
  },
  'POST /api/pay-apps/:payAppId/revise': {
    hiddenFrom: OWNER_SEES_CERTIFIED,
    may: SUB,
    payApp: 'returned',
    body: (f) => ({ expectedRevision: 0, lines: [{ lineId: f.lineId, action: 'accept' }] }),
  },
  'POST /api/pay-apps/:payAppId/certify': {
    hiddenFrom: OWNER_SEES_CERTIFIED,
    may: ['general_contractor'],
    payApp: 'in_review',
    body: (f) => ({ expectedRevision: 0, acknowledgedFlags: f.flagKeys }),
  },
  'POST /api/disputes/:disputeId/comments': {
    may: ['subcontractor', 'general_contractor'],
    body: () => ({ body: 'Survey attached.' }),
  },
  // The fixture's application is certified: the reviewer passes authorization and hears 409 DISPUTE_ANSWERED.
  'PATCH /api/disputes/:disputeId': {
    may: ['general_contractor'],
    body: () => ({ counterQuantity: 1 }),
    passes: [409],
  },
  'POST /api/disputes/:disputeId/withdraw': {
    may: ['general_contractor'],
    body: () => ({ note: 'Tickets found' }),
    passes: [409],
  },
  'GET /api/pay-apps/:payAppId/export.pdf': { may: ALL },
  'GET /api/pay-apps/:payAppId/export.csv': { may: ALL },
  'POST /api/pay-apps/:payAppId/payments': { may: ['owner'], body: () => ({}) },
  'GET /api/pay-apps/:payAppId/payments': { may: ALL },
  'GET /api/projects/:projectId/payments': { may: ALL },
  'POST /api/pay-apps/:payAppId/lien-waivers': {
    may: SUB,
    body: (_f, role) => ({ kind: 'conditional_final', signedName: accountName(role) }),
    passes: [409],
  },
  'GET /api/projects/:projectId/lien-waivers': { may: ALL },
  'GET /api/lien-waivers/:waiverId/pdf': { may: ALL },
  // Measurement and payment provisions (issue 15): the contract side sets how an item is paid; either contractor
  // keeps the field records; the owner reads them.
  'GET /api/projects/:projectId/measurement-profiles': { may: ALL },
  'PUT /api/bid-items/:bidItemId/measurement-profile': { may: CONTRACT, body: () => ({ profile: 'truck_measure' }) },
  'PUT /api/bid-items/:bidItemId/lump-sum-stages': {
    may: CONTRACT,
    body: () => ({ stages: [{ name: 'Whole item', percentOfItem: 100, completedOn: null }] }),
    // The fixture's bid item is not a lump sum: 409 PROFILE_MISMATCH comes after the role check.
    passes: [409],
  },
  'GET /api/projects/:projectId/trucks': { may: ALL },
  'POST /api/projects/:projectId/trucks': {
    may: FIELD,
    body: () => ({ label: `T-${++serial}`, bedVolumeCy: 11.38, measuredBy: 'R. Baines', measuredOn: '2026-04-28' }),
  },
  'GET /api/projects/:projectId/truck-tickets': { may: ALL },
  'GET /api/projects/:projectId/truck-tickets/totals': { may: ALL },
  'POST /api/projects/:projectId/truck-tickets': {
    may: FIELD,
    body: (f) => ({ bidItemId: f.truckItemId, ...TRUCK_TICKET }),
  },
  'POST /api/projects/:projectId/truck-tickets/import': {
    may: FIELD,
    body: (f) => ({ bidItemId: f.truckItemId, csv: TRUCK_TICKET_CSV }),
  },
  'GET /api/projects/:projectId/material-sources': { may: ALL },
  'POST /api/projects/:projectId/material-sources': {
    may: FIELD,
    body: () => ({
      name: `Pit ${++serial}`,
      weighedLoads: [
        { netTons: 18.42, volumeCy: 12.5 },
        { netTons: 19.1, volumeCy: 13 },
        { netTons: 18.75, volumeCy: 12.7 },
      ],
    }),
  },
  'GET /api/projects/:projectId/scale-tickets': { may: ALL },
  'GET /api/projects/:projectId/daily-sheets': { may: ALL },
  'POST /api/projects/:projectId/daily-sheets': {
    may: FIELD,
    body: (f) => ({
      changeOrderId: f.approvedChangeOrderId,
      workedOn: '2026-06-09',
      description: 'Muck removal',
      labor: [{ trade: 'Operator', hours: 8, rateCents: 6250 }],
      equipment: [],
      materials: [],
      markups: { laborPercent: 25, equipmentPercent: 15, materialPercent: 15 },
    }),
  },
  'POST /api/daily-sheets/:sheetId/sign': { may: FIELD },
  'GET /api/projects/:projectId/stored-materials': { may: ALL },
  'POST /api/projects/:projectId/stored-materials': {
    may: FIELD,
    body: (f) => ({
      bidItemId: f.bidItemId,
      description: '24 in RCP',
      unit: 'LF',
      unitCostCents: 5840,
      neededQuantity: 400,
      storedAt: 'East yard',
    }),
  },
  'POST /api/stored-materials/:storedMaterialId/movements': {
    may: FIELD,
    body: () => ({ kind: 'added', movedOn: '2026-05-12', quantity: 40, invoiceRef: 'INV-3381' }),
  },
  'GET /api/projects/:projectId/pay-adjustments': { may: ALL },
  'GET /api/projects/:projectId/surface-baselines': { may: ALL },
  // One proposal per area at a time: the second measuring party to record for the whole project gets 409.
  'POST /api/projects/:projectId/surface-baselines': {
    may: FIELD,
    upload: { field: 'file', bytes: BASELINE_XML, name: 'og.xml' },
    passes: [409],
  },
  'POST /api/surface-baselines/:baselineId/accept': { may: FIELD },
  'GET /api/surface-baselines/:baselineId/download': { may: ALL },
  'POST /api/projects/:projectId/pay-adjustments': {
    may: CONTRACT,
    body: () => ({
      kind: 'liquidated_damages',
      appliesOn: '2026-11-30',
      description: 'Late',
      daysOverrun: 2,
      dailyCents: 285_000,
    }),
  },
  'POST /api/projects/:projectId/scale-tickets': {
    may: FIELD,
    body: (f) => ({
      bidItemId: f.weightItemId,
      sourceId: f.sourceId,
      ticketNumber: `S-${++serial}`,
      weighedOn: '2026-05-04',
      grossTons: 33.85,
      tareTons: 13.85,
      material: 'Base',
      scaleCheckerInitials: 'JT',
      deliveryCheckerInitials: 'MK',
    }),
  },
};
/** Routes that need no session, or that no role reaches (the matrix file covers them). */
const OUTSIDE_ROLES = [
  'GET /api/health',
  'GET /api/session',
  'GET /api/invitations/:token',
  'POST /api/invitations/:token/accept',
  'POST /api/webhooks/stripe',
];

let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
const agents = {} as Record<Role, ReturnType<typeof request.agent>>;
let serial = 100;
/** The factories name each person after their e-mail's local part. */
const accountName = (role: Role) => w.people[role].email.split('@')[0]!;

beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
  for (const role of ROLES) agents[role] = await signedInAgent(t.app, w.people[role].email);
}, 120_000);
afterAll(() => t?.close());

/** Fresh objects on the home project, with the pay application in the state the step needs. */
async function fixture(payAppStatus: PayAppStatus = 'certified'): Promise<Fixture> {
  const db = t.database.db;
  const sub = w.people.subcontractor.id;
  const gc = w.people.general_contractor.id;
  const item = await makeBidItem(db, w.home.id);
  const tally = await makeTally(db, {
    projectId: w.home.id,
    bidItemId: item.id,
    authorUserId: sub,
    measuredOn: '2026-10-05',
    quantity: 10,
    status: 'draft',
  });
  const uploaded = await agents.subcontractor
    .post(`/api/tallies/${tally.id}/evidence`)
    .attach('files', FILES.pdf, 'ticket.pdf');
  const app = await makeCertifiedPayApp(db, w.home.id, sub, { number: ++serial, status: payAppStatus });
  const appLines = await db.select().from(payAppLines).where(eq(payAppLines.payAppId, app.id));
  const line = appLines[0];
  const flagKeys = appLines.filter((l) => l.thisPeriodQuantity > 0).map((l) => `no_evidence:${l.id}`);
  const [dispute] = await db
    .insert(disputes)
    .values({
      payAppId: app.id,
      lineId: line!.id,
      revision: 0,
      reason: 'Short',
      counterQuantity: 1,
      openedByUserId: gc,
    })
    .returning();
  const [co] = await db
    .insert(changeOrders)
    .values({ projectId: w.home.id, number: ++serial, title: 'CO', proposedByUserId: gc })
    .returning();
  const [invitation] = await db
    .insert(invitations)
    .values({
      projectId: w.home.id,
      email: `x${serial}@example.test`,
      role: 'owner',
      tokenHash: `h${serial}`,
      invitedByUserId: gc,
      expiresAt: new Date(Date.now() + 86_400_000),
    })
    .returning();
  const coDocument = await agents.subcontractor
    .post(`/api/change-orders/${co!.id}/documents`)
    .attach('files', FILES.pdf, 'site-note.pdf');
  const approved = await makeChangeOrder(db, w.home.id, gc);
  let waiverId = '00000000-0000-4000-8000-00000000beef';
  const userId = `crew-${serial}`;
  await db.insert(user).values({ id: userId, name: `Crew ${serial}`, email: `crew-${serial}@example.test` });
  await db.insert(companyMembers).values({ userId, companyId: w.companies.sub.id });
  await db.insert(projectMembers).values({ projectId: w.home.id, userId, role: 'subcontractor' });
  if (payAppStatus === 'certified') {
    const waiver = await agents.subcontractor
      .post(`/api/pay-apps/${app.id}/lien-waivers`)
      .send({ kind: 'conditional_progress', signedName: accountName('subcontractor') });
    waiverId = waiver.body.waiver?.id ?? waiverId;
  }
  return {
    projectId: w.home.id,
    bidItemId: item.id,
    tallyId: tally.id,
    evidenceId: uploaded.body.evidence?.[0]?.id ?? uploaded.body.tally?.evidence?.[0]?.id,
    payAppId: app.id,
    lineId: line!.id,
    flagKeys,
    disputeId: dispute!.id,
    changeOrderId: co!.id,
    documentId: coDocument.body.documents[0].id,
    invitationId: invitation!.id,
    waiverId,
    method: 'grid',
    token: 'x',
    userId,
    companyId: w.companies.sub.id,
    truckItemId: (await makeProfiledItem(db, w.home.id, 'truck_measure')).id,
    weightItemId: (await makeProfiledItem(db, w.home.id, 'weight', { payUnit: 'TON' })).id,
    sourceId: (await makeSource(db, w.home.id)).id,
    approvedChangeOrderId: approved.id,
    sheetId: (await makeDailySheet(db, w.home.id, approved.id, gc)).id,
    storedMaterialId: (await makeStoredMaterial(db, w.home.id, item.id)).id,
    baselineId: (
      await agents.subcontractor
        .post(`/api/projects/${w.home.id}/surface-baselines`)
        .field('area', `Fixture ${serial}`)
        .attach('file', BASELINE_XML, 'og.xml')
    ).body.baseline.id,
  };
}

function call(role: Role, route: string, f: Fixture) {
  const rule = RULES[route]!;
  const [method, template] = route.split(' ') as [string, string];
  const path = template
    .replace(
      /(change-orders|invitations)\/:id/,
      (_m, kind: string) => `${kind}/${kind === 'change-orders' ? f.changeOrderId : f.invitationId}`,
    )
    .replace(/:(\w+)/g, (_m, name: string) => String(f[name as keyof Fixture]));
  let req = (agents[role] as unknown as Record<string, (p: string) => request.Test>)[method.toLowerCase()]!(path).set(
    'Origin',
    TEST_ORIGIN,
  );
  if (rule.upload) return req.attach(rule.upload.field, rule.upload.bytes, rule.upload.name);
  if (route === 'POST /api/projects')
    return req.send({
      name: 'Mill Creek outfall',
      subcontractorCompanyId: w.companies.sub.id,
      ownerCompanyId: w.companies.owner.id,
    });
  if (method !== 'GET' && method !== 'DELETE') req = req.send(rule.body?.(f, role) ?? {});
  return req;
}

async function writes() {
  const [row] = await t.database.db.select({ n: count() }).from(auditEvents);
  return row!.n;
}

describe('the role matrix', () => {
  it('has a rule for every route a signed-in person can reach, and none for a route that is gone', () => {
    const routes = registeredRoutes(t.app);
    expect(routes.filter((r) => !(r in RULES) && !OUTSIDE_ROLES.includes(r))).toEqual([]);
    expect(Object.keys(RULES).filter((r) => !routes.includes(r))).toEqual([]);
  });

  it('answers 403 to every role a route does not allow, with a valid body, and writes nothing', async () => {
    const refused: string[] = [];
    for (const [route, rule] of Object.entries(RULES)) {
      const denied = ROLES.filter((r) => !rule.may.includes(r));
      if (denied.length === 0) continue;
      const f = await fixture(rule.payApp);
      for (const role of denied) {
        const before = await writes();
        const res = await call(role, route, f);
        const expected = rule.hiddenFrom?.includes(role) ? 404 : 403;
        if (res.status !== expected)
          refused.push(`${route} as ${role}: ${res.status} ${JSON.stringify(res.body?.error ?? '')}`);
        if ((await writes()) !== before) refused.push(`${route} as ${role}: wrote an audit event`);
      }
    }
    expect(refused).toEqual([]);
  }, 240_000);

  it('lets every role a route allows through its authorization, never with a 5xx', async () => {
    const stopped: string[] = [];
    const shared = await fixture();
    for (const [route, rule] of Object.entries(RULES)) {
      for (const role of rule.may) {
        // Reads change nothing and share one set of objects; each write gets its own.
        const res = await call(
          role,
          route,
          route.startsWith('GET') && !rule.payApp ? shared : await fixture(rule.payApp),
        );
        const through = (res.status >= 200 && res.status < 300) || (rule.passes ?? []).includes(res.status);
        if (!through) stopped.push(`${route} as ${role}: ${res.status} ${JSON.stringify(res.body?.error ?? '')}`);
      }
    }
    expect(stopped).toEqual([]);
  }, 240_000);

  it('never answers a read with internal fields: password hashes, tokens, secrets, storage keys, other sessions', async () => {
    // OWASP API Security Top 10 (2023) API3, broken object property level authorization.
    const f = await fixture();
    const leaks: string[] = [];
    const scan = (value: unknown, where: string) => {
      if (Array.isArray(value)) return value.forEach((v, i) => scan(v, `${where}[${i}]`));
      if (!value || typeof value !== 'object') return;
      for (const [key, v] of Object.entries(value)) {
        if (
          /password|hash|token|secret|storageKey|sessionId$|ipAddress|userAgent|idempotency/i.test(key) &&
          key !== 'stripeCheckoutSessionId'
        )
          leaks.push(`${where}.${key}`);
        scan(v, `${where}.${key}`);
      }
    };
    for (const [route, rule] of Object.entries(RULES)) {
      if (
        !route.startsWith('GET') ||
        route.endsWith('.pdf') ||
        route.endsWith('.csv') ||
        route.endsWith('/download') ||
        route.endsWith('/pdf')
      )
        continue;
      for (const role of rule.may) {
        const res = await call(role, route, f);
        scan(res.body, `${route} as ${role}`);
      }
    }
    expect(leaks).toEqual([]);
  }, 120_000);
});
