import { and, eq, sql } from 'drizzle-orm';
import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { createAuth } from '../../server/auth';
import { openDatabase, type Database } from '../../server/db/client';
import { companyMembers, payAppLines, projectMembers, session, user } from '../../server/db/schema';
import { smtpMailer } from '../../server/integrations/mailer/mailer';
import { createLogger } from '../../server/lib/logger';
import { makeBidItem, makeWorld } from '../setup/factories';
import { fastPasswordHasher } from '../setup/fast-password';
import { FILES, makeTally } from '../setup/pay-cycle-factories';
import { makeCertifiedPayApp } from '../setup/payment-factories';
import { confirm, startPayment } from '../setup/payment-flow';
import { quantityChange } from '../setup/change-order-factories';
import { createTestApp, signedInAgent, TEST_ORIGIN, type TestApp } from '../setup/test-app';

// The pay application's answer is cached per app server, viewer and read version (server/lib/read-cache.ts). Each
// write path below goes through server A and is read through server B, which has its own cache (two app servers on
// one database; on the PostgreSQL pass each has its own connection pool). To tell a served cached answer from a fresh
// one, a line's description is changed behind the triggers' back (session_replication_role = replica, so
// read_version does not move): B keeps answering the cached text until a real write moves the version, and then
// shows the marker. RFC 9110 section 8.8.3: a changed answer carries a new entity tag.
let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
let b: Express;
let bDatabase: Database;
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
  const pool = (t.database.db as unknown as { $client: { options?: { connectionString?: string } } }).$client;
  const url = t.database.kind === 'postgres' ? pool.options?.connectionString : undefined;
  if (t.database.kind === 'postgres' && !url) throw new Error('the PostgreSQL pool did not tell its URL');
  bDatabase = url ? await openDatabase({ kind: 'postgres', url }) : t.database;
  const logger = createLogger('silent');
  b = createApp({
    database: bDatabase,
    auth: createAuth({
      logger,
      db: bDatabase.db,
      secret: 'test-secret-test-secret-test-secret-0123',
      baseURL: TEST_ORIGIN,
      trustedOrigins: [TEST_ORIGIN],
      secureCookies: false,
      passwordHasher: fastPasswordHasher,
    }),
    logger,
    mailer: smtpMailer(t.mailbox.url, 'Tallyard <no-reply@tallyard.test>'),
    storage: t.storage,
    appUrl: TEST_ORIGIN,
  });
});
afterAll(async () => {
  if (bDatabase !== t.database) await bDatabase.close();
  await t.close();
});

type Who = keyof typeof w.people;
const on = (app: Express, who: Who) => signedInAgent(app, w.people[who].email);
type Agent = Awaited<ReturnType<typeof on>>;
type Body = {
  payApp: { lines: { id: string; description: string; reviewStatus: string }[] } & Record<string, unknown>;
};

let markers = 0;
/** Changes a line's description without moving read_version (as no code path of the app can). */
async function markBehindTheTriggers(lineId: string): Promise<string> {
  const text = `Marker ${++markers}`;
  await t.database.db.transaction(async (tx) => {
    await tx.execute(sql`set local session_replication_role = replica`);
    await tx.update(payAppLines).set({ description: text }).where(eq(payAppLines.id, lineId));
  });
  return text;
}

/** The next GET through `reader` shows what changed before `write`: the write moved the read version. */
async function expectWriteInvalidates(reader: Agent, payAppId: string, write: () => Promise<unknown>) {
  const before = await reader.get(`/api/pay-apps/${payAppId}`);
  expect(before.status).toBe(200);
  const line = (before.body as Body).payApp.lines[0]!;
  const marker = await markBehindTheTriggers(line.id);
  const cached = await reader.get(`/api/pay-apps/${payAppId}`);
  expect((cached.body as Body).payApp.lines[0]!.description).toBe(line.description);
  expect(cached.headers.etag).toBe(before.headers.etag);
  await write();
  const after = await reader.get(`/api/pay-apps/${payAppId}`);
  expect(after.status).toBe(200);
  expect((after.body as Body).payApp.lines[0]!.description).toBe(marker);
  expect(after.headers.etag).not.toBe(before.headers.etag);
  return after.body as Body;
}

describe('the pay application answer cache: every write path invalidates it, on every app server', () => {
  let payAppId: string;
  let tallyId: string;
  let itemId: string;

  beforeAll(async () => {
    const item = await makeBidItem(t.database.db, w.home.id, { contractQuantity: 1000 });
    itemId = item.id;
    const tally = await makeTally(t.database.db, {
      projectId: w.home.id,
      bidItemId: item.id,
      authorUserId: w.people.subcontractor.id,
      measuredOn: '2026-10-05',
      quantity: 40,
    });
    tallyId = tally.id;
    const made = await (
      await on(t.app, 'subcontractor')
    )
      .post(`/api/projects/${w.home.id}/pay-apps`)
      .send({ periodStart: '2026-10-01', periodEnd: '2026-10-31', isFinal: false });
    expect(made.status).toBe(201);
    payAppId = made.body.payApp.id;
  });

  it('adding evidence through A clears the no-evidence flag read through B', async () => {
    const reader = await on(b, 'subcontractor');
    const flagsBefore = (await reader.get(`/api/pay-apps/${payAppId}`)).body.payApp.flags.map(
      (f: { kind: string }) => f.kind,
    );
    expect(flagsBefore).toContain('no_evidence');
    const sub = await on(t.app, 'subcontractor');
    const after = await expectWriteInvalidates(reader, payAppId, async () =>
      expect((await sub.post(`/api/tallies/${tallyId}/evidence`).attach('files', FILES.pdf, 'ticket.pdf')).status).toBe(
        201,
      ),
    );
    expect((after.payApp.flags as { kind: string }[]).map((f) => f.kind)).not.toContain('no_evidence');
  });

  it('submitting and approving a line through A show through B', async () => {
    const reader = await on(b, 'general_contractor');
    const sub = await on(t.app, 'subcontractor');
    const submitted = await expectWriteInvalidates(reader, payAppId, async () =>
      expect((await sub.post(`/api/pay-apps/${payAppId}/submit`).send({})).status).toBe(200),
    );
    expect(submitted.payApp.status).toBe('submitted');
    const gc = await on(t.app, 'general_contractor');
    const lineId = submitted.payApp.lines[0]!.id;
    const reviewed = await expectWriteInvalidates(reader, payAppId, async () => {
      const res = await gc
        .post(`/api/pay-apps/${payAppId}/review`)
        .send({ expectedRevision: 0, lines: [{ lineId, decision: 'approve' }] });
      expect(res.status).toBe(200);
    });
    expect(reviewed.payApp.lines[0]!.reviewStatus).toBe('approved');
  });

  it('approving a change order through A moves the version read through B', async () => {
    const reader = await on(b, 'subcontractor');
    const sub = await on(t.app, 'subcontractor');
    const co = (await sub.post(`/api/projects/${w.home.id}/change-orders`).send(quantityChange(itemId, 25))).body
      .changeOrder;
    const gc = await on(t.app, 'general_contractor');
    await expectWriteInvalidates(reader, payAppId, async () =>
      expect((await gc.post(`/api/change-orders/${co.id}/approve`).send({})).status).toBe(200),
    );
  });

  it('a payment recorded through A (the webhook) shows through B', async () => {
    const app = await makeCertifiedPayApp(t.database.db, w.home.id, w.people.subcontractor.id, { number: 7 });
    const reader = await on(b, 'owner');
    const owner = await on(t.app, 'owner');
    const paid = await expectWriteInvalidates(reader, app.id, async () => {
      const { sessionId } = await startPayment(owner, app.id);
      expect((await confirm(t.standin, sessionId, { card: '4242 4242 4242 4242' })).outcome).toBe('succeeded');
    });
    expect(paid.payApp).toMatchObject({ status: 'paid' });
    expect(paid.payApp.paidCents).toBeGreaterThan(0);
  });

  it('a write on another project keeps the cached answer; renaming a person (shown by name) does not', async () => {
    const reader = await on(b, 'subcontractor');
    const before = await reader.get(`/api/pay-apps/${payAppId}`);
    const line = (before.body as Body).payApp.lines[0]!;
    const marker = await markBehindTheTriggers(line.id);
    await makeBidItem(t.database.db, w.foreign.id);
    const kept = await reader.get(`/api/pay-apps/${payAppId}`);
    expect((kept.body as Body).payApp.lines[0]!.description).toBe(line.description);
    expect(kept.headers.etag).toBe(before.headers.etag);
    await t.database.db
      .update(user)
      .set({ name: 'Renamed reviewer' })
      .where(eq(user.id, w.people.general_contractor.id));
    const after = await reader.get(`/api/pay-apps/${payAppId}`);
    expect((after.body as Body).payApp.lines[0]!.description).toBe(marker);
  });

  it('never serves one viewer the answer cached for another: `can` is each reader’s own, 404 to the owner and outsider', async () => {
    const subAnswer = (await (await on(b, 'subcontractor')).get(`/api/pay-apps/${payAppId}`)).body.payApp;
    const gcAnswer = (await (await on(b, 'general_contractor')).get(`/api/pay-apps/${payAppId}`)).body.payApp;
    expect(subAnswer.can).not.toEqual(gcAnswer.can);
    expect(gcAnswer.can).toMatchObject({ certify: true });
    expect(subAnswer.can).toMatchObject({ certify: false });
    // Not certified yet: the owner sees nothing, however warm the cache is.
    expect((await (await on(b, 'owner')).get(`/api/pay-apps/${payAppId}`)).status).toBe(404);
    expect((await (await signedInAgent(b, w.outsider.email)).get(`/api/pay-apps/${payAppId}`)).status).toBe(404);
  });

  it('the one-statement read steps aside for a signed-out, aged or moved person: 401, 401 SESSION_EXPIRED, 404', async () => {
    const reader = await on(b, 'owner_admin');
    const owner = await on(b, 'owner');
    // The owner's admin sees nothing before certification; the subcontractor's admin does.
    expect((await reader.get(`/api/pay-apps/${payAppId}`)).status).toBe(404);
    const subAdmin = await on(b, 'subcontractor_admin');
    const warm = await subAdmin.get(`/api/pay-apps/${payAppId}`);
    expect(warm.status).toBe(200);
    expect((await subAdmin.post('/api/auth/sign-out').send({})).status).toBe(200);
    expect((await subAdmin.get(`/api/pay-apps/${payAppId}`)).status).toBe(401);
    // A session past its absolute lifetime (12 hours from sign-in) ends, cached answer or not.
    const aged = await on(b, 'subcontractor_admin');
    expect((await aged.get(`/api/pay-apps/${payAppId}`)).status).toBe(200);
    await t.database.db
      .update(session)
      .set({ createdAt: new Date(Date.now() - 13 * 3600 * 1000) })
      .where(eq(session.userId, w.people.subcontractor_admin.id));
    const ended = await aged.get(`/api/pay-apps/${payAppId}`);
    expect(ended.status).toBe(401);
    expect(ended.body.error.code).toBe('SESSION_EXPIRED');
    // Moved to another company: no longer the subcontractor's admin, so no seat here.
    const moved = await on(b, 'subcontractor_admin');
    expect((await moved.get(`/api/pay-apps/${payAppId}`)).status).toBe(200);
    await t.database.db
      .update(companyMembers)
      .set({ companyId: w.companies.otherSub.id })
      .where(eq(companyMembers.userId, w.people.subcontractor_admin.id));
    expect((await moved.get(`/api/pay-apps/${payAppId}`)).status).toBe(404);
    expect((await owner.get(`/api/pay-apps/${payAppId}`)).status).toBe(404);
  });

  it('a seat removed through A takes effect through B at once, though B cached the answer', async () => {
    const reader = await on(b, 'general_contractor');
    const warm = await reader.get(`/api/pay-apps/${payAppId}`);
    expect(warm.status).toBe(200);
    const tag = warm.headers.etag as string;
    expect((await reader.get(`/api/pay-apps/${payAppId}`).set('If-None-Match', tag)).status).toBe(304);
    const admin = await on(t.app, 'admin');
    expect((await admin.delete(`/api/projects/${w.home.id}/members/${w.people.general_contractor.id}`)).status).toBe(
      204,
    );
    // Removing the last seat also ends the person's sessions (seats.test.ts): no answer, cached or not.
    expect((await reader.get(`/api/pay-apps/${payAppId}`)).status).toBe(401);
    expect((await reader.get(`/api/pay-apps/${payAppId}`).set('If-None-Match', tag)).status).toBe(401);
  });

  it('a seat gone while the session stays (any path that deletes the row) answers 404, never the cached body', async () => {
    const reader = await on(b, 'subcontractor');
    const warm = await reader.get(`/api/pay-apps/${payAppId}`);
    expect(warm.status).toBe(200);
    await t.database.db
      .delete(projectMembers)
      .where(and(eq(projectMembers.projectId, w.home.id), eq(projectMembers.userId, w.people.subcontractor.id)));
    expect((await reader.get(`/api/pay-apps/${payAppId}`)).status).toBe(404);
    expect(
      (await reader.get(`/api/pay-apps/${payAppId}`).set('If-None-Match', warm.headers.etag as string)).status,
    ).toBe(404);
  });
});
