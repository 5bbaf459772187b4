import { Router } from 'express';
import { createAdjustmentSchema } from '../../../src/shared/schemas/provisions/accounts';
import type { AppContext } from '../../app-context';
import { getActor } from '../../lib/actor';
import * as service from './pay-adjustments.service';

export function payAdjustmentsRouter({ db }: AppContext): Router {
  const router = Router();
  router.get('/projects/:projectId/pay-adjustments', async (req, res) => {
    res.json({ adjustments: await service.listAdjustments(db, getActor(res), req.params.projectId) });
  });
  router.post('/projects/:projectId/pay-adjustments', async (req, res) => {
    const input = createAdjustmentSchema.parse(req.body);
    res.status(201).json({ adjustment: await service.addAdjustment(db, getActor(res), req.params.projectId, input) });
  });
  return router;
}
