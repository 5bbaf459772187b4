import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEvents, companyMembers, invitations } from '../../server/db/schema';
import { smtpMailer } from '../../server/integrations/mailer/mailer';
import { makeUser, makeWorld } from '../setup/factories';
import { waitForMail } from '../setup/mail';
import { createTestApp, signedInAgent, TEST_ORIGIN, type TestApp } from '../setup/test-app';

let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
});
afterAll(() => t.close());

const as = (who: keyof typeof w.people | 'outsider') =>
  signedInAgent(t.app, who === 'outsider' ? w.outsider.email : w.people[who].email);
const anonymous = () => request.agent(t.app).set('Origin', TEST_ORIGIN);

/** Invites (by the admin of the seat's company) and returns the token from the accept link of the caught e-mail. */
const ADMIN_OF = { subcontractor: 'subcontractor_admin', general_contractor: 'admin', owner: 'owner_admin' } as const;
async function invite(
  email: string,
  role: keyof typeof ADMIN_OF = 'subcontractor',
  who: keyof typeof w.people = ADMIN_OF[role],
) {
  t.mailbox.clear();
  const res = await (await as(who)).post(`/api/projects/${w.home.id}/invitations`).send({ email, role });
  expect(res.status).toBe(201);
  const mail = await waitForMail(t.mailbox, (m) => m.to.includes(email));
  const link = new RegExp(`${TEST_ORIGIN}/invitations/([A-Za-z0-9_-]+)`).exec(mail!.text);
  expect(link).not.toBeNull();
  expect(mail!.html).toContain(`href="${link![0]}"`);
  return { token: link![1]!, invitation: res.body.invitation, mail: mail! };
}

describe('invitations: sending', () => {
  it('e-mails an accept link (HTML and text) and stores only the SHA-256 of the token', async () => {
    const { token, invitation, mail } = await invite('new.person@example.test');
    expect(mail.subject).toContain(w.home.name);
    expect(mail.text).toContain('Home');
    const [row] = await t.database.db.select().from(invitations).where(eq(invitations.id, invitation.id));
    expect(row!.tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(row!.tokenHash).not.toContain(token);
    // 7 days of validity (our product setting)
    expect(Math.round((row!.expiresAt.getTime() - row!.createdAt.getTime()) / 86_400_000)).toBe(7);
  });

  it('lets the company admin invite and refuses the subcontractor (403) and an outsider (404)', async () => {
    expect(
      (
        await (
          await as('owner_admin')
        )
          .post(`/api/projects/${w.home.id}/invitations`)
          .send({ email: 'a1@example.test', role: 'owner' })
      ).status,
    ).toBe(201);
    expect(
      (
        await (
          await as('subcontractor')
        )
          .post(`/api/projects/${w.home.id}/invitations`)
          .send({ email: 'a2@example.test', role: 'owner' })
      ).status,
    ).toBe(403);
    expect(
      (
        await (
          await as('outsider')
        )
          .post(`/api/projects/${w.home.id}/invitations`)
          .send({ email: 'a3@example.test', role: 'owner' })
      ).status,
    ).toBe(404);
    const bad = await (
      await as('admin')
    )
      .post(`/api/projects/${w.home.id}/invitations`)
      .send({ email: 'not-an-email', role: 'boss' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual(['email', 'role']);
  });
});

describe('invitations: accepting', () => {
  it('creates the account from the link, joins the project and the role’s company, and works once', async () => {
    const { token } = await invite('fresh.hand@example.test', 'subcontractor');
    const visitor = anonymous();
    const preview = await visitor.get(`/api/invitations/${token}`);
    expect(preview.status).toBe(200);
    expect(preview.body.invitation).toMatchObject({
      projectName: 'Home',
      role: 'subcontractor',
      email: 'fresh.hand@example.test',
      hasAccount: false,
    });
    const short = await visitor
      .post(`/api/invitations/${token}/accept`)
      .send({ name: 'Fresh Hand', password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.details[0].path).toBe('password');
    const accepted = await visitor
      .post(`/api/invitations/${token}/accept`)
      .send({ name: 'Fresh Hand', password: 'gravel-and-loam-2026' });
    expect(accepted.status).toBe(200);
    expect((await visitor.get(`/api/projects/${w.home.id}`)).status).toBe(200);
    const me = await visitor.get('/api/me');
    const [company] = await t.database.db
      .select()
      .from(companyMembers)
      .where(eq(companyMembers.userId, me.body.user.id));
    expect(company!.companyId).toBe(w.companies.sub.id);
    expect(
      (await anonymous().post(`/api/invitations/${token}/accept`).send({ name: 'X', password: 'gravel-and-loam-2026' }))
        .status,
    ).toBe(409);
    expect((await anonymous().get(`/api/invitations/${token}`)).status).toBe(409);
    const actions = (
      await t.database.db.select().from(auditEvents).where(eq(auditEvents.objectType, 'invitation'))
    ).map((e) => e.action);
    expect(actions).toContain('invitation.accepted');
  });

  it('asks an existing account to sign in as itself: 401 without a session, 403 as someone else', async () => {
    const { token } = await invite(w.outsider.email, 'owner');
    expect((await anonymous().get(`/api/invitations/${token}`)).body.invitation.hasAccount).toBe(true);
    expect((await anonymous().post(`/api/invitations/${token}/accept`).send({})).status).toBe(401);
    expect((await (await as('owner')).post(`/api/invitations/${token}/accept`).send({})).status).toBe(403);
    // Signed in as itself, a person of another company still cannot take the owner's seat (seats tied to companies).
    const outsider = await as('outsider');
    expect((await outsider.get(`/api/projects/${w.home.id}`)).status).toBe(404);
    const refused = await outsider.post(`/api/invitations/${token}/accept`).send({});
    expect({ status: refused.status, code: refused.body.error.code }).toEqual({
      status: 409,
      code: 'INVITEE_OF_ANOTHER_COMPANY',
    });
    expect((await outsider.get(`/api/projects/${w.home.id}`)).status).toBe(404);
    const [company] = await t.database.db.select().from(companyMembers).where(eq(companyMembers.userId, w.outsider.id));
    expect(company!.companyId).toBe(w.companies.otherGc.id);
  });

  it('seats an existing account of the seat company once it signs in as itself', async () => {
    const colleague = await makeUser(t.database.db, t.auth, w.companies.owner.id);
    const { token } = await invite(colleague.email, 'owner');
    const agent = await signedInAgent(t.app, colleague.email);
    expect((await agent.get(`/api/projects/${w.home.id}`)).status).toBe(404);
    expect((await agent.post(`/api/invitations/${token}/accept`).send({})).status).toBe(200);
    expect((await agent.get(`/api/projects/${w.home.id}`)).body.project.myRoles).toEqual(['owner']);
  });

  it('answers 410 after expiry and 404 for an unknown or revoked token', async () => {
    const { token, invitation } = await invite('late@example.test');
    await t.database.db
      .update(invitations)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(invitations.id, invitation.id));
    expect((await anonymous().get(`/api/invitations/${token}`)).status).toBe(410);
    expect(
      (await anonymous().post(`/api/invitations/${token}/accept`).send({ name: 'L', password: 'gravel-and-loam-2026' }))
        .status,
    ).toBe(410);
    expect((await anonymous().get('/api/invitations/not-a-real-token-at-all-000')).status).toBe(404);
    const second = await invite('revoked@example.test');
    const gc = await as('subcontractor_admin');
    const list = await gc.get(`/api/projects/${w.home.id}/invitations`);
    expect(list.body.invitations.find((i: { id: string }) => i.id === invitation.id).state).toBe('expired');
    expect((await gc.delete(`/api/invitations/${second.invitation.id}`)).status).toBe(204);
    expect((await anonymous().get(`/api/invitations/${second.token}`)).status).toBe(404);
  });
});

describe('development mailbox', () => {
  const send = (to: string, subject: string) =>
    smtpMailer(t.mailbox.url, 'Tallyard <no-reply@tallyard.test>').send({ to: [to], subject, text: subject, html: '' });

  it("lists the signed-in person's own caught messages newest first, nobody else's, and 401 without a session", async () => {
    const { token } = await invite('mailbox.one@example.test');
    await send(w.people.owner.email, 'First for the owner');
    await send(w.people.owner.email.toUpperCase(), 'Second for the owner');
    const res = await (await as('owner')).get('/api/dev/mailbox');
    expect(res.status).toBe(200);
    expect(res.body.kind).toBe('development');
    expect(res.body.messages.map((m: { subject: string }) => m.subject)).toEqual([
      'Second for the owner',
      'First for the owner',
    ]);
    expect(JSON.stringify(res.body)).not.toContain('mailbox.one@example.test');
    expect(JSON.stringify(res.body)).not.toContain(token);
    // The invited person, once their account exists, reads their own invitation.
    const invitee = anonymous();
    expect(
      (
        await invitee
          .post(`/api/invitations/${token}/accept`)
          .send({ name: 'Mail Reader', password: 'gravel-and-loam-2026' })
      ).status,
    ).toBe(200);
    const theirs = await invitee.get('/api/dev/mailbox');
    expect(theirs.status).toBe(200);
    expect(theirs.body.messages).toHaveLength(1);
    expect(theirs.body.messages[0].text).toContain(token);
    expect((await anonymous().get('/api/dev/mailbox')).status).toBe(401);
  });
});
