import { and, asc, between, eq } from 'drizzle-orm';
import type { DailySheetView, ScaleTicketView, TruckTicketView } from '../../../src/shared/schemas/provisions/views';
import type { Db } from '../../db/client';
import { changeOrders, scaleTickets } from '../../db/schema';
import { presentSheet } from '../force-account/force-account.presenter';
import { listSheets } from '../force-account/force-account.repository';
import { presentTicket, registerOf } from '../haul-tickets/haul-tickets.presenter';
import { listTickets, listTrucks } from '../haul-tickets/haul-tickets.repository';
import { presentScaleTicket } from '../scale-tickets/scale-tickets.presenter';
import { listSources } from '../scale-tickets/scale-tickets.repository';

/** The field records behind a pay application, for the PDF's appendices: those dated within its period. */
export type PayAppBackup = {
  truckTickets: (TruckTicketView & { itemNumber: string })[];
  scaleTickets: (ScaleTicketView & { itemNumber: string; sourceName: string })[];
  dailySheets: (DailySheetView & { changeOrderNumber: number | null })[];
};

export async function payAppBackup(
  db: Db,
  app: {
    projectId: string;
    periodStart: string;
    periodEnd: string;
    lines: { bidItemId: string; itemNumber: string }[];
  },
): Promise<PayAppBackup> {
  const { projectId, periodStart: from, periodEnd: to } = app;
  const within = (d: string) => d >= from && d <= to;
  const [tickets, trucks, scale, sources, sheets, orders] = await Promise.all([
    listTickets(db, projectId, { from, to }),
    listTrucks(db, projectId),
    db
      .select()
      .from(scaleTickets)
      .where(and(eq(scaleTickets.projectId, projectId), between(scaleTickets.weighedOn, from, to)))
      .orderBy(asc(scaleTickets.weighedOn), asc(scaleTickets.ticketNumber)),
    listSources(db, projectId),
    listSheets(db, projectId),
    db
      .select({ id: changeOrders.id, number: changeOrders.number })
      .from(changeOrders)
      .where(eq(changeOrders.projectId, projectId)),
  ]);
  const itemNumber = new Map(app.lines.map((l) => [l.bidItemId, l.itemNumber]));
  const register = registerOf(trucks);
  const sourceById = new Map(sources.map((s) => [s.id, s]));
  const orderNumber = new Map(orders.map((o) => [o.id, o.number]));
  return {
    truckTickets: tickets.map((r) => ({
      ...presentTicket(r, register),
      itemNumber: itemNumber.get(r.bidItemId) ?? '',
    })),
    scaleTickets: scale
      .filter((r) => within(r.weighedOn))
      .map((r) => ({
        ...presentScaleTicket(r, sourceById.get(r.sourceId)),
        itemNumber: itemNumber.get(r.bidItemId) ?? '',
        sourceName: sourceById.get(r.sourceId)?.name ?? '',
      })),
    dailySheets: sheets
      .filter((r) => within(r.workedOn))
      .sort((a, b) => a.workedOn.localeCompare(b.workedOn))
      .map((r) => ({ ...presentSheet(r), changeOrderNumber: orderNumber.get(r.changeOrderId) ?? null })),
  };
}
