import { and, asc, eq, inArray, isNull, lt, lte, or } from 'drizzle-orm';
import type { Db, Executor } from '../../db/client';
import { emailOutbox } from '../../db/schema';
import type { Mailer } from '../../integrations/mailer/mailer';
import type { Logger } from '../../lib/logger';
import { recordAudit } from '../audit/audit.repository';

export type QueuedMail = {
  projectId: string | null;
  template: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
};

/** Queues mail inside the transaction of the change it announces; nothing is sent until the outbox flushes. */
export async function enqueueEmail(tx: Executor, mail: QueuedMail): Promise<void> {
  if (mail.to.length === 0) return;
  await tx.insert(emailOutbox).values({
    projectId: mail.projectId,
    template: mail.template,
    toAddresses: mail.to,
    subject: mail.subject,
    text: mail.text,
    html: mail.html,
  });
}

export const MAX_EMAIL_ATTEMPTS = 5;
/**
 * How long a claimed message stays with the server that claimed it before another may take it over (OUTBOX_LEASE_SECONDS
 * overrides it). Longer than a send can take: the mailer gives up on a silent SMTP server well within it.
 */
export const OUTBOX_LEASE_SECONDS = 120;
const BATCH = 20;

export type Outbox = {
  /** Sends what is due now; call it after a transaction that queued mail commits. Never throws. */
  flush(): Promise<void>;
  /** Looks for due mail every `ms` (mail another server queued, retries, a dead server's leases); returns stop. */
  poll(ms: number): () => void;
};

/**
 * Claims up to BATCH due messages for this server: `FOR UPDATE SKIP LOCKED`, so two servers flushing at once take
 * different rows, and a lease, so a message being sent is not taken again until the lease runs out.
 */
async function claimDue(db: Db, leaseSeconds: number) {
  return db.transaction(async (tx) => {
    const now = new Date();
    const due = await tx
      .select({ id: emailOutbox.id })
      .from(emailOutbox)
      .where(
        and(
          eq(emailOutbox.status, 'pending'),
          lte(emailOutbox.nextAttemptAt, now),
          or(isNull(emailOutbox.leasedUntil), lt(emailOutbox.leasedUntil, now)),
        ),
      )
      .orderBy(asc(emailOutbox.createdAt))
      .limit(BATCH)
      .for('update', { skipLocked: true });
    if (due.length === 0) return [];
    const claimed = await tx
      .update(emailOutbox)
      .set({ leasedUntil: new Date(now.getTime() + leaseSeconds * 1000) })
      .where(
        inArray(
          emailOutbox.id,
          due.map((d) => d.id),
        ),
      )
      .returning();
    return claimed.sort((a, b) => a.createdAt.getTime() - b.createdAt.getTime());
  });
}

/**
 * Sends queued mail after commit with retries (back-off 2^n seconds). A failed send never rolls back the state
 * change; after the last attempt the message is marked failed and an audit event records it. Several servers may
 * share one outbox: each message is claimed by one of them (claimDue). A server that dies after sending but before
 * marking the message sent leaves it to be sent again once its lease runs out: at least once, never lost.
 */
export function createOutbox(
  db: Db,
  mailer: Mailer,
  logger: Logger,
  { leaseSeconds = OUTBOX_LEASE_SECONDS }: { leaseSeconds?: number } = {},
): Outbox {
  let running: Promise<void> | null = null;
  let again = false;
  const timers = new Set<NodeJS.Timeout>();

  async function sendDue() {
    const due = await claimDue(db, leaseSeconds);
    if (due.length === BATCH) again = true;
    for (const mail of due) {
      const attempts = mail.attempts + 1;
      // The lease is this server's claim: once it ran out another server may have taken the message over, and what
      // this one learns afterwards (sent, failed) no longer overwrites that server's outcome.
      const stillMine = and(eq(emailOutbox.id, mail.id), eq(emailOutbox.leasedUntil, mail.leasedUntil!));
      try {
        await mailer.send({ to: mail.toAddresses, subject: mail.subject, text: mail.text, html: mail.html });
        await db
          .update(emailOutbox)
          .set({ status: 'sent', attempts, sentAt: new Date(), lastError: null, leasedUntil: null })
          .where(stillMine);
      } catch (err) {
        const message = err instanceof Error ? err.message : String(err);
        const failed = attempts >= MAX_EMAIL_ATTEMPTS;
        const delayMs = 2 ** attempts * 1000;
        const recorded = await db.transaction(async (tx) => {
          const rows = await tx
            .update(emailOutbox)
            .set({
              status: failed ? 'failed' : 'pending',
              attempts,
              lastError: message,
              nextAttemptAt: new Date(Date.now() + delayMs),
              leasedUntil: null,
            })
            .where(stillMine)
            .returning({ id: emailOutbox.id });
          if (rows.length === 0) return false;
          if (failed) {
            await recordAudit(tx, {
              projectId: mail.projectId,
              actorUserId: null,
              objectType: 'email',
              objectId: mail.id,
              action: 'email.failed',
              after: { template: mail.template, to: mail.toAddresses, attempts, error: message },
            });
          }
          return true;
        });
        logger.warn({ template: mail.template, attempts, failed, recorded }, 'e-mail send failed');
        if (recorded && !failed) {
          const timer = setTimeout(() => {
            timers.delete(timer);
            void flush();
          }, delayMs);
          timer.unref();
          timers.add(timer);
        }
      }
    }
  }

  function flush(): Promise<void> {
    if (running) {
      again = true;
      return running;
    }
    running = (async () => {
      do {
        again = false;
        await sendDue().catch((err: unknown) => logger.error({ err }, 'outbox flush failed'));
      } while (again);
      running = null;
    })();
    return running;
  }

  function poll(ms: number): () => void {
    const timer = setInterval(() => void flush(), ms);
    timer.unref();
    return () => clearInterval(timer);
  }

  return { flush, poll };
}
