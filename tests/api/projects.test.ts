import request from 'supertest';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEvents, projectMembers } from '../../server/db/schema';
import { makeBidItem, makeWorld } from '../setup/factories';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
  await makeBidItem(t.database.db, w.home.id, { itemNumber: 'A1', contractQuantity: 1234.5, unitPriceCents: 685 });
  await makeBidItem(t.database.db, w.home.id, { itemNumber: 'A2', contractQuantity: 1, unitPriceCents: 1_000_000 });
});
afterAll(() => t.close());

const as = (who: keyof typeof w.people | 'outsider') =>
  signedInAgent(t.app, who === 'outsider' ? w.outsider.email : w.people[who].email);

describe('GET /api/projects', () => {
  it('returns 401 UNAUTHENTICATED without a session', async () => {
    const res = await request(t.app).get('/api/projects');
    expect(res.status).toBe(401);
    expect(res.body).toEqual({ error: { code: 'UNAUTHENTICATED', message: expect.any(String) } });
  });

  it('lists only the projects the person is on, with roles and the contract sum', async () => {
    const res = await (await as('subcontractor')).get('/api/projects');
    expect(res.status).toBe(200);
    expect(res.body.projects).toHaveLength(1);
    // 1234.5 CY x $6.85 = $8,456.325 -> $8,456.33 (rounded once per line) + $10,000.00
    expect(res.body.projects[0]).toMatchObject({ name: 'Home', myRoles: ['subcontractor'], bidItemCount: 2, contractSumCents: 1_845_633 });
  });

  it('shows a company admin the projects of the company as admin', async () => {
    const res = await (await as('admin')).get('/api/projects');
    expect(res.body.projects.map((p: { name: string; myRoles: string[] }) => [p.name, p.myRoles])).toEqual([
      ['Home', ['general_contractor_admin']],
    ]);
  });
});

describe('GET /api/projects/:projectId', () => {
  it('gives a member the project with its companies and people', async () => {
    const res = await (await as('owner')).get(`/api/projects/${w.home.id}`);
    expect(res.status).toBe(200);
    expect(res.body.project.companies.owner.id).toBe(w.companies.owner.id);
    expect(res.body.project.members).toHaveLength(3);
  });

  it('returns 404 for a project the caller is not on, never revealing it exists', async () => {
    const agent = await as('outsider');
    const res = await agent.get(`/api/projects/${w.home.id}`);
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('NOT_FOUND');
    expect((await agent.get('/api/projects/not-a-uuid')).status).toBe(404);
  });
});

describe('POST /api/projects', () => {
  const body = () => ({ name: 'Ridge Road widening', subcontractorCompanyId: w.companies.sub.id, ownerCompanyId: w.companies.owner.id });

  it('lets a general contractor set up a project and join it as its general contractor, with an audit event', async () => {
    const res = await (await as('general_contractor')).post('/api/projects').send(body());
    expect(res.status).toBe(201);
    expect(res.body.project).toMatchObject({ name: 'Ridge Road widening', retainageBps: 1000, myRoles: ['general_contractor'] });
    const members = await t.database.db.select().from(projectMembers).where(eq(projectMembers.projectId, res.body.project.id));
    expect(members.map((m) => m.role)).toEqual(['general_contractor']);
    const audit = await t.database.db.select().from(auditEvents).where(eq(auditEvents.objectId, res.body.project.id));
    expect(audit.map((a) => a.action)).toEqual(['project.created']);
  });

  it('returns 403 FORBIDDEN for a subcontractor', async () => {
    const res = await (await as('subcontractor')).post('/api/projects').send(body());
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('FORBIDDEN');
  });

  it('returns 400 with field paths for bad input and for companies of the wrong kind', async () => {
    const agent = await as('general_contractor');
    const bad = await agent.post('/api/projects').send({ name: '', retainageBps: -5, subcontractorCompanyId: 'x' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('VALIDATION_FAILED');
    const paths = bad.body.error.details.map((d: { path: string }) => d.path);
    expect(paths).toEqual(expect.arrayContaining(['name', 'retainageBps', 'subcontractorCompanyId', 'ownerCompanyId']));
    const swapped = await agent.post('/api/projects').send({ ...body(), subcontractorCompanyId: w.companies.owner.id });
    expect(swapped.status).toBe(400);
    expect(swapped.body.error.details).toEqual([{ path: 'subcontractorCompanyId', message: 'Choose a subcontractor company.' }]);
  });

  it('refuses fields the caller may not set (mass assignment)', async () => {
    const res = await (await as('general_contractor')).post('/api/projects').send({ ...body(), generalContractorCompanyId: w.companies.otherGc.id });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].message).toMatch(/unrecognized/i);
  });
});

describe('PATCH /api/projects/:projectId', () => {
  it('lets the general contractor change settings and records before and after', async () => {
    const res = await (await as('general_contractor')).patch(`/api/projects/${w.home.id}`).send({ retainageBps: 500 });
    expect(res.status).toBe(200);
    expect(res.body.project.retainageBps).toBe(500);
  });

  it('returns 403 for the owner and the subcontractor, 404 for an outsider', async () => {
    expect((await (await as('owner')).patch(`/api/projects/${w.home.id}`).send({ retainageBps: 0 })).status).toBe(403);
    expect((await (await as('subcontractor')).patch(`/api/projects/${w.home.id}`).send({ retainageBps: 0 })).status).toBe(403);
    expect((await (await as('outsider')).patch(`/api/projects/${w.home.id}`).send({ retainageBps: 0 })).status).toBe(404);
  });

  it('answers an empty change with 400 and writes nothing', async () => {
    const res = await (await as('general_contractor')).patch(`/api/projects/${w.home.id}`).send({});
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'VALIDATION_FAILED', message: expect.any(String) });
  });
});
