import { Router } from 'express';
import type { AppContext } from '../../app-context';
import { getActor } from '../../lib/actor';
import { findCompanies } from '../projects/projects.repository';
import { attachment } from '../tallies/tallies.routes';
import { loadPayAppAccess } from './pay-app-access';
import { payAppCsv } from './pay-app-csv';
import { payAppBackup } from './pay-app-backup';
import { payAppPdf } from './pay-app-pdf';
import { exportFileName } from './export-format';
import { payAppDetail } from './pay-apps.service';

/** GET /api/pay-apps/:payAppId/export.pdf and /export.csv, authorized like the application itself. */
export function exportRoutes(ctx: AppContext): Router {
  const router = Router();
  const load = async (actorRes: Parameters<typeof getActor>[0], payAppId: string) => {
    const { project, roles } = await loadPayAppAccess(ctx.db, getActor(actorRes), payAppId);
    return { project, app: await payAppDetail(ctx.db, payAppId, roles) };
  };
  router.get('/pay-apps/:payAppId/export.pdf', async (req, res) => {
    const { project, app } = await load(res, req.params.payAppId);
    const names = new Map(
      (
        await findCompanies(ctx.db, [
          project.subcontractorCompanyId,
          project.generalContractorCompanyId,
          project.ownerCompanyId,
        ])
      ).map((c) => [c.id, c.name]),
    );
    const backup = await payAppBackup(ctx.db, app);
    const pdf = await payAppPdf(
      app,
      {
        projectName: project.name,
        contractNumber: project.contractNumber,
        location: project.location,
        bandOverBps: project.bandOverBps,
        parties: {
          subcontractor: names.get(project.subcontractorCompanyId) ?? '',
          generalContractor: names.get(project.generalContractorCompanyId) ?? '',
          owner: names.get(project.ownerCompanyId) ?? '',
        },
      },
      backup,
    );
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', attachment(exportFileName(project.name, app.number, app.periodEnd, 'pdf')));
    res.send(pdf);
  });
  router.get('/pay-apps/:payAppId/export.csv', async (req, res) => {
    const { project, app } = await load(res, req.params.payAppId);
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', attachment(exportFileName(project.name, app.number, app.periodEnd, 'csv')));
    res.send(payAppCsv(app));
  });
  return router;
}
