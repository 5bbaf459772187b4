import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeWorld } from '../setup/factories';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

// Issue 14, item 5: a company page for its admins, with the company's people, the seats they hold through it on
// each job, and the invitations still open. OWASP API Security Top 10 (2023) API1 (object level authorization):
// another company's page is 404, never a hint that it exists.

let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
}, 60_000);
afterAll(() => t?.close());

describe('the company page', () => {
  it("shows the admin's company, each person's seats by job, and the open invitation to its seat", async () => {
    const admin = await signedInAgent(t.app, w.people.subcontractor_admin.email);
    const sent = await admin
      .post(`/api/projects/${w.home.id}/invitations`)
      .send({ email: 'new.grader@example.test', role: 'subcontractor' });
    expect(sent.status).toBe(201);

    const res = await admin.get(`/api/companies/${w.companies.sub.id}`);
    expect(res.status).toBe(200);
    expect(res.body.company).toEqual({ id: w.companies.sub.id, name: w.companies.sub.name, kind: 'subcontractor' });
    const byEmail = Object.fromEntries(
      res.body.people.map((p: { email: string; isAdmin: boolean; seats: unknown[] }) => [p.email, p]),
    );
    expect(Object.keys(byEmail).sort()).toEqual(
      [w.people.subcontractor.email, w.people.subcontractor_admin.email].sort(),
    );
    expect(byEmail[w.people.subcontractor.email].seats).toEqual([
      { projectId: w.home.id, projectName: w.home.name, role: 'subcontractor' },
    ]);
    expect(byEmail[w.people.subcontractor_admin.email]).toMatchObject({ isAdmin: true, seats: [] });
    expect(res.body.invitations).toHaveLength(1);
    expect(res.body.invitations[0]).toMatchObject({
      email: 'new.grader@example.test',
      role: 'subcontractor',
      projectId: w.home.id,
      projectName: w.home.name,
      invitedBy: byEmail[w.people.subcontractor_admin.email].name,
      expired: false,
    });
    // Never the token or its hash.
    expect(JSON.stringify(res.body)).not.toMatch(/token/i);
  });

  it("lists no other company's people or invitations", async () => {
    const gcAdmin = await signedInAgent(t.app, w.people.admin.email);
    const res = await gcAdmin.get(`/api/companies/${w.companies.gc.id}`);
    expect(res.status).toBe(200);
    const emails = res.body.people.map((p: { email: string }) => p.email);
    expect(emails).not.toContain(w.people.subcontractor.email);
    expect(res.body.invitations.map((i: { email: string }) => i.email)).not.toContain('new.grader@example.test');
  });

  it("answers 404 to another company's admin and to a made-up id, and 403 to a member who is no admin", async () => {
    const gcAdmin = await signedInAgent(t.app, w.people.admin.email);
    expect((await gcAdmin.get(`/api/companies/${w.companies.sub.id}`)).status).toBe(404);
    expect((await gcAdmin.get('/api/companies/not-a-company')).status).toBe(404);
    const member = await signedInAgent(t.app, w.people.subcontractor.email);
    expect((await member.get(`/api/companies/${w.companies.sub.id}`)).status).toBe(403);
  });
});
