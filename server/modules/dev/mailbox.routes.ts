import { Router } from 'express';
import type { AppContext } from '../../app-context';
import { getActor } from '../../lib/actor';
import { notFound } from '../../lib/app-error';

/** Development only: the messages the local SMTP sink caught, newest first. Absent when SMTP_URL is set. */
export function devMailboxRouter(ctx: AppContext): Router {
  const router = Router();
  router.get('/dev/mailbox', (_req, res) => {
    getActor(res);
    if (!ctx.mailbox) throw notFound('The development mailbox');
    res.json({ messages: ctx.mailbox.messages().reverse() });
  });
  return router;
}
