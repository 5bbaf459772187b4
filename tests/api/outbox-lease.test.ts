import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Database } from '../../server/db/client';
import { emailOutbox } from '../../server/db/schema';
import type { Mailer, OutgoingMail } from '../../server/integrations/mailer/mailer';
import { createLogger } from '../../server/lib/logger';
import { createOutbox, enqueueEmail } from '../../server/modules/notifications/outbox';
import { createTestDatabase } from '../setup/test-db';

// Several app servers share one outbox table (issue 16): each message is claimed by one server with
// SELECT ... FOR UPDATE SKIP LOCKED (PostgreSQL documentation, "The Locking Clause") and a lease, so two servers
// flushing at once never send the same message, and a server that dies mid-send leaves its messages to another
// once the lease runs out. Runs on PGlite and, in the PostgreSQL pass, on a real server with a connection pool.

let database: Database;
beforeAll(async () => {
  database = await createTestDatabase();
});
afterAll(() => database?.close());

const logger = createLogger('silent');

function countingMailer(delayMs = 2): Mailer & { sent: OutgoingMail[] } {
  const sent: OutgoingMail[] = [];
  return {
    sent,
    async send(mail) {
      await new Promise((r) => setTimeout(r, delayMs));
      sent.push(mail);
    },
  };
}

async function queue(n: number, tag: string) {
  for (let i = 0; i < n; i++) {
    await enqueueEmail(database.db, {
      projectId: null,
      template: 'test',
      to: [`${tag}-${i}@example.test`],
      subject: `${tag} ${i}`,
      text: 't',
      html: '<p>t</p>',
    });
  }
}

describe('the shared outbox', () => {
  it('sends each message exactly once when two servers flush at the same time', async () => {
    await queue(45, 'both');
    const a = countingMailer();
    const b = countingMailer();
    const serverA = createOutbox(database.db, a, logger);
    const serverB = createOutbox(database.db, b, logger);
    await Promise.all([serverA.flush(), serverB.flush(), serverA.flush(), serverB.flush()]);
    const subjects = [...a.sent, ...b.sent].map((m) => m.subject).filter((s) => s.startsWith('both '));
    expect(subjects).toHaveLength(45);
    expect(new Set(subjects).size).toBe(45);
    const pending = await database.db.select().from(emailOutbox).where(eq(emailOutbox.status, 'pending'));
    expect(pending).toHaveLength(0);
  });

  it("leaves a message another server is sending alone, and takes it over once that server's lease runs out", async () => {
    await queue(3, 'stuck');
    // Server A claims the messages and never finishes (it died mid-send).
    const hung: Mailer = { send: () => new Promise(() => undefined) };
    void createOutbox(database.db, hung, logger).flush();
    await expect
      .poll(
        async () =>
          (
            await database.db
              .select()
              .from(emailOutbox)
              .where(sql`leased_until is not null`)
          ).length,
      )
      .toBe(3);
    const b = countingMailer();
    const serverB = createOutbox(database.db, b, logger);
    await serverB.flush();
    expect(b.sent).toHaveLength(0);
    // The lease runs out (here by moving it into the past rather than waiting two minutes).
    await database.db
      .update(emailOutbox)
      .set({ leasedUntil: new Date(Date.now() - 1000) })
      .where(eq(emailOutbox.status, 'pending'));
    await serverB.flush();
    expect(b.sent.map((m) => m.subject).sort()).toEqual(['stuck 0', 'stuck 1', 'stuck 2']);
  });

  it('keeps the outcome of the server that took a message over when the first one finishes after its lease', async () => {
    await queue(1, 'late');
    // Server A claims the message and its send outlasts the lease (a mail server that stops answering), then fails.
    let release!: () => void;
    const released = new Promise<void>((r) => (release = r));
    const slow: Mailer = { send: () => released.then(() => Promise.reject(new Error('timed out'))) };
    const serverA = createOutbox(database.db, slow, logger, { leaseSeconds: 60 });
    const aDone = serverA.flush();
    const late = () =>
      database.db
        .select()
        .from(emailOutbox)
        .where(eq(emailOutbox.subject, 'late 0'))
        .then((rows) => rows[0]!);
    await expect.poll(async () => (await late()).leasedUntil).not.toBeNull();
    await database.db
      .update(emailOutbox)
      .set({ leasedUntil: new Date(Date.now() - 1000) })
      .where(eq(emailOutbox.subject, 'late 0'));
    const b = countingMailer();
    await createOutbox(database.db, b, logger).flush();
    expect(b.sent.map((m) => m.subject)).toEqual(['late 0']);
    release();
    await aDone;
    // A's late failure neither marks the sent message pending again (it would go out a third time) nor counts it.
    expect(await late()).toMatchObject({ status: 'sent', attempts: 1, lastError: null, leasedUntil: null });
  });

  it('polls: mail queued without a nudge (by another server) goes out on the next look', async () => {
    const c = countingMailer();
    const serverC = createOutbox(database.db, c, logger);
    const stop = serverC.poll(50);
    try {
      await queue(2, 'polled');
      await expect.poll(() => c.sent.length, { timeout: 10_000 }).toBe(2);
    } finally {
      stop();
    }
  });
});
