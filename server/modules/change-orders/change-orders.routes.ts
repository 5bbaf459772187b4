import { Router, type Response } from 'express';
import {
  approveChangeOrderSchema,
  createChangeOrderSchema,
  rejectChangeOrderSchema,
} from '../../../src/shared/schemas/change-order';
import type { AppContext } from '../../app-context';
import { getActor } from '../../lib/actor';
import { limitsOf } from '../../lib/upload';
import { checkEvidenceFiles, evidenceUpload } from '../tallies/evidence-files';
import { attachment } from '../tallies/tallies.routes';
import * as documents from './change-order-documents.service';
import { approveChangeOrder, rejectChangeOrder } from './change-order-decisions.service';
import * as service from './change-orders.service';

export function changeOrdersRouter(ctx: AppContext): Router {
  const { db, storage, outbox } = ctx;
  const router = Router();
  // A decision or proposal queues its e-mail in its transaction; the outbox sends it once the answer is out.
  const mailAfterAnswer = (res: Response) => res.on('finish', () => void outbox.flush());
  router.get('/projects/:projectId/change-orders', async (req, res) => {
    res.json({ changeOrders: await service.listChangeOrders(db, getActor(res), req.params.projectId) });
  });
  router.post('/projects/:projectId/change-orders', async (req, res) => {
    const input = createChangeOrderSchema.parse(req.body);
    const changeOrder = await service.proposeChangeOrder(ctx, getActor(res), req.params.projectId, input);
    mailAfterAnswer(res);
    res.status(201).json({ changeOrder });
  });
  router.get('/projects/:projectId/contract-quantities', async (req, res) => {
    res.json({ contractQuantities: await service.listContractQuantities(db, getActor(res), req.params.projectId) });
  });
  router.get('/change-orders/:id', async (req, res) => {
    res.json({ changeOrder: await service.getChangeOrder(db, getActor(res), req.params.id) });
  });
  router.post('/change-orders/:id/approve', async (req, res) => {
    const { note } = approveChangeOrderSchema.parse(req.body ?? {});
    const changeOrder = await approveChangeOrder(ctx, getActor(res), req.params.id, note);
    mailAfterAnswer(res);
    res.json({ changeOrder });
  });
  router.post('/change-orders/:id/reject', async (req, res) => {
    const { note } = rejectChangeOrderSchema.parse(req.body ?? {});
    const changeOrder = await rejectChangeOrder(ctx, getActor(res), req.params.id, note);
    mailAfterAnswer(res);
    res.json({ changeOrder });
  });
  router.get('/change-orders/:id/documents', async (req, res) => {
    res.json({ documents: await documents.listChangeOrderDocuments(db, getActor(res), req.params.id) });
  });
  // The same upload and file checks as tally evidence (one pipeline for every file a project keeps).
  router.post('/change-orders/:id/documents', evidenceUpload, async (req, res) => {
    const files = await checkEvidenceFiles(req.files as Express.Multer.File[] | undefined);
    const attached = await documents.attachChangeOrderDocuments(
      db,
      storage,
      getActor(res),
      String(req.params.id),
      files,
      limitsOf(req).projectQuotaBytes,
    );
    res.status(201).json({ documents: attached });
  });
  router.get('/change-order-documents/:documentId/download', async (req, res) => {
    const { document, bytes } = await documents.downloadChangeOrderDocument(
      db,
      storage,
      getActor(res),
      req.params.documentId,
    );
    res.setHeader('Content-Type', document.contentType);
    res.setHeader('Content-Disposition', attachment(document.fileName));
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.send(bytes);
  });
  return router;
}
