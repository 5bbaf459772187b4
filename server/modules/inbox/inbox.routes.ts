import { Router } from 'express';
import type { Db } from '../../db/client';
import { getActor } from '../../lib/actor';
import * as service from './inbox.service';

/** What waits on the signed-in person across all jobs. */
export function inboxRouter(db: Db): Router {
  const router = Router();
  router.get('/inbox', async (_req, res) => {
    res.json(await service.inboxFor(db, getActor(res)));
  });
  return router;
}
