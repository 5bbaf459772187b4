import { Router } from 'express';
import { personCan } from '../../../src/shared/policies/projects';
import type { MeView } from '../../../src/shared/schemas/project';
import type { Db } from '../../db/client';
import { getActor, type Actor } from '../../lib/actor';
import { listCompanies } from '../companies/companies.service';

export function meView(a: Actor): MeView {
  return {
    user: { id: a.userId, name: a.name, email: a.email },
    company:
      a.companyId && a.companyKind && a.companyName
        ? { id: a.companyId, name: a.companyName, kind: a.companyKind }
        : null,
    isAdmin: a.isAdmin,
    can: personCan(a),
  };
}

/** Who is signed in, and the companies the person may see (their own, their jobs', and what a new job can name). */
export function meRouter(db: Db): Router {
  const router = Router();
  router.get('/me', (_req, res) => {
    res.json(meView(getActor(res)));
  });
  router.get('/companies', async (_req, res) => {
    res.json({ companies: await listCompanies(db, getActor(res)) });
  });
  return router;
}
