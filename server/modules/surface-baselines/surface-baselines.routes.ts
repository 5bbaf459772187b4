import { Router } from 'express';
import { recordBaselineSchema } from '../../../src/shared/schemas/surface-baseline';
import type { AppContext } from '../../app-context';
import { getActor } from '../../lib/actor';
import { limitsOf } from '../../lib/upload';
import { attachment } from '../tallies/tallies.routes';
import { baselineUpload } from './baseline-file';
import * as service from './surface-baselines.service';

export function surfaceBaselinesRouter(ctx: AppContext): Router {
  const { db, storage } = ctx;
  const router = Router();
  router.get('/projects/:projectId/surface-baselines', async (req, res) => {
    res.json(await service.listBaselines(db, getActor(res), req.params.projectId));
  });
  router.post('/projects/:projectId/surface-baselines', baselineUpload, async (req, res) => {
    const input = recordBaselineSchema.parse(req.body ?? {});
    const baseline = await service.recordBaseline(
      db,
      storage,
      getActor(res),
      String(req.params.projectId),
      input,
      req.file,
      limitsOf(req).projectQuotaBytes,
      ctx.compute,
    );
    res.status(201).json({ baseline });
  });
  router.post('/surface-baselines/:baselineId/accept', async (req, res) => {
    res.json({ baseline: await service.acceptBaseline(db, getActor(res), req.params.baselineId) });
  });
  router.get('/surface-baselines/:baselineId/download', async (req, res) => {
    const { row, bytes } = await service.downloadBaseline(db, storage, getActor(res), req.params.baselineId);
    res.setHeader('Content-Type', row.contentType);
    res.setHeader('Content-Disposition', attachment(row.fileName));
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.send(bytes);
  });
  return router;
}
