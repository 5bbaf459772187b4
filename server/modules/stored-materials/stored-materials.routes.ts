import { Router } from 'express';
import { z } from 'zod';
import { addStoredMovementSchema, createStoredMaterialSchema } from '../../../src/shared/schemas/provisions/accounts';
import { isoDateSchema } from '../../../src/shared/schemas/tally';
import type { AppContext } from '../../app-context';
import { getActor } from '../../lib/actor';
import * as service from './stored-materials.service';

const periodQuerySchema = z.object({ from: isoDateSchema.optional(), to: isoDateSchema.optional() });

export function storedMaterialsRouter({ db }: AppContext): Router {
  const router = Router();
  router.get('/projects/:projectId/stored-materials', async (req, res) => {
    const { from, to } = periodQuerySchema.parse(req.query);
    res.json({ materials: await service.listMaterials(db, getActor(res), req.params.projectId, from, to) });
  });
  router.post('/projects/:projectId/stored-materials', async (req, res) => {
    const input = createStoredMaterialSchema.parse(req.body);
    res.status(201).json({ material: await service.addMaterial(db, getActor(res), req.params.projectId, input) });
  });
  router.post('/stored-materials/:storedMaterialId/movements', async (req, res) => {
    const input = addStoredMovementSchema.parse(req.body);
    res
      .status(201)
      .json({ material: await service.addMovement(db, getActor(res), req.params.storedMaterialId, input) });
  });
  return router;
}
