import { vi } from 'vitest';
import type { CaughtMail, SmtpSink } from '../../server/integrations/mailer/smtp-sink';

/**
 * How long a test waits for the outbox to deliver to the local sink. Not a speed check (those are benchmarks): it is
 * only the point at which a missing mail counts as never sent. A loaded CI machine has taken over 2.5 s for one
 * message (SMTP round trip plus the sink loading mailparser on its first message).
 */
const MAIL_WAIT = { timeout: 20_000, interval: 50 };

/** Every caught message matching `match`, once at least `atLeast` of them have arrived. */
export function waitForMails(mailbox: SmtpSink, match: (m: CaughtMail) => boolean, atLeast = 1): Promise<CaughtMail[]> {
  return vi.waitFor(() => {
    const found = mailbox.messages().filter(match);
    if (found.length < atLeast) throw new Error(`${found.length} matching mail(s) so far, waiting for ${atLeast}`);
    return found;
  }, MAIL_WAIT);
}

/** The first caught message matching `match`, waiting for the outbox to send it. */
export async function waitForMail(mailbox: SmtpSink, match: (m: CaughtMail) => boolean): Promise<CaughtMail> {
  return (await waitForMails(mailbox, match))[0]!;
}
