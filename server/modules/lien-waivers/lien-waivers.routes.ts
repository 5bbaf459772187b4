import { Router } from 'express';
import { issueLienWaiverSchema } from '../../../src/shared/schemas/payment';
import type { AppContext } from '../../app-context';
import { getActor } from '../../lib/actor';
import * as service from './lien-waivers.service';

export function lienWaiversRouter(ctx: AppContext): Router {
  const router = Router();
  router.get('/projects/:projectId/lien-waivers', async (req, res) => {
    res.json(await service.listForProject(ctx, getActor(res), req.params.projectId));
  });
  router.post('/pay-apps/:payAppId/lien-waivers', async (req, res) => {
    const input = issueLienWaiverSchema.parse(req.body ?? {});
    res.status(201).json({ waiver: await service.issueWaiver(ctx, getActor(res), req.params.payAppId, input) });
  });
  router.get('/lien-waivers/:waiverId/pdf', async (req, res) => {
    const { bytes, filename } = await service.waiverPdf(ctx, getActor(res), req.params.waiverId);
    res.type('application/pdf').set('Content-Disposition', `attachment; filename="${filename}"`).send(bytes);
  });
  return router;
}
