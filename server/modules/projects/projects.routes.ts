import { Router } from 'express';
import { createProjectSchema, updateProjectSchema } from '../../../src/shared/schemas/project';
import type { Db } from '../../db/client';
import { getActor } from '../../lib/actor';
import * as service from './projects.service';

export function projectsRouter(db: Db): Router {
  const router = Router();
  router.get('/projects', async (_req, res) => {
    res.json({ projects: await service.listProjects(db, getActor(res)) });
  });
  router.post('/projects', async (req, res) => {
    const input = createProjectSchema.parse(req.body);
    res.status(201).json({ project: await service.createProject(db, getActor(res), input) });
  });
  router.get('/projects/:projectId', async (req, res) => {
    res.json({ project: await service.getProject(db, getActor(res), req.params.projectId) });
  });
  router.patch('/projects/:projectId', async (req, res) => {
    const input = updateProjectSchema.parse(req.body);
    res.json({ project: await service.updateProject(db, getActor(res), req.params.projectId, input) });
  });
  return router;
}
