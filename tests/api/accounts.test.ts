import { count, eq, sql } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { account, auditEvents, companyMembers, session, user } from '../../server/db/schema';
import { createFirstAdmin } from '../../server/modules/accounts/first-admin.service';
import { makeBidItem, makeUser, makeWorld } from '../setup/factories';
import { FILES, makeTally } from '../setup/pay-cycle-factories';
import { makeCertifiedPayApp } from '../setup/payment-factories';
import { createTestApp, signedInAgent, TEST_ORIGIN, TEST_PASSWORD, type TestApp } from '../setup/test-app';
import { waitForMails } from '../setup/mail';

// OWASP ASVS 4.0.3 V2 (authentication) and V3 (sessions): accounts by invitation only, password reset by an
// e-mailed link with the same answer for every address (2.5.x, and 2.2.x for enumeration), a password change that
// ends the other sessions (3.3.3), the 12-hour absolute limit (3.3.2) on better-auth's own routes, the app's text
// rules on its bodies (5.1.3), and no caching of authenticated answers (8.2.1).

let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
});
afterAll(() => t.close());

const outsider = () => request.agent(t.app).set('Origin', TEST_ORIGIN);
const users = async () => (await t.database.db.select({ n: count() }).from(user))[0]!.n;

const waitForMail = (email: string) =>
  waitForMails(t.mailbox, (m) => m.to.includes(email) && /new .*password/i.test(m.subject));

describe('an outsider with only network access', () => {
  it('cannot create an account through sign-up, and sign-up answers alike for known and unknown addresses', async () => {
    const before = await users();
    const fresh = await outsider()
      .post('/api/auth/sign-up/email')
      .send({ email: 'walk.in@example.test', password: 'gravel-basin-quarry-71', name: 'Walk In' });
    const known = await outsider()
      .post('/api/auth/sign-up/email')
      .send({ email: w.people.owner.email, password: 'gravel-basin-quarry-71', name: 'Walk In' });
    expect(fresh.status).toBe(400);
    expect(fresh.body.code).toBe('EMAIL_PASSWORD_SIGN_UP_DISABLED');
    expect({ status: known.status, body: known.body }).toEqual({ status: fresh.status, body: fresh.body });
    expect(fresh.headers['set-cookie']).toBeUndefined();
    expect(await users()).toBe(before);
  });

  it('cannot register an address before it is invited: the invitation then makes the account for its link holder only', async () => {
    const email = 'early.bird@example.test';
    await outsider()
      .post('/api/auth/sign-up/email')
      .send({ email, password: 'gravel-basin-quarry-71', name: 'Squatter' });
    const [row] = await t.database.db.select().from(user).where(eq(user.email, email));
    expect(row).toBeUndefined();
  });

  it('cannot guess an invitation link: unknown tokens answer 404 and accept nothing', async () => {
    const before = await users();
    for (const token of ['AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA', 'x', '../../api/me']) {
      expect((await outsider().get(`/api/invitations/${encodeURIComponent(token)}`)).status).toBe(404);
      const accept = await outsider()
        .post(`/api/invitations/${encodeURIComponent(token)}/accept`)
        .send({ name: 'X', password: 'gravel-basin-quarry-71' });
      expect(accept.status).toBe(404);
    }
    expect(await users()).toBe(before);
  });

  it('reads no mailbox and no company list without a session', async () => {
    expect((await outsider().get('/api/dev/mailbox')).status).toBe(401);
    expect((await outsider().get('/api/companies')).status).toBe(401);
  });

  it('learns nothing from password reset: the same answer for an address with an account and one without', async () => {
    t.mailbox.clear();
    const known = await outsider()
      .post('/api/auth/request-password-reset')
      .send({ email: w.people.subcontractor.email });
    const unknown = await outsider()
      .post('/api/auth/request-password-reset')
      .send({ email: 'nobody.here@example.test' });
    expect(known.status).toBe(200);
    expect({ status: unknown.status, body: unknown.body }).toEqual({ status: known.status, body: known.body });
    expect(await waitForMail(w.people.subcontractor.email)).toHaveLength(1);
    expect(t.mailbox.messages().filter((m) => m.to.includes('nobody.here@example.test'))).toHaveLength(0);
  });
});

describe('password reset by e-mailed link', () => {
  it('links to our own reset page; the new password works once, ends every session, and the old one stops', async () => {
    const person = await makeUser(t.database.db, t.auth, w.companies.sub.id);
    const before = await signedInAgent(t.app, person.email);
    expect((await before.get('/api/me')).status).toBe(200);
    t.mailbox.clear();
    expect(
      (await outsider().post('/api/auth/request-password-reset').send({ email: person.email.toUpperCase() })).status,
    ).toBe(200);
    const [mail] = await waitForMail(person.email);
    const link = new RegExp(`${TEST_ORIGIN}/reset-password\\?token=([A-Za-z0-9_-]+)`).exec(mail!.text);
    expect(link).not.toBeNull();
    expect(mail!.html).toContain(`href="${link![0]}"`);
    const token = link![1]!;

    const common = await outsider().post('/api/auth/reset-password').send({ token, newPassword: 'password1234' });
    expect(common.status).toBe(400);
    expect(common.body.code).toBe('PASSWORD_NOT_ALLOWED');
    expect(
      (await outsider().post('/api/auth/reset-password').send({ token, newPassword: 'culvert-headwall-2027' })).status,
    ).toBe(200);
    expect(
      (await outsider().post('/api/auth/reset-password').send({ token, newPassword: 'culvert-headwall-2028' })).status,
    ).toBe(400);

    expect((await before.get('/api/me')).status).toBe(401);
    expect(
      (await outsider().post('/api/auth/sign-in/email').send({ email: person.email, password: TEST_PASSWORD })).status,
    ).toBe(401);
    expect(
      (
        await outsider()
          .post('/api/auth/sign-in/email')
          .send({ email: person.email, password: 'culvert-headwall-2027' })
      ).status,
    ).toBe(200);
  });

  it('refuses a made-up token', async () => {
    const res = await outsider()
      .post('/api/auth/reset-password')
      .send({ token: 'made-up-token-000000000', newPassword: 'culvert-headwall-2027' });
    expect(res.status).toBe(400);
  });
});

describe('changing one’s password', () => {
  it('ends the other sessions even when the client does not ask, and keeps this one', async () => {
    const person = await makeUser(t.database.db, t.auth, w.companies.gc.id);
    const laptop = await signedInAgent(t.app, person.email);
    const phone = await signedInAgent(t.app, person.email);
    const res = await laptop
      .post('/api/auth/change-password')
      .send({ currentPassword: TEST_PASSWORD, newPassword: 'spoil-pile-setback-09', revokeOtherSessions: false });
    expect(res.status).toBe(200);
    expect((await phone.get('/api/me')).status).toBe(401);
    expect((await laptop.get('/api/me')).status).toBe(200);
    const rows = await t.database.db.select().from(session).where(eq(session.userId, person.id));
    expect(rows).toHaveLength(1);
  });

  it('refuses a wrong current password', async () => {
    const person = await makeUser(t.database.db, t.auth, w.companies.gc.id);
    const agent = await signedInAgent(t.app, person.email);
    const res = await agent
      .post('/api/auth/change-password')
      .send({ currentPassword: 'not-my-password-1', newPassword: 'spoil-pile-setback-09' });
    expect(res.status).toBe(400);
  });
});

describe("better-auth's routes follow the app's text rules", () => {
  it('refuses a too-long, NUL or lone-surrogate name with 400 naming the field, and saves nothing', async () => {
    const person = await makeUser(t.database.db, t.auth, w.companies.owner.id);
    const agent = await signedInAgent(t.app, person.email);
    const nameOf = async () =>
      (await t.database.db.select({ name: user.name }).from(user).where(eq(user.id, person.id)))[0]!.name;
    const before = await nameOf();
    for (const name of ['x'.repeat(121), 'Rosa\u0000Delgado', 'Rosa \ud800 Delgado']) {
      const res = await agent.post('/api/auth/update-user').send({ name });
      expect(res.status).toBe(400);
      expect(res.body.code).toBe('VALIDATION_FAILED');
      expect(res.body.details.map((d: { path: string }) => d.path)).toContain('name');
      expect(res.body.message).toContain('name');
    }
    // 900 kB: refused by the body limit before better-auth reads it.
    const huge = await agent.post('/api/auth/update-user').send({ name: 'n'.repeat(900_000) });
    expect(huge.status).toBe(413);
    expect(await nameOf()).toBe(before);
    expect((await agent.post('/api/auth/update-user').send({ name: 'Rosa Delgado-Ames' })).status).toBe(200);
    expect(await nameOf()).toBe('Rosa Delgado-Ames');
  });

  it('refuses a NUL in the sign-in address with 400 (it was a 500)', async () => {
    const res = await outsider()
      .post('/api/auth/sign-in/email')
      .send({ email: 'a\u0000@example.test', password: 'whatever-password' });
    expect(res.status).toBe(400);
    expect(res.body.details[0].path).toBe('email');
  });
});

describe('the 12-hour absolute session limit on better-auth’s own routes (ASVS 4.0.3 3.3.2)', () => {
  it('ends the session for get-session and update-user too', async () => {
    const person = await makeUser(t.database.db, t.auth, w.companies.owner.id);
    const agent = await signedInAgent(t.app, person.email);
    expect((await agent.get('/api/auth/get-session')).body?.user?.id).toBe(person.id);
    await t.database.db
      .update(session)
      .set({ createdAt: new Date(Date.now() - 13 * 3600_000) })
      .where(eq(session.userId, person.id));
    const got = await agent.get('/api/auth/get-session');
    expect(got.body?.user).toBeUndefined();
    expect((await agent.post('/api/auth/update-user').send({ name: 'Still here?' })).status).toBe(401);
    expect(await t.database.db.select().from(session).where(eq(session.userId, person.id))).toHaveLength(0);
  });
});

describe('Cache-Control: no-store on authenticated answers (ASVS 4.0.3 8.2.1)', () => {
  it('on JSON, the session, exports, evidence downloads and the Mailbox', async () => {
    const db = t.database.db;
    const sub = await signedInAgent(t.app, w.people.subcontractor.email);
    const gc = await signedInAgent(t.app, w.people.general_contractor.email);
    const item = await makeBidItem(db, w.home.id);
    const tally = await makeTally(db, {
      projectId: w.home.id,
      bidItemId: item.id,
      authorUserId: w.people.subcontractor.id,
      measuredOn: '2026-10-05',
      quantity: 1,
      status: 'draft',
    });
    const uploaded = await sub.post(`/api/tallies/${tally.id}/evidence`).attach('files', FILES.csv, 'sections.csv');
    expect(uploaded.status).toBe(201);
    const app = await makeCertifiedPayApp(db, w.home.id, w.people.subcontractor.id);
    const urls = [
      '/api/me',
      '/api/auth/get-session',
      '/api/projects',
      `/api/pay-apps/${app.id}/export.csv`,
      `/api/pay-apps/${app.id}/export.pdf`,
      uploaded.body.evidence[0].downloadUrl,
      '/api/dev/mailbox',
    ];
    for (const url of urls) {
      const res = await gc.get(url);
      expect(res.status, url).toBe(200);
      expect(res.headers['cache-control'], url).toBe('no-store');
    }
  });
});

describe('npm run admin:create (the first person of a new installation)', () => {
  it('makes a company and its administrator in one transaction with an audit event; they can sign in', async () => {
    const made = await createFirstAdmin(t.database.db, t.auth, {
      name: 'Marta Quarry',
      email: 'Marta@Quarry.example',
      companyName: 'Quarry Hill Contracting',
      companyKind: 'general_contractor',
      password: 'haul-road-grade-2026',
    });
    const [member] = await t.database.db.select().from(companyMembers).where(eq(companyMembers.userId, made.userId));
    expect(member!.isAdmin).toBe(true);
    const [event] = await t.database.db.select().from(auditEvents).where(eq(auditEvents.objectId, made.userId));
    expect(event!.action).toBe('account.admin_created');
    const agent = await signedInAgent(t.app, 'marta@quarry.example', 'haul-road-grade-2026');
    const me = await agent.get('/api/me');
    expect(me.body.isAdmin).toBe(true);
    expect(me.body.company.kind).toBe('general_contractor');
  });

  it('refuses a common password, a bad kind and an address already taken, naming each, and creates nothing', async () => {
    const before = await users();
    await expect(
      createFirstAdmin(t.database.db, t.auth, {
        name: 'A',
        email: 'a@quarry.example',
        companyName: 'Q',
        companyKind: 'owner',
        password: 'password1234',
      }),
    ).rejects.toMatchObject({ code: 'VALIDATION_FAILED', details: [{ path: 'password' }] });
    await expect(
      createFirstAdmin(t.database.db, t.auth, {
        name: 'A',
        email: 'a@quarry.example',
        companyName: 'Q',
        companyKind: 'bank' as never,
        password: 'haul-road-grade-2026',
      }),
    ).rejects.toMatchObject({ details: [{ path: 'companyKind' }] });
    await expect(
      createFirstAdmin(t.database.db, t.auth, {
        name: 'A',
        email: w.people.owner.email,
        companyName: 'Q',
        companyKind: 'owner',
        password: 'haul-road-grade-2026',
      }),
    ).rejects.toMatchObject({ code: 'ACCOUNT_EXISTS' });
    expect(await users()).toBe(before);
    const orphans = await t.database.db
      .select({ n: count() })
      .from(account)
      .where(sql`${account.userId} not in (select id from "user")`);
    expect(orphans[0]!.n).toBe(0);
  });
});
