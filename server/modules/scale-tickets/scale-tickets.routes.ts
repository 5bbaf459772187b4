import { Router } from 'express';
import { createMaterialSourceSchema, createScaleTicketSchema } from '../../../src/shared/schemas/provisions/tickets';
import { pageQuerySchema } from '../../../src/shared/schemas/paging';
import type { AppContext } from '../../app-context';
import { getActor } from '../../lib/actor';
import * as service from './scale-tickets.service';

export function scaleTicketsRouter({ db }: AppContext): Router {
  const router = Router();
  router.get('/projects/:projectId/material-sources', async (req, res) => {
    res.json({ sources: await service.listSources(db, getActor(res), req.params.projectId) });
  });
  router.post('/projects/:projectId/material-sources', async (req, res) => {
    const input = createMaterialSourceSchema.parse(req.body);
    res.status(201).json({ source: await service.addSource(db, getActor(res), req.params.projectId, input) });
  });
  router.get('/projects/:projectId/scale-tickets', async (req, res) => {
    const query = pageQuerySchema.parse(req.query);
    res.json(await service.listScaleTickets(db, getActor(res), req.params.projectId, query));
  });
  router.post('/projects/:projectId/scale-tickets', async (req, res) => {
    const input = createScaleTicketSchema.parse(req.body);
    res.status(201).json({ ticket: await service.addScaleTicket(db, getActor(res), req.params.projectId, input) });
  });
  return router;
}
