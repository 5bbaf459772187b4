import { Router } from 'express';
import { forecastInputSchema } from '../../../src/shared/schemas/variance';
import type { AppContext } from '../../app-context';
import { getActor } from '../../lib/actor';
import { draftVarianceChangeOrder, setForecast } from './forecasts.service';
import { projectVariance } from './variance.service';

export function varianceRouter(ctx: AppContext): Router {
  const { db, outbox } = ctx;
  const router = Router();
  router.get('/projects/:projectId/variance', async (req, res) => {
    res.json(await projectVariance(db, getActor(res), req.params.projectId));
  });
  router.put('/bid-items/:bidItemId/forecast', async (req, res) => {
    const input = forecastInputSchema.parse(req.body);
    res.json({ row: await setForecast(db, getActor(res), req.params.bidItemId, input) });
  });
  router.post('/bid-items/:bidItemId/variance-change-order', async (req, res) => {
    const changeOrder = await draftVarianceChangeOrder(ctx, getActor(res), req.params.bidItemId);
    res.on('finish', () => void outbox.flush()); // the proposal's e-mail to those who decide it
    res.status(201).json({ changeOrder });
  });
  return router;
}
