import { Router } from 'express';
import { bidItemInputSchema, updateBidItemSchema } from '../../../src/shared/schemas/bid-item';
import type { Db } from '../../db/client';
import { getActor } from '../../lib/actor';
import { csvUpload, readCsvText } from '../../lib/csv-upload';
import * as service from './bid-items.service';

export function bidItemsRouter(db: Db): Router {
  const router = Router();
  router.get('/projects/:projectId/bid-items', async (req, res) => {
    res.json(await service.listBidItems(db, getActor(res), req.params.projectId));
  });
  router.post('/projects/:projectId/bid-items', async (req, res) => {
    const input = bidItemInputSchema.parse(req.body);
    res.status(201).json({ bidItem: await service.createBidItem(db, getActor(res), req.params.projectId, input) });
  });
  router.post('/projects/:projectId/bid-items/import', csvUpload, async (req, res) => {
    const text = await readCsvText(req.file);
    res.status(201).json(await service.importBidItems(db, getActor(res), String(req.params.projectId), text));
  });
  router.patch('/bid-items/:bidItemId', async (req, res) => {
    const input = updateBidItemSchema.parse(req.body);
    res.json({ bidItem: await service.updateBidItem(db, getActor(res), req.params.bidItemId, input) });
  });
  router.delete('/bid-items/:bidItemId', async (req, res) => {
    await service.deleteBidItem(db, getActor(res), req.params.bidItemId);
    res.status(204).end();
  });
  return router;
}
