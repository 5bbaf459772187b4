import { Router } from 'express';
import {
  approveChangeOrderSchema,
  createChangeOrderSchema,
  rejectChangeOrderSchema,
} from '../../../src/shared/schemas/change-order';
import type { AppContext } from '../../app-context';
import { getActor } from '../../lib/actor';
import { approveChangeOrder, rejectChangeOrder } from './change-order-decisions.service';
import * as service from './change-orders.service';

export function changeOrdersRouter({ db }: AppContext): Router {
  const router = Router();
  router.get('/projects/:projectId/change-orders', async (req, res) => {
    res.json({ changeOrders: await service.listChangeOrders(db, getActor(res), req.params.projectId) });
  });
  router.post('/projects/:projectId/change-orders', async (req, res) => {
    const input = createChangeOrderSchema.parse(req.body);
    res.status(201).json({ changeOrder: await service.proposeChangeOrder(db, getActor(res), req.params.projectId, input) });
  });
  router.get('/projects/:projectId/contract-quantities', async (req, res) => {
    res.json({ contractQuantities: await service.listContractQuantities(db, getActor(res), req.params.projectId) });
  });
  router.get('/change-orders/:id', async (req, res) => {
    res.json({ changeOrder: await service.getChangeOrder(db, getActor(res), req.params.id) });
  });
  router.post('/change-orders/:id/approve', async (req, res) => {
    const { note } = approveChangeOrderSchema.parse(req.body ?? {});
    res.json({ changeOrder: await approveChangeOrder(db, getActor(res), req.params.id, note) });
  });
  router.post('/change-orders/:id/reject', async (req, res) => {
    const { note } = rejectChangeOrderSchema.parse(req.body ?? {});
    res.json({ changeOrder: await rejectChangeOrder(db, getActor(res), req.params.id, note) });
  });
  return router;
}
