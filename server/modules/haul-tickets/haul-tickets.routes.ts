import { Router } from 'express';
import { z } from 'zod';
import {
  createTruckSchema,
  createTruckTicketSchema,
  importTruckTicketsSchema,
} from '../../../src/shared/schemas/provisions/tickets';
import { pageQuerySchema } from '../../../src/shared/schemas/paging';
import { isoDateSchema } from '../../../src/shared/schemas/tally';
import type { AppContext } from '../../app-context';
import { getActor } from '../../lib/actor';
import * as service from './haul-tickets.service';

const ticketFilterSchema = z.object({
  bidItemId: z.uuid().optional(),
  from: isoDateSchema.optional(),
  to: isoDateSchema.optional(),
});
const ticketPageSchema = ticketFilterSchema.extend(pageQuerySchema.shape);

export function haulTicketsRouter({ db }: AppContext): Router {
  const router = Router();
  router.get('/projects/:projectId/trucks', async (req, res) => {
    res.json({ trucks: await service.listTrucks(db, getActor(res), req.params.projectId) });
  });
  router.post('/projects/:projectId/trucks', async (req, res) => {
    const input = createTruckSchema.parse(req.body);
    res.status(201).json({ truck: await service.registerTruck(db, getActor(res), req.params.projectId, input) });
  });
  router.get('/projects/:projectId/truck-tickets', async (req, res) => {
    const query = ticketPageSchema.parse(req.query);
    res.json(await service.listTickets(db, getActor(res), req.params.projectId, query));
  });
  router.get('/projects/:projectId/truck-tickets/totals', async (req, res) => {
    const filter = ticketFilterSchema.parse(req.query);
    res.json({ totals: await service.ticketTotals(db, getActor(res), req.params.projectId, filter) });
  });
  router.post('/projects/:projectId/truck-tickets', async (req, res) => {
    const input = createTruckTicketSchema.parse(req.body);
    res.status(201).json({ ticket: await service.addTicket(db, getActor(res), req.params.projectId, input) });
  });
  router.post('/projects/:projectId/truck-tickets/import', async (req, res) => {
    const input = importTruckTicketsSchema.parse(req.body);
    res.status(201).json(await service.importTickets(db, getActor(res), req.params.projectId, input));
  });
  return router;
}
