import type { TicketHold } from '../../../src/shared/domain/provisions/ticket-pay';
import { HOLD_REASON_LABELS } from '../../../src/shared/domain/provisions/ticket-pay';
import type { LineTicketView } from '../../../src/shared/schemas/pay-app';
import type { Db } from '../../db/client';
import { presentTicket, registerOf } from '../haul-tickets/haul-tickets.presenter';
import { listTrucks } from '../haul-tickets/haul-tickets.repository';
import { presentScaleTicket } from '../scale-tickets/scale-tickets.presenter';
import { listSources } from '../scale-tickets/scale-tickets.repository';
import { ticketsPaidOn } from './pay-app-records.repository';

/** The tickets behind one line: paid on the application (with the volume or weight taken), then those held. */
export async function lineTickets(
  db: Db,
  app: { id: string; projectId: string; ticketHolds: unknown },
  bidItemId: string,
): Promise<LineTicketView[]> {
  const { loads, weighed } = await ticketsPaidOn(db, app.id, bidItemId);
  const holds = (app.ticketHolds as TicketHold[]).filter((h) => h.bidItemId === bidItemId);
  if (loads.length + weighed.length + holds.length === 0) return [];
  const [trucks, sources] = await Promise.all([listTrucks(db, app.projectId), listSources(db, app.projectId)]);
  const register = registerOf(trucks);
  const sourceById = new Map(sources.map((s) => [s.id, s]));
  return [
    ...loads.map((r) => ({
      kind: 'truck' as const,
      id: r.id,
      label: `Truck ${r.truckLabel}`,
      date: r.deliveredOn,
      measure: `${presentTicket(r, register).volumeCy.toFixed(2)} CY`,
      held: null,
    })),
    ...weighed.map((r) => {
      const v = presentScaleTicket(r, sourceById.get(r.sourceId));
      return {
        kind: 'scale' as const,
        id: r.id,
        label: `Scale ${r.ticketNumber}`,
        date: r.weighedOn,
        measure: `${v.payTons.toFixed(2)} t (${v.computedCy.toFixed(2)} CY)`,
        held: null,
      };
    }),
    ...holds.map((h) => ({
      kind: h.kind,
      id: h.ticketId,
      label: h.kind === 'truck' ? `Truck ${h.label}` : `Scale ${h.label}`,
      date: h.date,
      measure: '',
      held: h.reasons.map((r) => HOLD_REASON_LABELS[r]).join('; '),
    })),
  ];
}
