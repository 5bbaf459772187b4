import { Router } from 'express';
import { asc } from 'drizzle-orm';
import type { MeView } from '../../../src/shared/schemas/project';
import type { Db } from '../../db/client';
import { companies } from '../../db/schema';
import { getActor } from '../../lib/actor';
import { presentCompany } from '../projects/projects.presenter';

/** Who is signed in, and the companies a general contractor can pick when setting up a project. */
export function meRouter(db: Db): Router {
  const router = Router();
  router.get('/me', (_req, res) => {
    const a = getActor(res);
    const body: MeView = {
      user: { id: a.userId, name: a.name, email: a.email },
      company:
        a.companyId && a.companyKind && a.companyName
          ? { id: a.companyId, name: a.companyName, kind: a.companyKind }
          : null,
      isAdmin: a.isAdmin,
    };
    res.json(body);
  });
  router.get('/companies', async (_req, res) => {
    getActor(res);
    const rows = await db.select().from(companies).orderBy(asc(companies.name));
    res.json({ companies: rows.map(presentCompany) });
  });
  return router;
}
