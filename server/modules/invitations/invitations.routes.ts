import express, { Router } from 'express';
import { acceptInvitationSchema, createInvitationSchema } from '../../../src/shared/schemas/invitation';
import type { AppContext } from '../../app-context';
import type { Auth } from '../../auth';
import { getActor } from '../../lib/actor';
import { refuseUnstorableText } from '../../middleware/storable-text';
import { acceptInvitation, previewInvitation } from './invitation-accept.service';
import * as service from './invitations.service';

/** For the People screen: people who manage the job send, list and revoke invitations. */
export function invitationsRouter(ctx: AppContext): Router {
  const router = Router();
  router.get('/projects/:projectId/invitations', async (req, res) => {
    res.json({ invitations: await service.listInvitations(ctx.db, getActor(res), req.params.projectId) });
  });
  router.post('/projects/:projectId/invitations', async (req, res) => {
    const input = createInvitationSchema.parse(req.body);
    res.status(201).json({ invitation: await service.createInvitation(ctx, getActor(res), req.params.projectId, input) });
  });
  router.delete('/invitations/:id', async (req, res) => {
    await service.revokeInvitation(ctx.db, getActor(res), req.params.id);
    res.status(204).end();
  });
  return router;
}

/**
 * Public: the invitation link works without a session (the token is the credential). Mounted before the session
 * middleware; the accept route parses its own JSON (the app's parser comes later, after better-auth).
 */
export function publicInvitationsRouter(ctx: AppContext, auth: Auth): Router {
  const router = Router();
  router.get('/invitations/:token', async (req, res) => {
    res.json({ invitation: await previewInvitation(ctx.db, req.params.token) });
  });
  router.post('/invitations/:token/accept', express.json({ limit: '16kb' }), refuseUnstorableText, async (req, res) => {
    const input = acceptInvitationSchema.parse(req.body ?? {});
    const { projectId, setCookie } = await acceptInvitation(ctx.db, auth, String(req.params.token), input, req.headers);
    if (setCookie.length > 0) res.setHeader('Set-Cookie', setCookie);
    res.json({ projectId });
  });
  return router;
}
