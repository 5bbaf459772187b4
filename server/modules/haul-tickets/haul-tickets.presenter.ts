import { checkTicket, ticketTotals, type RegisteredTruck } from '../../../src/shared/domain/provisions/truck-measure';
import type { TicketTotalsView, TruckTicketView, TruckView } from '../../../src/shared/schemas/provisions/views';
import type { TruckRow, TruckTicketRow } from './haul-tickets.repository';

export type { TicketTotalsView, TruckTicketView, TruckView };

export function presentTruck(r: TruckRow): TruckView {
  return {
    id: r.id,
    label: r.label,
    hauler: r.hauler,
    bedVolumeCy: r.bedVolumeCy,
    measuredBy: r.measuredBy,
    measuredOn: r.measuredOn,
  };
}

/** Trucks keyed by label: tickets name the truck by its number, as the checker writes it. */
export function registerOf(trucks: TruckRow[]): Map<string, RegisteredTruck> {
  return new Map(trucks.map((t) => [t.label.toUpperCase(), { id: t.label.toUpperCase(), bedVolumeCy: t.bedVolumeCy }]));
}

type TotalLine = Pick<TruckTicketRow, 'truckLabel' | 'deliveredOn' | 'bidItemId' | 'loadVolumeCy'>;

const lineOf = (r: TotalLine) => ({
  truckId: r.truckLabel.toUpperCase(),
  date: r.deliveredOn,
  bidItemId: r.bidItemId,
  loadVolumeCy: r.loadVolumeCy,
});

export function presentTicket(r: TruckTicketRow, register: Map<string, RegisteredTruck>): TruckTicketView {
  const check = checkTicket(lineOf(r), register);
  return {
    id: r.id,
    bidItemId: r.bidItemId,
    deliveredOn: r.deliveredOn,
    truckLabel: r.truckLabel,
    material: r.material,
    source: r.source,
    loadedAt: r.loadedAt,
    deliveredTo: r.deliveredTo,
    loadCheckerInitials: r.loadCheckerInitials,
    deliveryCheckerInitials: r.deliveryCheckerInitials,
    loadVolumeCy: r.loadVolumeCy,
    volumeCy: check.volumeCy,
    flags: check.flags,
  };
}

export function presentTotals(rows: TotalLine[], register: Map<string, RegisteredTruck>): TicketTotalsView {
  const lines = rows.map(lineOf);
  return { byDay: ticketTotals(lines, register, 'date'), byItem: ticketTotals(lines, register, 'bidItemId') };
}
