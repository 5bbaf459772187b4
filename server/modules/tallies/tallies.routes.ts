import { Router, type Request } from 'express';
import { AppError } from '../../lib/app-error';
import type { Storage } from '../../integrations/storage/storage';
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

const isMultipart = (req: Request) => Boolean(req.is('multipart/form-data'));

/** The tally of a request: the JSON body, or the JSON text of the multipart field `tally`. */
function tallyBody(req: Request): unknown {
  if (!isMultipart(req)) return req.body;
  const text = (req.body as Record<string, unknown> | undefined)?.tally;
  try {
    if (typeof text !== 'string') throw new Error('missing');
    return JSON.parse(text) as unknown;
  } catch {
    const message = 'Send the tally as JSON text in the form field "tally", beside its files.';
    throw new AppError(400, 'VALIDATION_FAILED', message, [{ path: 'tally', message }]);
  }
}

/** The files sent with a multipart tally, checked against their types (none refused) before anything is saved. */
async function filesOf(req: Request, storage: Storage): Promise<service.TallyFiles | undefined> {
  const files = req.files as Express.Multer.File[] | undefined;
  if (!isMultipart(req) || !files || files.length === 0) return undefined;
  return { storage, files: await checkEvidenceFiles(files), quotaBytes: limitsOf(req).projectQuotaBytes };
}

export function talliesRouter(ctx: AppContext): Router {
  const { db, storage } = ctx;
  const router = Router();
  router.get('/projects/:projectId/tallies', async (req, res) => {
    const query = tallyListQuerySchema.parse(req.query);
    res.json(await service.listTallies(db, getActor(res), req.params.projectId, query));
  });
  // JSON, or multipart with the tally as JSON in the field `tally` and the worksheet's files in `files`: one
  // request, one transaction (tallies.service.ts); a refused file refuses the whole save.
  router.post('/projects/:projectId/tallies', evidenceUpload, async (req, res) => {
    const input = createTallySchema.parse(tallyBody(req));
    const attach = await filesOf(req, storage);
    const tally = await service.createTally(
      db,
      getActor(res),
      String(req.params.projectId),
      input,
      ctx.compute,
      attach,
    );
    res
      .status(201)
      .json(attach ? { tally, evidence: (await service.getTally(db, getActor(res), tally.id)).evidence } : { tally });
  });
  router.get('/tallies/:tallyId', async (req, res) => {
    res.json(await service.getTally(db, getActor(res), req.params.tallyId));
  });
  router.patch('/tallies/:tallyId', evidenceUpload, async (req, res) => {
    const patch = updateTallySchema.parse(tallyBody(req));
    const attach = await filesOf(req, storage);
    const tally = await service.updateTally(db, getActor(res), String(req.params.tallyId), patch, ctx.compute, attach);
    res.json(attach ? { tally, evidence: (await service.getTally(db, getActor(res), tally.id)).evidence } : { tally });
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
