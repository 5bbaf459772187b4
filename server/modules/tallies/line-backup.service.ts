import type { Db } from '../../db/client';
import type { Actor } from '../../lib/actor';
import { notFound } from '../../lib/app-error';
import { loadPayAppAccess } from '../pay-apps/pay-app-access';
import { listLines } from '../pay-apps/pay-apps.repository';
import { isUuid } from '../projects/project-access';
import { presentTallySummary } from './tallies.presenter';
import * as repo from './tallies.repository';
import { lineTickets } from '../pay-apps/line-tickets';

/**
 * The backup of one pay application line: the tallies billed to its bid item on that application, with their
 * evidence counts. The application's visibility rules apply first (404 off the project, 404 for the owner before
 * certification), so the backup is never readable where the line is not. A truck-measure or weight line's backup
 * is its tickets: those the application paid, then those it held out with the reason.
 */
export async function lineBackup(db: Db, actor: Actor, payAppId: string, lineId: string) {
  const { app, roles } = await loadPayAppAccess(db, actor, payAppId);
  const line = isUuid(lineId) ? (await listLines(db, app.id)).find((l) => l.id === lineId) : undefined;
  if (!line) throw notFound('The line');
  const rows = await repo.listLineTallies(db, app.id, line.bidItemId);
  const counts = await repo.evidenceCounts(
    db,
    rows.map((r) => r.tally.id),
  );
  return {
    line: { id: line.id, bidItemId: line.bidItemId, payAppId: app.id, payAppNumber: app.number },
    tallies: rows.map((r) => presentTallySummary(r, counts.get(r.tally.id) ?? 0, roles)),
    tickets: await lineTickets(db, app, line.bidItemId),
  };
}
