import { Router } from 'express';
import { setLumpSumStagesSchema, setMeasurementProfileSchema } from '../../../src/shared/schemas/provisions/profile';
import type { AppContext } from '../../app-context';
import { getActor } from '../../lib/actor';
import * as service from './measurement-profiles.service';

export function measurementProfilesRouter({ db }: AppContext): Router {
  const router = Router();
  router.get('/projects/:projectId/measurement-profiles', async (req, res) => {
    res.json({ profiles: await service.listProfiles(db, getActor(res), req.params.projectId) });
  });
  router.put('/bid-items/:bidItemId/measurement-profile', async (req, res) => {
    const input = setMeasurementProfileSchema.parse(req.body);
    res.json({ profile: await service.setProfile(db, getActor(res), req.params.bidItemId, input) });
  });
  router.put('/bid-items/:bidItemId/lump-sum-stages', async (req, res) => {
    const input = setLumpSumStagesSchema.parse(req.body);
    res.json({ profile: await service.setStages(db, getActor(res), req.params.bidItemId, input) });
  });
  return router;
}
