import { and, asc, eq, inArray, or } from 'drizzle-orm';
import type { AnyPgColumn } from 'drizzle-orm/pg-core';
import type { TicketHoldView } from '../../../src/shared/schemas/pay-app';
import type { DailySheetView, ScaleTicketView, TruckTicketView } from '../../../src/shared/schemas/provisions/views';
import type { Db } from '../../db/client';
import { changeOrders, forceAccountSheets, scaleTickets, truckTickets } from '../../db/schema';
import { presentSheet } from '../force-account/force-account.presenter';
import { presentTicket, registerOf } from '../haul-tickets/haul-tickets.presenter';
import { listTrucks } from '../haul-tickets/haul-tickets.repository';
import { presentScaleTicket } from '../scale-tickets/scale-tickets.presenter';
import { listSources } from '../scale-tickets/scale-tickets.repository';

/**
 * The field records behind a pay application, for the PDF's appendices: the tickets and days it paid, and the
 * tickets it held out (each marked with its reasons).
 */
export type PayAppBackup = {
  truckTickets: (TruckTicketView & { itemNumber: string; held: string | null })[];
  scaleTickets: (ScaleTicketView & { itemNumber: string; sourceName: string; held: string | null })[];
  dailySheets: (DailySheetView & { changeOrderNumber: number | null })[];
};

export async function payAppBackup(
  db: Db,
  app: {
    id: string;
    projectId: string;
    lines: { bidItemId: string; itemNumber: string }[];
    ticketHolds: TicketHoldView[];
  },
): Promise<PayAppBackup> {
  const { projectId } = app;
  const held = new Map(app.ticketHolds.map((h) => [h.ticketId, h.reasons.join('; ')]));
  const heldIds = [...held.keys()];
  const paidOrHeld = <C extends AnyPgColumn>(payAppId: AnyPgColumn, id: C) =>
    heldIds.length > 0 ? or(eq(payAppId, app.id), inArray(id, heldIds)) : eq(payAppId, app.id);
  const [tickets, trucksList, scale, sources, sheets, orders] = await Promise.all([
    db
      .select()
      .from(truckTickets)
      .where(and(eq(truckTickets.projectId, projectId), paidOrHeld(truckTickets.payAppId, truckTickets.id)))
      .orderBy(asc(truckTickets.deliveredOn), asc(truckTickets.createdAt)),
    listTrucks(db, projectId),
    db
      .select()
      .from(scaleTickets)
      .where(and(eq(scaleTickets.projectId, projectId), paidOrHeld(scaleTickets.payAppId, scaleTickets.id)))
      .orderBy(asc(scaleTickets.weighedOn), asc(scaleTickets.ticketNumber)),
    listSources(db, projectId),
    db
      .select()
      .from(forceAccountSheets)
      .where(and(eq(forceAccountSheets.projectId, projectId), eq(forceAccountSheets.payAppId, app.id)))
      .orderBy(asc(forceAccountSheets.workedOn)),
    db
      .select({ id: changeOrders.id, number: changeOrders.number })
      .from(changeOrders)
      .where(eq(changeOrders.projectId, projectId)),
  ]);
  const itemNumber = new Map(app.lines.map((l) => [l.bidItemId, l.itemNumber]));
  const register = registerOf(trucksList);
  const sourceById = new Map(sources.map((s) => [s.id, s]));
  const orderNumber = new Map(orders.map((o) => [o.id, o.number]));
  return {
    truckTickets: tickets.map((r) => ({
      ...presentTicket(r, register),
      itemNumber: itemNumber.get(r.bidItemId) ?? '',
      held: held.get(r.id) ?? null,
    })),
    scaleTickets: scale.map((r) => ({
      ...presentScaleTicket(r, sourceById.get(r.sourceId)),
      itemNumber: itemNumber.get(r.bidItemId) ?? '',
      sourceName: sourceById.get(r.sourceId)?.name ?? '',
      held: held.get(r.id) ?? null,
    })),
    dailySheets: sheets.map((r) => ({
      ...presentSheet(r),
      changeOrderNumber: orderNumber.get(r.changeOrderId) ?? null,
    })),
  };
}
