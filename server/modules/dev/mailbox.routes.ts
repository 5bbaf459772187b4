import { Router } from 'express';
import type { AppContext } from '../../app-context';
import { getActor } from '../../lib/actor';
import { notFound } from '../../lib/app-error';

/** Where the Mailbox runs: `npm run dev`, or the demo `npm start` runs on the embedded database. */
export type MailboxKind = 'development' | 'demo';

/**
 * The messages the local SMTP sink caught, newest first, addressed to the signed-in person only (nobody reads
 * another person's invitation or reset link). Present only in development and the embedded demo; 404 elsewhere.
 */
export function devMailboxRouter(ctx: AppContext): Router {
  const router = Router();
  router.get('/dev/mailbox', (_req, res) => {
    const actor = getActor(res);
    if (!ctx.mailbox) throw notFound('The development mailbox');
    const me = actor.email.toLowerCase();
    const mine = ctx.mailbox.messages().filter((m) => m.to.some((to) => to.toLowerCase() === me));
    res.json({ kind: ctx.mailboxKind ?? 'development', messages: mine.reverse() });
  });
  return router;
}
