import { Router } from 'express';
import { createTallySchema, tallyListQuerySchema, updateTallySchema } from '../../../src/shared/schemas/tally';
import type { AppContext } from '../../app-context';
import { getActor } from '../../lib/actor';
import { limitsOf } from '../../lib/upload';
import { checkEvidenceFiles, evidenceUpload } from './evidence-files';
import * as evidence from './evidence.service';
import * as service from './tallies.service';

/** Content-Disposition for a stored name (already sanitised): ASCII fallback plus the RFC 5987 form. */
export function attachment(fileName: string): string {
  const ascii = fileName.replace(/[^\x20-\x7e]/g, '_').replace(/["\\]/g, '_');
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(fileName)}`;
}

export function talliesRouter(ctx: AppContext): Router {
  const { db, storage } = ctx;
  const router = Router();
  router.get('/projects/:projectId/tallies', async (req, res) => {
    const query = tallyListQuerySchema.parse(req.query);
    res.json(await service.listTallies(db, getActor(res), req.params.projectId, query));
  });
  router.post('/projects/:projectId/tallies', async (req, res) => {
    const input = createTallySchema.parse(req.body);
    res
      .status(201)
      .json({ tally: await service.createTally(db, getActor(res), req.params.projectId, input, ctx.compute) });
  });
  router.get('/tallies/:tallyId', async (req, res) => {
    res.json(await service.getTally(db, getActor(res), req.params.tallyId));
  });
  router.patch('/tallies/:tallyId', async (req, res) => {
    const patch = updateTallySchema.parse(req.body);
    res.json({ tally: await service.updateTally(db, getActor(res), req.params.tallyId, patch, ctx.compute) });
  });
  router.post('/tallies/:tallyId/ready', async (req, res) => {
    res.json({ tally: await service.markReady(db, getActor(res), req.params.tallyId) });
  });
  router.delete('/tallies/:tallyId', async (req, res) => {
    await service.deleteTally(db, getActor(res), req.params.tallyId, (key) => storage.remove(key));
    res.status(204).end();
  });
  router.post('/tallies/:tallyId/evidence', evidenceUpload, async (req, res) => {
    const files = await checkEvidenceFiles(req.files as Express.Multer.File[] | undefined);
    const quota = limitsOf(req).projectQuotaBytes;
    const added = await evidence.addEvidence(db, storage, getActor(res), String(req.params.tallyId), files, quota);
    res.status(201).json({ evidence: added });
  });
  router.get('/evidence/:evidenceId/download', async (req, res) => {
    const { evidence: row, bytes } = await evidence.downloadEvidence(db, storage, getActor(res), req.params.evidenceId);
    res.setHeader('Content-Type', row.contentType);
    res.setHeader('Content-Disposition', attachment(row.fileName));
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.send(bytes);
  });
  router.delete('/evidence/:evidenceId', async (req, res) => {
    await evidence.removeEvidence(db, storage, getActor(res), req.params.evidenceId);
    res.status(204).end();
  });
  return router;
}
