import { gzipSync } from 'node:zlib';
import fc from 'fast-check';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ZodType } from 'zod';
import {
  createChangeOrderSchema,
  approveChangeOrderSchema,
  rejectChangeOrderSchema,
} from '../../src/shared/schemas/change-order';
import { bidItemInputSchema, updateBidItemSchema } from '../../src/shared/schemas/bid-item';
import { gridSchema } from '../../src/shared/schemas/calc';
import { acceptInvitationSchema, createInvitationSchema } from '../../src/shared/schemas/invitation';
import {
  createPayAppSchema,
  disputeCommentSchema,
  editDisputeSchema,
  withdrawDisputeSchema,
  payAppActionSchema,
  reviewPayAppSchema,
  revisePayAppSchema,
} from '../../src/shared/schemas/pay-app';
import { createPaymentSchema, issueLienWaiverSchema } from '../../src/shared/schemas/payment';
import { createProjectSchema, updateProjectSchema } from '../../src/shared/schemas/project';
import { createTallySchema, updateTallySchema } from '../../src/shared/schemas/tally';
import { forecastInputSchema } from '../../src/shared/schemas/variance';
import { setLumpSumStagesSchema, setMeasurementProfileSchema } from '../../src/shared/schemas/provisions/profile';
import {
  createMaterialSourceSchema,
  createScaleTicketSchema,
  createTruckSchema,
  createTruckTicketSchema,
  importTruckTicketsSchema,
} from '../../src/shared/schemas/provisions/tickets';
import {
  makeChangeOrder,
  makeDailySheet,
  makeProfiledItem,
  makeSource,
  makeStoredMaterial,
} from '../setup/provisions-factories';
import {
  addStoredMovementSchema,
  createAdjustmentSchema,
  createForceAccountSheetSchema,
  createStoredMaterialSchema,
} from '../../src/shared/schemas/provisions/accounts';
import { changeOrders, disputes, invitations, payAppLines, tallyEvidence } from '../../server/db/schema';
import { hashToken } from '../../server/modules/invitations/invitation-token';
import { REAUTH_FIELD } from '../../server/middleware/require-recent-auth';
import { makeBidItem, makeWorld, sampleBidItem } from '../setup/factories';
import {
  arrayPaths,
  BOUNDARY_NUMBERS,
  deeplyNested,
  expectErrorShape,
  expectPrototypesClean,
  fingerprint,
  hasUnstorableText,
  HOSTILE_STRINGS,
  longArray,
  MALFORMED_JSON,
  MORE_NUMBERS,
  MORE_STRINGS,
  objectPaths,
  PROTO_MEMBERS,
  valuePaths,
  withRawMember,
  withRawValue,
  type JsonPath,
} from '../setup/hostile-json';
import { makeTally } from '../setup/pay-cycle-factories';
import { makeCertifiedPayApp } from '../setup/payment-factories';
import { registeredRoutes } from '../setup/routes';
import { createTestApp, signedInAgent, TEST_ORIGIN, type TestApp } from '../setup/test-app';

// Hostile and malformed request bodies against every route that could read one. Sources: OWASP API Security Top 10
// (2023) API4 (unrestricted resource consumption: body size, nesting, array length) and API8 (security
// misconfiguration: errors that leak or crash); OWASP ASVS 4.0.3 section 5.1 (input validation: 5.1.3 every input
// validated, 5.1.4 structured data checked against a schema) and 13.1.5 (an unexpected content type is refused);
// RFC 8259 sections 2, 6, 7 and 8.2 (JSON text, number grammar, strings, Unicode scalar values).
// Expectation for each refusal: 400 (413 for a body beyond the limit, 415 for a body that is not JSON), the error
// shape {error:{code,message,details?}}, never 5xx, no row written anywhere, and Object.prototype untouched.

type Role = 'subcontractor' | 'general_contractor' | 'owner' | 'owner_admin' | 'none';
type Ids = Record<string, string>;
/**
 * How a route reads its body. `json`: parsed by the app's JSON parser and checked by `schema` (the oracle: a body it
 * accepts may legitimately act; every other body must be refused). `none`: the route reads no body, so only bodies
 * the parser refuses are sent. `multipart`: an upload route (hostile files are in hostile-uploads.test.ts); a JSON
 * body is refused as a missing file. `signed-raw`: the Stripe webhook reads raw bytes and refuses any body whose
 * signature does not verify (400), before reading it. `alsoMultipart`: a JSON route that also takes its body as a
 * multipart form (a tally with its worksheet files in one request); a broken multipart body is refused with 400.
 */
type Spec =
  | {
      reads: 'json';
      role: Role;
      schema: ZodType;
      template: (ids: Ids) => unknown;
      limitBytes?: number;
      alsoMultipart?: boolean;
    }
  | { reads: 'none' | 'multipart'; role: Role }
  | { reads: 'signed-raw'; role: 'none' };

const json = (role: Role, schema: ZodType, template: (ids: Ids) => unknown, limitBytes?: number): Spec => ({
  reads: 'json',
  role,
  schema,
  template,
  limitBytes,
});
const MB = 1024 * 1024;
/** The app's JSON parser takes 1 MB (server/app.ts JSON_BODY_LIMIT); the routes that parse their own say theirs. */
const limitOf = (spec: Spec) => (spec.reads === 'json' && spec.limitBytes) || MB;
const none = (role: Role): Spec => ({ reads: 'none', role });

const gridInputs = {
  unit: 'ft',
  spacingX: 25,
  spacingY: 25,
  depths: [
    [1, 1.5],
    [2, 2.5],
  ],
};

/** Every route that could read a body (POST, PUT, PATCH, DELETE). A new one without an entry fails the first test. */
const ROUTES: Record<string, Spec> = {
  'POST /api/invitations/:token/accept': json(
    'none',
    acceptInvitationSchema,
    () => ({ name: 'Rowan Pell', password: 'gravel-haul-road-77' }),
    16 * 1024,
  ),
  'POST /api/webhooks/stripe': { reads: 'signed-raw', role: 'none' },
  'POST /api/calc/:method': json('owner', gridSchema, () => gridInputs, 32 * MB), // the grid method's limit (CALC_BODY_LIMITS)
  'POST /api/projects': json('general_contractor', createProjectSchema, (ids) => ({
    name: 'North haul road',
    subcontractorCompanyId: ids.subCompany,
    ownerCompanyId: ids.ownerCompany,
    retainageBps: 500,
    swellPercent: 20,
    allowPartialPayments: true,
  })),
  'PATCH /api/projects/:projectId': json('general_contractor', updateProjectSchema, () => ({
    location: 'Mile 4',
    retainageBps: 1000,
    retainageReducedBps: null,
    paymentTermsDays: 30,
    shrinkagePercent: 10,
  })),
  'POST /api/projects/:projectId/bid-items': json('general_contractor', bidItemInputSchema, () =>
    sampleBidItem({ itemNumber: 'H-1' }),
  ),
  'POST /api/projects/:projectId/bid-items/import': { reads: 'multipart', role: 'general_contractor' },
  'PATCH /api/bid-items/:bidItemId': json('general_contractor', updateBidItemSchema, () => ({
    description: 'Rock excavation',
    unitPriceCents: 1250,
    contractQuantity: 800,
    isMajor: true,
  })),
  'DELETE /api/bid-items/:bidItemId': none('general_contractor'),
  'POST /api/projects/:projectId/change-orders': json('general_contractor', createChangeOrderSchema, (ids) => ({
    title: 'Unsuitable material',
    reason: 'Muck at the low end',
    items: [
      { kind: 'change_quantity', bidItemId: ids.bidItemId, quantityDelta: 150.5 },
      { kind: 'change_price', bidItemId: ids.bidItemId, newUnitPriceCents: 900 },
      { kind: 'add_item', newItem: sampleBidItem({ itemNumber: 'CO-1' }) },
    ],
  })),
  'POST /api/change-orders/:id/approve': json('general_contractor', approveChangeOrderSchema, () => ({
    note: 'Agreed',
  })),
  'POST /api/change-orders/:id/reject': json('general_contractor', rejectChangeOrderSchema, () => ({
    note: 'Not in the contract',
  })),
  'PUT /api/bid-items/:bidItemId/forecast': json('general_contractor', forecastInputSchema, () => ({
    forecastQuantity: 1100,
    note: 'Survey of the cut',
  })),
  'POST /api/bid-items/:bidItemId/variance-change-order': none('general_contractor'),
  'POST /api/projects/:projectId/invitations': json('owner_admin', createInvitationSchema, () => ({
    email: 'inspector@example.test',
    role: 'owner',
  })),
  'DELETE /api/invitations/:id': none('owner_admin'),
  'DELETE /api/projects/:projectId/members/:userId': none('owner_admin'),
  'DELETE /api/companies/:companyId/members/:userId': none('owner_admin'),
  'POST /api/projects/:projectId/tallies': {
    ...json('subcontractor', createTallySchema, (ids) => ({
      bidItemId: ids.bidItemId,
      measuredOn: '2026-10-06',
      title: 'Grid at the pond',
      method: 'grid',
      inputs: gridInputs,
      component: 'cut',
      measuredBasis: 'bank',
    })),
    alsoMultipart: true,
  } as Spec,
  'PATCH /api/tallies/:tallyId': {
    ...json('subcontractor', updateTallySchema, () => ({
      title: 'Tape check',
      method: 'manual',
      quantity: 42.5,
      manualBasis: 'Measured with a tape at the toe',
      measuredOn: '2026-10-07',
    })),
    alsoMultipart: true,
  } as Spec,
  'POST /api/tallies/:tallyId/ready': none('subcontractor'),
  'DELETE /api/tallies/:tallyId': none('subcontractor'),
  'POST /api/tallies/:tallyId/evidence': { reads: 'multipart', role: 'subcontractor' },
  'POST /api/change-orders/:id/documents': { reads: 'multipart', role: 'subcontractor' },
  'POST /api/projects/:projectId/surface-baselines': { reads: 'multipart', role: 'subcontractor' },
  'POST /api/surface-baselines/:baselineId/accept': none('general_contractor'),
  'DELETE /api/evidence/:evidenceId': none('subcontractor'),
  'POST /api/projects/:projectId/pay-apps': json('subcontractor', createPayAppSchema, () => ({
    periodStart: '2026-12-01',
    periodEnd: '2026-12-31',
    isFinal: false,
  })),
  'POST /api/pay-apps/:payAppId/submit': json('subcontractor', payAppActionSchema, () => ({
    expectedRevision: 0,
    note: 'For review',
  })),
  'POST /api/pay-apps/:payAppId/review': json('general_contractor', reviewPayAppSchema, (ids) => ({
    expectedRevision: 0,
    lines: [
      { lineId: ids.lineId, decision: 'dispute', reason: 'Over the survey', counterQuantity: 120.25 },
      { lineId: ids.lineId2, decision: 'approve' },
    ],
  })),
  'POST /api/pay-apps/:payAppId/revise': json('subcontractor', revisePayAppSchema, (ids) => ({
    expectedRevision: 0,
    lines: [{ lineId: ids.lineId, action: 'answer', comment: 'See the tickets' }],
  })),
  'POST /api/pay-apps/:payAppId/certify': json('general_contractor', payAppActionSchema, () => ({
    expectedRevision: 0,
    note: 'Certified',
  })),
  'POST /api/disputes/:disputeId/comments': json('subcontractor', disputeCommentSchema, () => ({
    body: 'Truck tickets attached',
  })),
  'PATCH /api/disputes/:disputeId': json('general_contractor', editDisputeSchema, () => ({
    reason: 'Survey shows less',
    counterQuantity: 100,
  })),
  'POST /api/disputes/:disputeId/withdraw': json('general_contractor', withdrawDisputeSchema, () => ({
    note: 'Tickets found',
  })),
  'POST /api/pay-apps/:payAppId/payments': json('owner', createPaymentSchema, () => ({ partialAmountCents: 10_000 })),
  'POST /api/pay-apps/:payAppId/lien-waivers': json('subcontractor', issueLienWaiverSchema, (ids) => ({
    kind: 'conditional_progress',
    signedName: ids.subName,
  })),
  // Measurement and payment provisions (issue 15).
  'PUT /api/bid-items/:bidItemId/measurement-profile': json('general_contractor', setMeasurementProfileSchema, () => ({
    profile: 'plan_quantity',
    payDecimals: 1,
    stage: 'interim',
    settings: { percentComplete: 40, substantialErrorPercent: 5, substantialErrorCents: 500_000 },
  })),
  'PUT /api/bid-items/:bidItemId/lump-sum-stages': json('general_contractor', setLumpSumStagesSchema, () => ({
    stages: [
      { name: 'Clear west of Sta 12+00', percentOfItem: 60, completedOn: '2026-09-14' },
      { name: 'Clear east of Sta 12+00', percentOfItem: 40, completedOn: null },
    ],
  })),
  'POST /api/projects/:projectId/trucks': json('subcontractor', createTruckSchema, () => ({
    label: 'T-12',
    hauler: 'Orchard Haul',
    bedVolumeCy: 11.38,
    measuredBy: 'R. Baines',
    measuredOn: '2026-04-28',
  })),
  'POST /api/projects/:projectId/truck-tickets': json('subcontractor', createTruckTicketSchema, (ids) => ({
    bidItemId: ids.truckItemId,
    deliveredOn: '2026-05-04',
    truckLabel: 'T-12',
    material: 'Select borrow',
    source: 'Hollis pit',
    loadedAt: 'Face 2',
    deliveredTo: 'Sta 14+00',
    loadCheckerInitials: 'RB',
    deliveryCheckerInitials: 'MK',
    loadVolumeCy: 11.2,
  })),
  'POST /api/projects/:projectId/truck-tickets/import': json('subcontractor', importTruckTicketsSchema, (ids) => ({
    bidItemId: ids.truckItemId,
    csv: 'delivered_on,truck,material,source,loaded_at,delivered_to,load_checker,delivery_checker\n2026-05-04,T-12,Borrow,Hollis pit,Face 2,Sta 14+00,RB,MK\n',
  })),
  'POST /api/projects/:projectId/material-sources': json('subcontractor', createMaterialSourceSchema, () => ({
    name: 'Hollis pit',
    weighedLoads: [
      { netTons: 18.42, volumeCy: 12.5 },
      { netTons: 19.1, volumeCy: 13 },
      { netTons: 18.75, volumeCy: 12.7 },
    ],
    statedMoisturePercent: 5,
  })),
  'POST /api/projects/:projectId/daily-sheets': json('subcontractor', createForceAccountSheetSchema, (ids) => ({
    changeOrderId: ids.approvedChangeOrderId,
    workedOn: '2026-06-02',
    description: 'Muck removal at the inlet',
    labor: [{ trade: 'Operator', hours: 8, rateCents: 6250 }],
    equipment: [{ unit: 'Excavator', hours: 6, rateCents: 18_500, standbyHours: 2, standbyRateCents: 9250 }],
    materials: [{ description: 'Geotextile', invoiceCents: 41_238 }],
    markups: { laborPercent: 25, equipmentPercent: 15, materialPercent: 15 },
  })),
  'POST /api/daily-sheets/:sheetId/sign': none('subcontractor'),
  'POST /api/projects/:projectId/stored-materials': json('subcontractor', createStoredMaterialSchema, (ids) => ({
    bidItemId: ids.bidItemId,
    description: '24 in RCP',
    unit: 'LF',
    unitCostCents: 5840,
    neededQuantity: 400,
    storedAt: 'East yard',
  })),
  'POST /api/stored-materials/:storedMaterialId/movements': json('subcontractor', addStoredMovementSchema, () => ({
    kind: 'added',
    movedOn: '2026-05-12',
    quantity: 40,
    invoiceRef: 'INV-3381',
  })),
  'POST /api/projects/:projectId/pay-adjustments': json('general_contractor', createAdjustmentSchema, () => ({
    kind: 'fuel_adjustment',
    appliesOn: '2026-06-30',
    description: 'June diesel index',
    fuelKind: 'excavation',
    quantityCy: 25_000,
    baseIndex: 2.85,
    currentIndex: 3.215,
    triggerPercent: 0,
  })),
  'POST /api/projects/:projectId/scale-tickets': json('subcontractor', createScaleTicketSchema, (ids) => ({
    bidItemId: ids.weightItemId,
    sourceId: ids.sourceId,
    ticketNumber: '40117',
    weighedOn: '2026-05-04',
    grossTons: 33.85,
    tareTons: 13.85,
    material: 'Base',
    moisturePercent: 8,
    scaleCheckerInitials: 'JT',
    deliveryCheckerInitials: 'MK',
  })),
};

const SEED = Number(process.env.FC_SEED ?? 20261202);
const RUNS = 25;
const TOKEN = 'hostile-input-invitation-token-0001';

let t: TestApp;
let ids: Ids;
let agents: Record<Role, ReturnType<typeof request.agent> | ReturnType<typeof request>>;
let baseline: Record<string, string>;

beforeAll(async () => {
  t = await createTestApp();
  const db = t.database.db;
  const w = await makeWorld(db, t.auth);
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
  const certified = await makeCertifiedPayApp(db, w.home.id, w.people.subcontractor.id);
  const open = await makeCertifiedPayApp(db, w.home.id, w.people.subcontractor.id, {
    number: 2,
    status: 'submitted',
    periodEnd: '2026-11-30',
  });
  const lines = await db.select().from(payAppLines);
  const [line, line2] = lines.filter((l) => l.payAppId === open.id);
  const [dispute] = await db
    .insert(disputes)
    .values({ payAppId: open.id, lineId: line!.id, revision: 0, reason: 'r', counterQuantity: 1, openedByUserId: gc })
    .returning();
  const [co] = await db
    .insert(changeOrders)
    .values({ projectId: w.home.id, number: 1, title: 'CO', proposedByUserId: gc })
    .returning();
  const [invitation] = await db
    .insert(invitations)
    .values({
      projectId: w.home.id,
      email: 'new.person@example.test',
      role: 'owner',
      tokenHash: hashToken(TOKEN),
      invitedByUserId: gc,
      expiresAt: new Date(Date.now() + 86_400_000),
    })
    .returning();
  const approved = await makeChangeOrder(db, w.home.id, gc);
  ids = {
    projectId: w.home.id,
    bidItemId: item.id,
    tallyId: tally.id,
    evidenceId: evidence!.id,
    payAppId: open.id,
    certifiedPayAppId: certified.id,
    lineId: line!.id,
    lineId2: line2!.id,
    disputeId: dispute!.id,
    token: TOKEN,
    method: 'grid',
    id: co!.id,
    invitationId: invitation!.id,
    subCompany: w.companies.sub.id,
    ownerCompany: w.companies.owner.id,
    companyId: w.companies.owner.id,
    userId: w.people.owner.id,
    // Waivers are signed under the account's own name (the factories name a person after the e-mail).
    subName: w.people.subcontractor.email.split('@')[0]!,
    truckItemId: (await makeProfiledItem(db, w.home.id, 'truck_measure')).id,
    weightItemId: (await makeProfiledItem(db, w.home.id, 'weight', { payUnit: 'TON' })).id,
    sourceId: (await makeSource(db, w.home.id)).id,
    approvedChangeOrderId: approved.id,
    sheetId: (await makeDailySheet(db, w.home.id, approved.id, gc)).id,
    storedMaterialId: (await makeStoredMaterial(db, w.home.id, item.id)).id,
  };
  agents = {
    none: request(t.app),
    subcontractor: await signedInAgent(t.app, w.people.subcontractor.email),
    general_contractor: await signedInAgent(t.app, w.people.general_contractor.email),
    owner: await signedInAgent(t.app, w.people.owner.email),
    owner_admin: await signedInAgent(t.app, w.people.owner_admin.email),
  };
  await t.outboxIdle();
  baseline = await fingerprint(db);
});
afterAll(() => t.close());

/** The route with this world's ids; payments and waivers go to the certified application. */
function concrete(route: string): { method: string; path: string } {
  const [method, template] = route.split(' ') as [string, string];
  const path = template
    .replace(/invitations\/:id$/, `invitations/${ids.invitationId}`)
    .replace(
      /pay-apps\/:payAppId\/(payments|lien-waivers)/,
      (_m, what: string) => `pay-apps/${ids.certifiedPayAppId}/${what}`,
    )
    .replace(/:(\w+)/g, (_m, name: string) => ids[name] ?? 'missing');
  return { method: method.toLowerCase(), path };
}

type Sent = { body: string | Buffer; contentType?: string | null; headers?: Record<string, string> };

function send(route: string, s: Sent) {
  const spec = ROUTES[route]!;
  const { method, path } = concrete(route);
  const agent = agents[spec.role] as unknown as Record<string, (p: string) => request.Test>;
  let req = agent[method]!(path).set('Origin', TEST_ORIGIN);
  for (const [k, v] of Object.entries(s.headers ?? {})) req = req.set(k, v);
  if (s.contentType !== null) req = req.set('Content-Type', s.contentType ?? 'application/json');
  // superagent would re-serialise a Buffer or a JSON-typed body, and call a bare string a form: send the bytes as given.
  const bytes = s.contentType === null ? Buffer.from(s.body) : s.body;
  return req.serialize((b: unknown) => b as string).send(bytes as string);
}

const preview = (body: string | Buffer) => (typeof body === 'string' ? body : `<${body.length} bytes>`).slice(0, 160);

/** What the route's schema says of a JSON text (the reauth password is taken off the body before the schema). */
function acceptedByOracle(spec: Spec, text: string | Buffer): boolean {
  if (spec.reads !== 'json' || typeof text !== 'string') return false;
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch {
    return false;
  }
  if (body === null || typeof body !== 'object') return false;
  if (!Array.isArray(body)) delete (body as Record<string, unknown>)[REAUTH_FIELD];
  return spec.schema.safeParse(body).success && !hasUnstorableText(body);
}

/**
 * Sends one body and checks the answer: never 5xx, and any 4xx in the error shape. A body the oracle refuses must
 * get one of `refusals` and write nothing. A body it accepts is a valid request: it may act, or meet the service's
 * own rules (state, money), which the route's own tests cover; either way the baseline moves on.
 */
async function probe(route: string, s: Sent, refusals: number[]) {
  const spec = ROUTES[route]!;
  // A body beyond the route's limit is refused for its size before it is parsed (413, OWASP API4:2023).
  if (!s.headers && Buffer.byteLength(s.body) > limitOf(spec)) refusals = [413];
  const res = await send(route, s);
  const context = `${route} <- ${s.contentType ?? 'application/json'} ${preview(s.body)} -> ${res.status} ${JSON.stringify(res.body)?.slice(0, 200)}`;
  const before = baseline;
  // An accepted request may have queued mail that goes out after the answer; the next refusal must not see that.
  await t.outboxIdle();
  baseline = await fingerprint(t.database.db);
  expect(res.status, context).toBeLessThan(500);
  expectPrototypesClean(context);
  const accepted =
    acceptedByOracle(spec, s.body) && (s.contentType ?? 'application/json') === 'application/json' && !s.headers;
  if (res.status >= 400) expectErrorShape(res, context);
  if (!accepted) {
    expect(refusals, context).toContain(res.status);
    expect(baseline, `${context}: a refusal wrote to the database`).toEqual(before);
  }
  return res;
}

const JSON_ROUTES = () => Object.keys(ROUTES).filter((r) => ROUTES[r]!.reads === 'json');
const jsonSpec = (route: string) => ROUTES[route] as Extract<Spec, { reads: 'json' }>;
/** Refusal of a JSON body: 400; for an upload route (the JSON is no file) and the webhook (no signature) also 400. */
const REFUSED = [400];
const valueAt = (v: unknown, p: JsonPath) => p.reduce<unknown>((x, k) => (x as Record<string | number, unknown>)[k], v);

describe('the routes under test', () => {
  it('has an entry for every route that could read a body, and none that does not exist', () => {
    const bodyRoutes = registeredRoutes(t.app).filter((r) => !r.startsWith('GET '));
    expect(bodyRoutes.filter((r) => !(r in ROUTES))).toEqual([]);
    expect(Object.keys(ROUTES).filter((r) => !bodyRoutes.includes(r))).toEqual([]);
  });

  it('has templates the schemas accept, so every mutation starts from a body that would reach the service', () => {
    for (const route of JSON_ROUTES())
      expect(jsonSpec(route).schema.safeParse(jsonSpec(route).template(ids)).error, route).toBeUndefined();
  });
});

describe.each(JSON_ROUTES())('%s with hostile JSON', (route) => {
  const template = () => jsonSpec(route).template(ids);

  it('refuses random JSON values, wrongly typed fields and random text (fast-check)', async () => {
    const keys = Object.keys(template() as object);
    const anyJson = fc.oneof(
      fc.jsonValue().map((v) => JSON.stringify(v)),
      fc.anything().map((v) => {
        try {
          return JSON.stringify(v) ?? 'null';
        } catch {
          return 'null';
        }
      }),
      fc
        .record(Object.fromEntries(keys.map((k) => [k, fc.jsonValue()])), { requiredKeys: [] })
        .map((v) => JSON.stringify(v)),
      fc
        .tuple(fc.constantFrom(...valuePaths(template())), fc.jsonValue())
        .map(([p, v]) => withRawValue(template(), p, JSON.stringify(v))),
      fc.string({ unit: 'binary' }),
    );
    await fc.assert(
      fc.asyncProperty(anyJson, async (body) => void (await probe(route, { body }, REFUSED))),
      { numRuns: RUNS, seed: SEED },
    );
  });

  it('refuses boundary numbers (RFC 8259 section 6) at every field, and at every numeric field each of them', async () => {
    const paths = valuePaths(template());
    const numeric = paths.filter((p) => typeof valueAt(template(), p) === 'number');
    for (const p of numeric)
      for (const raw of BOUNDARY_NUMBERS) await probe(route, { body: withRawValue(template(), p, raw) }, REFUSED);
    const anywhere = fc.tuple(fc.constantFrom(...paths), fc.constantFrom(...BOUNDARY_NUMBERS, ...MORE_NUMBERS));
    await fc.assert(
      fc.asyncProperty(
        anywhere,
        async ([p, raw]) => void (await probe(route, { body: withRawValue(template(), p, raw) }, REFUSED)),
      ),
      { numRuns: RUNS, seed: SEED },
    );
  });

  it('refuses text that cannot be stored as sent (NUL, lone surrogates) and survives RTL marks and 10k characters at every field', async () => {
    const paths = valuePaths(template());
    const strings = paths.filter((p) => typeof valueAt(template(), p) === 'string');
    for (const p of strings)
      for (const raw of HOSTILE_STRINGS) await probe(route, { body: withRawValue(template(), p, raw) }, REFUSED);
    const anywhere = fc.tuple(fc.constantFrom(...paths), fc.constantFrom(...HOSTILE_STRINGS, ...MORE_STRINGS));
    await fc.assert(
      fc.asyncProperty(
        anywhere,
        async ([p, raw]) => void (await probe(route, { body: withRawValue(template(), p, raw) }, REFUSED)),
      ),
      { numRuns: RUNS, seed: SEED },
    );
    for (const p of objectPaths(template()).slice(0, 2)) {
      for (const key of ['"a\\u0000b"', '"\\ud800"', JSON.stringify('k'.repeat(10_000))])
        await probe(route, { body: withRawMember(template(), p, `${key}:1`) }, REFUSED);
    }
  });

  it('refuses prototype-pollution keys (__proto__, constructor, prototype) in every object, sent as raw JSON text', async () => {
    for (const p of objectPaths(template()))
      for (const member of PROTO_MEMBERS) await probe(route, { body: withRawMember(template(), p, member) }, REFUSED);
    await probe(route, { body: `[{${PROTO_MEMBERS[0]}}]` }, REFUSED);
  });

  it('refuses empty arrays, 10^6-element arrays (413 beyond the body limit) and deeply nested values', async () => {
    // About 2 MB: beyond the 1 MB limit (413), within the calc API's 128 MB, where its schema refuses it (400).
    const big = longArray(1_000_000);
    for (const p of arrayPaths(template())) {
      await probe(route, { body: withRawValue(template(), p, '[]') }, REFUSED);
      await probe(route, { body: withRawValue(template(), p, big) }, REFUSED);
    }
    await probe(route, { body: big }, REFUSED);
    await probe(route, { body: withRawMember(template(), [], `"extra":${big}`) }, REFUSED);
    await probe(route, { body: '[]' }, REFUSED);
    await probe(route, { body: '{}' }, REFUSED);
    for (const p of valuePaths(template()).slice(0, 4))
      await probe(route, { body: withRawValue(template(), p, deeplyNested(5_000)) }, REFUSED);
    await probe(route, { body: deeplyNested(150_000) }, REFUSED); // about 900 kB, inside the limit
    await probe(route, { body: `${'['.repeat(400_000)}${']'.repeat(400_000)}` }, REFUSED);
  });

  it('refuses a valid body under a content type other than JSON with 415 (OWASP ASVS 4.0.3 13.1.5)', async () => {
    const body = JSON.stringify(template());
    for (const contentType of [
      'text/plain',
      'application/x-www-form-urlencoded',
      'multipart/form-data; boundary=x',
      'application/xml',
      'text/csv',
      null,
    ]) {
      const multipartHere = jsonSpec(route).alsoMultipart && contentType?.startsWith('multipart/');
      await probe(route, { body, contentType }, multipartHere ? [400] : [415]);
    }
    await probe(
      route,
      { body: Buffer.from(body, 'utf16le'), contentType: 'application/json; charset=utf-16' },
      [400, 415],
    );
    await probe(route, { body, contentType: 'application/json; charset=latin1' }, [415]);
  });

  it('refuses malformed JSON text (RFC 8259), a gzip bomb (413) and an unknown content encoding (415)', async () => {
    for (const body of MALFORMED_JSON) await probe(route, { body }, REFUSED);
    const bomb = gzipSync(Buffer.alloc(2 * limitOf(ROUTES[route]!), 0x20)); // a few kB that inflate to twice the limit
    await probe(route, { body: bomb, headers: { 'Content-Encoding': 'gzip' } }, [413]);
    const compress = await probe(
      route,
      { body: JSON.stringify(template()), headers: { 'Content-Encoding': 'compress' } },
      [415],
    );
    expect(compress.body.error.code).toBe('UNSUPPORTED_ENCODING');
  });
});

describe.each(Object.keys(ROUTES).filter((r) => ROUTES[r]!.reads !== 'json'))(
  '%s, which reads no JSON body',
  (route) => {
    const spec = () => ROUTES[route]!;

    it('refuses malformed and oversized JSON before the route runs, and writes nothing', async () => {
      for (const body of MALFORMED_JSON) await probe(route, { body }, REFUSED);
      await probe(route, { body: longArray(1_000_000) }, [413]);
      await probe(
        route,
        { body: gzipSync(Buffer.alloc(2 * MB, 0x20)), headers: { 'Content-Encoding': 'gzip' } },
        [413],
      );
    });

    it('refuses random JSON bodies where the route needs a file or a signature', async () => {
      if (spec().reads === 'none') return; // the route ignores a body it does not read: nothing to refuse
      const body = fc.oneof(
        fc.jsonValue().map((v) => JSON.stringify(v)),
        fc.constantFrom(...PROTO_MEMBERS.map((m) => `{${m}}`)),
      );
      await fc.assert(
        fc.asyncProperty(body, async (b) => void (await probe(route, { body: b }, REFUSED))),
        { numRuns: RUNS, seed: SEED },
      );
    });

    it('refuses a body that is not JSON: 415, or 400 where the route takes a multipart form or a signed raw body', async () => {
      const reads = spec().reads;
      for (const contentType of ['text/plain', 'application/xml', 'multipart/form-data; boundary=x', null]) {
        const multipartHere = reads === 'multipart' && contentType?.startsWith('multipart/');
        await probe(route, { body: 'hello', contentType }, reads === 'signed-raw' || multipartHere ? [400] : [415]);
      }
    });
  },
);
