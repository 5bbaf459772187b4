import { Router } from 'express';
import type { Db } from '../../db/client';
import { getActor } from '../../lib/actor';
import * as service from './members.service';

/** For the People screen and the company page: a company admin sees its people and removes them from a job or the company. */
export function membersRouter(db: Db): Router {
  const router = Router();
  router.delete('/projects/:projectId/members/:userId', async (req, res) => {
    await service.removeFromProject(db, getActor(res), req.params.projectId, req.params.userId);
    res.status(204).end();
  });
  router.get('/companies/:companyId', async (req, res) => {
    res.json(await service.companyPage(db, getActor(res), req.params.companyId));
  });
  router.get('/companies/:companyId/members', async (req, res) => {
    res.json({ members: await service.listCompanyMembers(db, getActor(res), req.params.companyId) });
  });
  router.delete('/companies/:companyId/members/:userId', async (req, res) => {
    await service.removeFromCompany(db, getActor(res), req.params.companyId, req.params.userId);
    res.status(204).end();
  });
  return router;
}
