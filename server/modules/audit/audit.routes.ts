import { Router } from 'express';
import { auditQuerySchema } from '../../../src/shared/schemas/audit';
import type { Db } from '../../db/client';
import { getActor } from '../../lib/actor';
import * as service from './audit.service';

/** Read-only: the trail is append-only and no route updates or deletes it. */
export function auditRouter(db: Db): Router {
  const router = Router();
  router.get('/projects/:projectId/audit', async (req, res) => {
    const query = auditQuerySchema.parse(req.query);
    res.json(await service.projectTrail(db, getActor(res), req.params.projectId, query));
  });
  router.get('/pay-apps/:payAppId/audit', async (req, res) => {
    res.json({ events: await service.payAppTrail(db, getActor(res), req.params.payAppId) });
  });
  return router;
}
