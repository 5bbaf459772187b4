import type { RequestHandler, Response } from 'express';
import type { AppContext } from '../../app-context';
import type { Auth } from '../../auth';
import type { SerializedBody } from '../../lib/read-cache';
import {
  actorOfRow,
  isPastAbsoluteLifetime,
  sessionCookieOf,
  sessionRowIsCurrent,
  sessionSettings,
  type VerifiedCookies,
} from '../../middleware/require-actor';
import { isUuid } from '../projects/project-access';
import { rolesIfVisible } from './pay-app-access';
import { payAppAnswer } from './pay-apps.service';
import { findSessionAndReadAccess } from './pay-apps.repository';

/** Sends a pay application's answer; Express answers 304 to a matching If-None-Match. Browsers revalidate each time. */
export function sendPayAppAnswer(res: Response, answer: SerializedBody): void {
  res.set('Cache-Control', 'private, no-cache').set('ETag', answer.etag).type('json').send(answer.bytes);
}

/**
 * GET /api/pay-apps/:payAppId in one statement: the session row (as requireActor reads it) and the reader's access
 * to the application with its read versions, then the cached answer. Mounted just before requireActor, it takes
 * only the case requireActor's own short path would (a cookie whose signature better-auth already checked, a
 * current session within its absolute lifetime, an application that exists); anything else goes on to
 * requireActor and the route, which ask better-auth, refresh, end aged sessions and answer 401 as always. The
 * rules are requireActor's own functions and the route's (rolesIfVisible), not copies.
 */
export function payAppFastRead(ctx: AppContext, auth: Auth, verified: VerifiedCookies): RequestHandler {
  const settings = sessionSettings(auth);
  return async (req, res, next) => {
    const payAppId = String(req.params.payAppId);
    const cookie = sessionCookieOf(req, await settings);
    const token = cookie ? verified.get(cookie) : undefined;
    if (!token || !isUuid(payAppId)) return next();
    const row = await findSessionAndReadAccess(ctx.db, token, payAppId);
    if (!row || !row.status || !row.project) return next();
    if (!sessionRowIsCurrent(row.session, await settings) || isPastAbsoluteLifetime(row.session)) return next();
    const { actor, session } = actorOfRow(row);
    res.locals.actor = actor;
    res.locals.session = session;
    const roles = rolesIfVisible(actor, row.project, row.roles, row.status);
    sendPayAppAnswer(res, await payAppAnswer(ctx, actor, payAppId, roles, row.readVersion));
  };
}
