import { DomainError, assertNonNegative } from '../domain-error';
import { addDecimals, roundTo } from '../rounding';

/**
 * Truck measure (a state DOT construction manual section 109.11): loads are counted against a register of
 * approved trucks whose beds were measured before they hauled; volumes are computed to 0.01 CY and paid to
 * 0.1 CY (11.38 -> 11.4, 11.34 -> 11.3). Rounding is on the decimal value, half away from zero.
 */
export const TRUCK_COMPUTE_DECIMALS = 2;
export const TRUCK_PAY_DECIMALS = 1;

export function truckComputed(volumeCy: number): number {
  return roundTo(volumeCy, TRUCK_COMPUTE_DECIMALS);
}

export function truckPay(volumeCy: number): number {
  return roundTo(truckComputed(volumeCy), TRUCK_PAY_DECIMALS);
}

export interface RegisteredTruck {
  id: string;
  /** Measured bed volume, CY, to 0.01. */
  bedVolumeCy: number;
}

export interface TruckTicketLine {
  truckId: string | null;
  /** Delivery date, YYYY-MM-DD. */
  date: string;
  bidItemId: string;
  /** Volume the checker recorded for the load; when absent the truck's measured bed volume is taken. */
  loadVolumeCy?: number | null;
}

export const TICKET_FLAGS = ['unregistered_truck', 'over_capacity'] as const;
export type TicketFlag = (typeof TICKET_FLAGS)[number];

export interface TicketCheck {
  /** Volume of the load, CY, to 0.01 (0 when the truck is not registered and no volume was written). */
  volumeCy: number;
  flags: TicketFlag[];
}

/** Checks one ticket against the register: an unregistered truck or a load above the bed volume is flagged. */
export function checkTicket(ticket: TruckTicketLine, trucks: ReadonlyMap<string, RegisteredTruck>): TicketCheck {
  const truck = ticket.truckId ? trucks.get(ticket.truckId) : undefined;
  const flags: TicketFlag[] = [];
  if (!truck) flags.push('unregistered_truck');
  const written = ticket.loadVolumeCy ?? null;
  if (written !== null) assertNonNegative(written, ['loadVolumeCy']);
  const volume = truckComputed(written ?? truck?.bedVolumeCy ?? 0);
  if (truck && volume > truckComputed(truck.bedVolumeCy)) flags.push('over_capacity');
  return { volumeCy: volume, flags };
}

export interface TicketTotal {
  key: string;
  loads: number;
  /** Sum of load volumes, CY, to 0.01. */
  computedCy: number;
  /** Paid to 0.1 CY from the 0.01 figure. */
  payCy: number;
  flagged: number;
}

/** Totals per day or per bid item. Flagged tickets are counted in `flagged` and left out of the volumes. */
export function ticketTotals(
  tickets: readonly TruckTicketLine[],
  trucks: ReadonlyMap<string, RegisteredTruck>,
  by: 'date' | 'bidItemId',
): TicketTotal[] {
  const totals = new Map<string, TicketTotal>();
  for (const ticket of tickets) {
    const key = ticket[by];
    const total = totals.get(key) ?? { key, loads: 0, computedCy: 0, payCy: 0, flagged: 0 };
    const check = checkTicket(ticket, trucks);
    if (check.flags.length > 0) total.flagged += 1;
    else {
      total.loads += 1;
      total.computedCy = addDecimals(total.computedCy, check.volumeCy, TRUCK_COMPUTE_DECIMALS);
    }
    totals.set(key, total);
  }
  return [...totals.values()]
    .map((t) => ({ ...t, payCy: truckPay(t.computedCy) }))
    .sort((a, b) => a.key.localeCompare(b.key));
}

/** A bed volume from inside dimensions in feet (length x width x depth / 27), to 0.01 CY: struck measure. */
export function bedVolumeCy(lengthFt: number, widthFt: number, depthFt: number): number {
  for (const [v, name] of [
    [lengthFt, 'lengthFt'],
    [widthFt, 'widthFt'],
    [depthFt, 'depthFt'],
  ] as const) {
    assertNonNegative(v, [name], true);
  }
  const value = truckComputed((lengthFt * widthFt * depthFt) / 27);
  if (value <= 0) throw new DomainError('INVALID_QUANTITY', 'A bed volume must be above 0', ['depthFt']);
  return value;
}
