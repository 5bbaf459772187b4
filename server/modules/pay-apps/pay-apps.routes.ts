import { Router } from 'express';
import {
  createPayAppSchema,
  disputeCommentSchema,
  editDisputeSchema,
  payAppActionSchema,
  reviewPayAppSchema,
  revisePayAppSchema,
  withdrawDisputeSchema,
} from '../../../src/shared/schemas/pay-app';
import type { AppContext } from '../../app-context';
import { getActor } from '../../lib/actor';
import * as actions from './pay-app-actions.service';
import { exportRoutes } from './pay-app-exports.routes';
import { commentOnDispute } from './dispute-comments.service';
import { editDispute, withdrawDispute } from './disputes.service';
import { sendPayAppAnswer } from './pay-app-fast-read';
import * as service from './pay-apps.service';
import { lineBackup } from '../tallies/line-backup.service';

export function payAppsRouter(ctx: AppContext): Router {
  const { db } = ctx;
  const router = Router();
  router.get('/projects/:projectId/pay-apps', async (req, res) => {
    res.json({ payApps: await service.listPayApps(db, getActor(res), req.params.projectId) });
  });
  router.post('/projects/:projectId/pay-apps', async (req, res) => {
    const input = createPayAppSchema.parse(req.body);
    res.status(201).json({ payApp: await service.createPayApp(db, getActor(res), req.params.projectId, input) });
  });
  router.get('/pay-apps/:payAppId', async (req, res) => {
    // Usually answered before requireActor (pay-app-fast-read.ts); here when that short path stepped aside.
    sendPayAppAnswer(res, await service.getPayAppAnswer(ctx, getActor(res), req.params.payAppId));
  });
  router.post('/pay-apps/:payAppId/submit', async (req, res) => {
    res.json({
      payApp: await actions.submitPayApp(
        ctx,
        getActor(res),
        req.params.payAppId,
        payAppActionSchema.parse(req.body ?? {}),
      ),
    });
  });
  router.post('/pay-apps/:payAppId/review', async (req, res) => {
    res.json({
      payApp: await actions.reviewPayApp(ctx, getActor(res), req.params.payAppId, reviewPayAppSchema.parse(req.body)),
    });
  });
  router.post('/pay-apps/:payAppId/revise', async (req, res) => {
    res.json({
      payApp: await actions.revisePayApp(ctx, getActor(res), req.params.payAppId, revisePayAppSchema.parse(req.body)),
    });
  });
  router.post('/pay-apps/:payAppId/certify', async (req, res) => {
    const confirm = ctx.recentAuth.take(req, res);
    res.json({
      payApp: await actions.certifyPayApp(
        ctx,
        getActor(res),
        req.params.payAppId,
        payAppActionSchema.parse(req.body ?? {}),
        confirm,
      ),
    });
  });
  router.get('/pay-apps/:payAppId/lines/:lineId/tallies', async (req, res) => {
    res.json(await lineBackup(db, getActor(res), req.params.payAppId, req.params.lineId));
  });
  router.post('/disputes/:disputeId/comments', async (req, res) => {
    const { body } = disputeCommentSchema.parse(req.body);
    res.status(201).json({ comment: await commentOnDispute(db, getActor(res), req.params.disputeId, body) });
  });
  router.patch('/disputes/:disputeId', async (req, res) => {
    res.json({
      payApp: await editDispute(ctx, getActor(res), req.params.disputeId, editDisputeSchema.parse(req.body)),
    });
  });
  router.post('/disputes/:disputeId/withdraw', async (req, res) => {
    const { note } = withdrawDisputeSchema.parse(req.body);
    res.json({ payApp: await withdrawDispute(ctx, getActor(res), req.params.disputeId, note) });
  });
  router.use(exportRoutes(ctx));
  return router;
}
