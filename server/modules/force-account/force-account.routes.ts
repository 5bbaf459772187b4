import { Router } from 'express';
import { createForceAccountSheetSchema } from '../../../src/shared/schemas/provisions/accounts';
import type { AppContext } from '../../app-context';
import { getActor } from '../../lib/actor';
import * as service from './force-account.service';

export function forceAccountRouter({ db }: AppContext): Router {
  const router = Router();
  router.get('/projects/:projectId/daily-sheets', async (req, res) => {
    res.json({ sheets: await service.listSheets(db, getActor(res), req.params.projectId) });
  });
  router.post('/projects/:projectId/daily-sheets', async (req, res) => {
    const input = createForceAccountSheetSchema.parse(req.body);
    res.status(201).json({ sheet: await service.addSheet(db, getActor(res), req.params.projectId, input) });
  });
  router.post('/daily-sheets/:sheetId/sign', async (req, res) => {
    res.json({ sheet: await service.signSheet(db, getActor(res), req.params.sheetId) });
  });
  return router;
}
