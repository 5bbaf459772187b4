import { and, eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  auditEvents,
  bidItems,
  companyMembers,
  lienWaivers,
  payAppLines,
  projectMembers,
  projects,
} from '../../server/db/schema';
import { addMember, makeBidItem, makeUser, makeWorld } from '../setup/factories';
import { makeCertifiedPayApp } from '../setup/payment-factories';
import { waitForMail } from '../setup/mail';
import { createTestApp, signedInAgent, TEST_ORIGIN, type TestApp } from '../setup/test-app';

// Product brief (people and roles): each party seat is held by people of that party's company, invited by their
// own company's admin; one person holds one party role on a project; whoever submits an application does not
// review or certify it. OWASP API Security Top 10 (2023) API5 (function level authorization); OWASP ASVS 4.0.3
// 4.1.3 (least privilege) and 1.4.1 / 4.2 (separation of duties is enforced on the server, not the screen).

let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
}, 60_000);
afterAll(() => t?.close());

type Who = keyof typeof w.people;
const as = (who: Who) => signedInAgent(t.app, w.people[who].email);
const anonymous = () => request.agent(t.app).set('Origin', TEST_ORIGIN);

/** The token of the accept link in the last mail to this address. */
async function tokenFor(email: string) {
  const mail = await waitForMail(t.mailbox, (m) => m.to.includes(email));
  return new RegExp(`${TEST_ORIGIN}/invitations/([A-Za-z0-9_-]+)`).exec(mail!.text)![1]!;
}

describe('a party company admin has no general contractor powers', () => {
  it("refuses the subcontractor's and the owner's admin every contract setting, and changes nothing", async () => {
    const item = await makeBidItem(t.database.db, w.home.id, { unitPriceCents: 725 });
    for (const who of ['subcontractor_admin', 'owner_admin'] as const) {
      const agent = await as(who);
      const price = await agent.patch(`/api/bid-items/${item.id}`).send({ unitPriceCents: 72_500 });
      expect(price.status, who).toBe(403);
      expect((await agent.patch(`/api/projects/${w.home.id}`).send({ retainageBps: 0 })).status, who).toBe(403);
      expect(
        (await agent.patch(`/api/projects/${w.home.id}`).send({ ownerApprovesChangeOrders: false })).status,
        who,
      ).toBe(403);
      expect(
        (
          await agent.post(`/api/projects/${w.home.id}/bid-items`).send({
            itemNumber: 'X-1',
            description: 'Rock',
            payUnit: 'CY',
            basis: 'bank',
            unitPriceCents: 1,
            contractQuantity: 1,
            isMajor: false,
            method: 'manual',
          })
        ).status,
        who,
      ).toBe(403);
    }
    const [after] = await t.database.db.select().from(bidItems).where(eq(bidItems.id, item.id));
    expect(after!.unitPriceCents).toBe(725);
    const [project] = await t.database.db.select().from(projects).where(eq(projects.id, w.home.id));
    expect(project!.retainageBps).toBe(1000);
  });

  it("lets the general contractor's admin keep the contract", async () => {
    expect((await (await as('admin')).patch(`/api/projects/${w.home.id}`).send({ paymentTermsDays: 45 })).status).toBe(
      200,
    );
  });

  it("refuses an admin an invitation to another company's seat (403 SEAT_OF_ANOTHER_COMPANY)", async () => {
    const cases: [Who, string][] = [
      ['subcontractor_admin', 'general_contractor'],
      ['subcontractor_admin', 'owner'],
      ['owner_admin', 'general_contractor'],
      ['admin', 'subcontractor'],
      ['admin', 'owner'],
    ];
    for (const [who, role] of cases) {
      const res = await (
        await as(who)
      )
        .post(`/api/projects/${w.home.id}/invitations`)
        .send({ email: `seat-${who}-${role}@example.test`.replace(/_/g, '-'), role });
      expect({ who, role, status: res.status, code: res.body.error?.code }).toEqual({
        who,
        role,
        status: 403,
        code: 'SEAT_OF_ANOTHER_COMPANY',
      });
    }
    // A seat member who is no admin invites nobody.
    expect(
      (
        await (
          await as('general_contractor')
        )
          .post(`/api/projects/${w.home.id}/invitations`)
          .send({ email: 'pm-invite@example.test', role: 'general_contractor' })
      ).status,
    ).toBe(403);
  });

  it('shows an admin the invitations to its own seat only', async () => {
    t.mailbox.clear();
    expect(
      (
        await (
          await as('subcontractor_admin')
        )
          .post(`/api/projects/${w.home.id}/invitations`)
          .send({ email: 'crew.lead@example.test', role: 'subcontractor' })
      ).status,
    ).toBe(201);
    const ownerList = await (await as('owner_admin')).get(`/api/projects/${w.home.id}/invitations`);
    expect(ownerList.status).toBe(200);
    expect(ownerList.body.invitations.map((i: { email: string }) => i.email)).not.toContain('crew.lead@example.test');
    const subList = await (await as('subcontractor_admin')).get(`/api/projects/${w.home.id}/invitations`);
    const mine = subList.body.invitations.find((i: { email: string }) => i.email === 'crew.lead@example.test');
    expect(mine).toBeDefined();
    const revoke = await (await as('admin')).delete(`/api/invitations/${mine.id}`);
    expect({ status: revoke.status, code: revoke.body.error?.code }).toEqual({
      status: 403,
      code: 'SEAT_OF_ANOTHER_COMPANY',
    });
  });
});

describe('one person holds one seat, of their own company', () => {
  it('refuses a second seat when inviting (409 ALREADY_HOLDS_SEAT)', async () => {
    const res = await (
      await as('subcontractor_admin')
    )
      .post(`/api/projects/${w.home.id}/invitations`)
      .send({ email: w.people.subcontractor.email, role: 'subcontractor' });
    expect({ status: res.status, code: res.body.error.code }).toEqual({ status: 409, code: 'ALREADY_HOLDS_SEAT' });
  });

  it('refuses a person of another company the seat on accepting (409 INVITEE_OF_ANOTHER_COMPANY), and seats nobody', async () => {
    // The general contractor's own person, invited to the subcontractor seat, cannot take it.
    t.mailbox.clear();
    expect(
      (
        await (
          await as('subcontractor_admin')
        )
          .post(`/api/projects/${w.home.id}/invitations`)
          .send({ email: w.people.admin.email, role: 'subcontractor' })
      ).status,
    ).toBe(201);
    const gcAdmin = await as('admin');
    const res = await gcAdmin.post(`/api/invitations/${await tokenFor(w.people.admin.email)}/accept`).send({});
    expect({ status: res.status, code: res.body.error.code }).toEqual({
      status: 409,
      code: 'INVITEE_OF_ANOTHER_COMPANY',
    });
    const seats = await t.database.db
      .select()
      .from(projectMembers)
      .where(and(eq(projectMembers.projectId, w.home.id), eq(projectMembers.userId, w.people.admin.id)));
    expect(seats).toEqual([]);
  });

  it('lets a new person take one seat and refuses the second invitation they accept', async () => {
    t.mailbox.clear();
    const email = 'two.hats@example.test';
    expect(
      (
        await (
          await as('subcontractor_admin')
        )
          .post(`/api/projects/${w.home.id}/invitations`)
          .send({ email, role: 'subcontractor' })
      ).status,
    ).toBe(201);
    const forSub = await tokenFor(email);
    t.mailbox.clear();
    expect(
      (await (await as('owner_admin')).post(`/api/projects/${w.home.id}/invitations`).send({ email, role: 'owner' }))
        .status,
    ).toBe(201);
    const forOwner = await tokenFor(email);
    const visitor = anonymous();
    expect(
      (
        await visitor
          .post(`/api/invitations/${forSub}/accept`)
          .send({ name: 'Two Hats', password: 'gravel-and-loam-2026' })
      ).status,
    ).toBe(200);
    const second = await visitor.post(`/api/invitations/${forOwner}/accept`).send({});
    expect(second.status).toBe(409);
    expect(['INVITEE_OF_ANOTHER_COMPANY', 'ALREADY_HOLDS_SEAT']).toContain(second.body.error.code);
    const me = await visitor.get('/api/me');
    const seats = await t.database.db.select().from(projectMembers).where(eq(projectMembers.userId, me.body.user.id));
    expect(seats.map((s) => s.role)).toEqual(['subcontractor']);
  });

  it('holds one seat per person in the database too (unique project and person)', async () => {
    await expect(addMember(t.database.db, w.home.id, w.people.subcontractor.id, 'owner')).rejects.toThrow();
  });

  it('counts a seat only while its holder belongs to the seat company', async () => {
    // A seat row for someone of another company gives nothing: the owner's person seated as subcontractor.
    const world = await makeWorld(t.database.db, t.auth);
    const stray = await makeUser(t.database.db, t.auth, world.companies.owner.id);
    await addMember(t.database.db, world.home.id, stray.id, 'subcontractor');
    const agent = await signedInAgent(t.app, stray.email);
    expect((await agent.get(`/api/projects/${world.home.id}`)).status).toBe(404);
  });
});

describe('separation of duties', () => {
  it('refuses review and certification to the person who submitted (403 SUBMITTER_CANNOT_REVIEW)', async () => {
    const db = t.database.db;
    const world = await makeWorld(db, t.auth);
    const app = await makeCertifiedPayApp(db, world.home.id, world.people.subcontractor.id, { status: 'draft' });
    const sub = await signedInAgent(t.app, world.people.subcontractor.email);
    expect((await sub.post(`/api/pay-apps/${app.id}/submit`).send({ expectedRevision: 0 })).status).toBe(200);
    // The submitter changes employer: leaves the subcontractor and is seated as the general contractor.
    await db
      .update(companyMembers)
      .set({ companyId: world.companies.gc.id })
      .where(eq(companyMembers.userId, world.people.subcontractor.id));
    await db
      .update(projectMembers)
      .set({ role: 'general_contractor' })
      .where(
        and(eq(projectMembers.projectId, world.home.id), eq(projectMembers.userId, world.people.subcontractor.id)),
      );
    const lines = await db.select().from(payAppLines).where(eq(payAppLines.payAppId, app.id));
    const review = { expectedRevision: 0, lines: lines.map((l) => ({ lineId: l.id, decision: 'approve' })) };
    const reviewed = await sub.post(`/api/pay-apps/${app.id}/review`).send(review);
    expect({ status: reviewed.status, code: reviewed.body.error?.code }).toEqual({
      status: 403,
      code: 'SUBMITTER_CANNOT_REVIEW',
    });
    const certified = await sub.post(`/api/pay-apps/${app.id}/certify`).send({ expectedRevision: 0 });
    expect({ status: certified.status, code: certified.body.error?.code }).toEqual({
      status: 403,
      code: 'SUBMITTER_CANNOT_REVIEW',
    });
    // Another person of the general contractor reviews it.
    const gc = await signedInAgent(t.app, world.people.general_contractor.email);
    expect((await gc.post(`/api/pay-apps/${app.id}/review`).send(review)).status).toBe(200);
  });
});

describe('lien waivers are signed under the signer’s own account name', () => {
  it('refuses a typed name that is not the account’s, and records the account name', async () => {
    const db = t.database.db;
    const app = await makeCertifiedPayApp(db, w.home.id, w.people.subcontractor.id, { number: 40 });
    const sub = await as('subcontractor');
    const forged = await sub
      .post(`/api/pay-apps/${app.id}/lien-waivers`)
      .send({ kind: 'conditional_progress', signedName: 'Somebody Else' });
    expect(forged.status).toBe(400);
    expect(forged.body.error.details[0].path).toBe('signedName');
    const accountName = w.people.subcontractor.email.split('@')[0]!;
    const signed = await sub
      .post(`/api/pay-apps/${app.id}/lien-waivers`)
      .send({ kind: 'conditional_progress', signedName: `  ${accountName.toUpperCase()} ` });
    expect(signed.status).toBe(201);
    const [row] = await db.select().from(lienWaivers).where(eq(lienWaivers.payAppId, app.id));
    expect(row!.signedName).toBe(accountName);
  });

  it('refuses a person who left the subcontractor company, though a seat row is left behind', async () => {
    const db = t.database.db;
    const world = await makeWorld(db, t.auth);
    const app = await makeCertifiedPayApp(db, world.home.id, world.people.subcontractor.id);
    await db
      .update(companyMembers)
      .set({ companyId: world.companies.gc.id })
      .where(eq(companyMembers.userId, world.people.subcontractor.id));
    const res = await (
      await signedInAgent(t.app, world.people.subcontractor.email)
    )
      .post(`/api/pay-apps/${app.id}/lien-waivers`)
      .send({ kind: 'conditional_progress', signedName: world.people.subcontractor.email.split('@')[0] });
    expect(res.status).toBe(404);
    expect(await db.select().from(lienWaivers).where(eq(lienWaivers.payAppId, app.id))).toEqual([]);
  });
});

describe('removing people', () => {
  it('lets a company admin remove its own person from a job: the seat goes, sessions end, one audit event', async () => {
    const db = t.database.db;
    const world = await makeWorld(db, t.auth);
    const victim = await signedInAgent(t.app, world.people.subcontractor.email);
    expect((await victim.get(`/api/projects/${world.home.id}`)).status).toBe(200);
    const gcAdmin = await signedInAgent(t.app, world.people.admin.email);
    const wrong = await gcAdmin.delete(`/api/projects/${world.home.id}/members/${world.people.subcontractor.id}`);
    expect({ status: wrong.status, code: wrong.body.error?.code }).toEqual({
      status: 403,
      code: 'SEAT_OF_ANOTHER_COMPANY',
    });
    expect(
      (
        await (
          await signedInAgent(t.app, world.people.general_contractor.email)
        ).delete(`/api/projects/${world.home.id}/members/${world.people.subcontractor.id}`)
      ).status,
    ).toBe(403);
    const subAdmin = await signedInAgent(t.app, world.people.subcontractor_admin.email);
    expect(
      (await subAdmin.delete(`/api/projects/${world.home.id}/members/${world.people.subcontractor.id}`)).status,
    ).toBe(204);
    expect((await victim.get('/api/me')).status).toBe(401);
    const again = await signedInAgent(t.app, world.people.subcontractor.email);
    expect((await again.get(`/api/projects/${world.home.id}`)).status).toBe(404);
    const events = await db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.projectId, world.home.id), eq(auditEvents.action, 'member.removed')));
    expect(events).toHaveLength(1);
    expect(events[0]!.before).toMatchObject({ role: 'subcontractor', email: world.people.subcontractor.email });
    expect(
      (await subAdmin.delete(`/api/projects/${world.home.id}/members/${world.people.subcontractor.id}`)).status,
    ).toBe(404);
  });

  it('lets a company admin remove a person from the company: seats through it go, sessions end, audit events', async () => {
    const db = t.database.db;
    const world = await makeWorld(db, t.auth);
    const victim = await signedInAgent(t.app, world.people.general_contractor.email);
    const gcAdmin = await signedInAgent(t.app, world.people.admin.email);
    // Another company's admin does not see this company at all.
    expect(
      (
        await (
          await signedInAgent(t.app, world.people.subcontractor_admin.email)
        ).delete(`/api/companies/${world.companies.gc.id}/members/${world.people.general_contractor.id}`)
      ).status,
    ).toBe(404);
    expect(
      (await victim.delete(`/api/companies/${world.companies.gc.id}/members/${world.people.admin.id}`)).status,
    ).toBe(403);
    const list = await gcAdmin.get(`/api/companies/${world.companies.gc.id}/members`);
    expect(list.body.members.map((m: { email: string }) => m.email).sort()).toEqual(
      [world.people.admin.email, world.people.general_contractor.email].sort(),
    );
    expect(
      (await gcAdmin.delete(`/api/companies/${world.companies.gc.id}/members/${world.people.general_contractor.id}`))
        .status,
    ).toBe(204);
    expect((await victim.get('/api/me')).status).toBe(401);
    expect(
      await db.select().from(projectMembers).where(eq(projectMembers.userId, world.people.general_contractor.id)),
    ).toEqual([]);
    expect(
      await db.select().from(companyMembers).where(eq(companyMembers.userId, world.people.general_contractor.id)),
    ).toEqual([]);
    const actions = (
      await db.select().from(auditEvents).where(eq(auditEvents.objectId, world.people.general_contractor.id))
    )
      .map((e) => e.action)
      .sort();
    expect(actions).toEqual(['company_member.removed', 'member.removed']);
    const last = await gcAdmin.delete(`/api/companies/${world.companies.gc.id}/members/${world.people.admin.id}`);
    expect({ status: last.status, code: last.body.error?.code }).toEqual({ status: 409, code: 'LAST_COMPANY_ADMIN' });
  });
});

describe('GET /api/companies lists what the person may see, not every company', () => {
  it("shows a subcontractor's person their own company and their jobs' parties only", async () => {
    const res = await (await as('subcontractor')).get('/api/companies');
    expect(res.status).toBe(200);
    const ids = res.body.companies.map((c: { id: string }) => c.id).sort();
    expect(ids).toEqual([w.companies.sub.id, w.companies.gc.id, w.companies.owner.id].sort());
  });

  it("shows the owner's admin no company of a job its company is not on", async () => {
    const res = await (await as('owner_admin')).get('/api/companies');
    const ids = res.body.companies.map((c: { id: string }) => c.id);
    for (const other of [w.companies.otherGc.id, w.companies.otherSub.id, w.companies.otherOwner.id])
      expect(ids).not.toContain(other);
  });

  it("shows a general contractor's person the subcontractor and owner companies a new job can name, and no other general contractor", async () => {
    const res = await (await as('general_contractor')).get('/api/companies');
    const byId = new Map(res.body.companies.map((c: { id: string; kind: string }) => [c.id, c.kind]));
    expect(byId.get(w.companies.otherSub.id)).toBe('subcontractor');
    expect(byId.get(w.companies.otherOwner.id)).toBe('owner');
    expect(byId.has(w.companies.otherGc.id)).toBe(false);
  });
});
