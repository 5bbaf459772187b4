import { and, asc, eq, inArray, lte } from 'drizzle-orm';
import type { Db, Executor } from '../../db/client';
import { emailOutbox } from '../../db/schema';
import type { Mailer } from '../../integrations/mailer/mailer';
import type { Logger } from '../../lib/logger';
import { recordAudit } from '../audit/audit.repository';

export type QueuedMail = { projectId: string | null; template: string; to: string[]; subject: string; text: string; html: string };

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

export type Outbox = {
  /** Sends what is due now; call it after a transaction that queued mail commits. Never throws. */
  flush(): Promise<void>;
};

/**
 * Sends queued mail after commit with retries (back-off 2^n seconds). A failed send never rolls back the state
 * change; after the last attempt the message is marked failed and an audit event records it.
 */
export function createOutbox(db: Db, mailer: Mailer, logger: Logger): Outbox {
  let running: Promise<void> | null = null;
  let again = false;
  const timers = new Set<NodeJS.Timeout>();

  async function sendDue() {
    const due = await db
      .select()
      .from(emailOutbox)
      .where(and(inArray(emailOutbox.status, ['pending']), lte(emailOutbox.nextAttemptAt, new Date())))
      .orderBy(asc(emailOutbox.createdAt))
      .limit(50);
    for (const mail of due) {
      const attempts = mail.attempts + 1;
      try {
        await mailer.send({ to: mail.toAddresses, subject: mail.subject, text: mail.text, html: mail.html });
        await db.update(emailOutbox).set({ status: 'sent', attempts, sentAt: new Date(), lastError: null }).where(eq(emailOutbox.id, mail.id));
      } catch (err) {
        const message = err instanceof Error ? err.message : String(err);
        const failed = attempts >= MAX_EMAIL_ATTEMPTS;
        const delayMs = 2 ** attempts * 1000;
        await db.transaction(async (tx) => {
          await tx
            .update(emailOutbox)
            .set({ status: failed ? 'failed' : 'pending', attempts, lastError: message, nextAttemptAt: new Date(Date.now() + delayMs) })
            .where(eq(emailOutbox.id, mail.id));
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
        });
        logger.warn({ template: mail.template, attempts, failed }, 'e-mail send failed');
        if (!failed) {
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

  return { flush };
}
