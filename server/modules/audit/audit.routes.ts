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
  router.get('/projects/:projectId/audit.csv', async (req, res) => {
    const query = auditQuerySchema.parse(req.query);
    const { csv, projectName } = await service.projectTrailCsv(db, getActor(res), req.params.projectId, query);
    const name = `${
      projectName
        .replace(/[^A-Za-z0-9]+/g, '-')
        .replace(/^-|-$/g, '')
        .slice(0, 60) || 'job'
    }-trail.csv`;
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="${name}"`);
    res.send(csv);
  });
  router.get('/pay-apps/:payAppId/audit', async (req, res) => {
    res.json({ events: await service.payAppTrail(db, getActor(res), req.params.payAppId) });
  });
  return router;
}
