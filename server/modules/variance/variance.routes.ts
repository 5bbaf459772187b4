import { Router } from 'express';
import { forecastInputSchema } from '../../../src/shared/schemas/variance';
import type { AppContext } from '../../app-context';
import { getActor } from '../../lib/actor';
import { draftVarianceChangeOrder, setForecast } from './forecasts.service';
import { projectVariance } from './variance.service';

export function varianceRouter({ db }: AppContext): Router {
  const router = Router();
  router.get('/projects/:projectId/variance', async (req, res) => {
    res.json(await projectVariance(db, getActor(res), req.params.projectId));
  });
  router.put('/bid-items/:bidItemId/forecast', async (req, res) => {
    const input = forecastInputSchema.parse(req.body);
    res.json({ row: await setForecast(db, getActor(res), req.params.bidItemId, input) });
  });
  router.post('/bid-items/:bidItemId/variance-change-order', async (req, res) => {
    res.status(201).json({ changeOrder: await draftVarianceChangeOrder(db, getActor(res), req.params.bidItemId) });
  });
  return router;
}
