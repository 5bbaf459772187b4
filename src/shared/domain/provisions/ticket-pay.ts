import type { PayUnit } from '../../constants';
import { addDecimals, roundTo } from '../rounding';
import type { Precision } from './precision';
import { checkTicket, type RegisteredTruck, type TicketFlag } from './truck-measure';
import { moistureCorrected, tonsToCubicYards, WEIGHT_DECIMALS } from './weight';

/** Why a ticket was left out of a pay quantity (shown beside it on the application). */
export type HoldReason = TicketFlag | 'unit_not_convertible';

export const HOLD_REASON_LABELS: Record<HoldReason, string> = {
  unregistered_truck: 'Truck not on the register',
  over_capacity: 'Load above the registered bed volume',
  unit_not_convertible: 'Tickets cannot be converted to the item’s pay unit',
};

/** One ticket held out of a pay application, with the item it belongs to and why. */
export interface TicketHold {
  kind: 'truck' | 'scale';
  ticketId: string;
  /** The truck number (load tickets) or the ticket number (scale tickets). */
  label: string;
  date: string;
  bidItemId: string;
  reasons: HoldReason[];
}

export interface TicketPay {
  /** The period's pay quantity in the item's pay unit, rounded to the profile's pay decimals. */
  quantity: number;
  /** The figure it was rounded from, to the profile's measured decimals (one finer). */
  measuredQuantity: number;
  /** Tickets taken, in the order given. */
  paidIds: string[];
  held: TicketHold[];
}

/** One cubic yard in cubic metres, exactly (1 yd = 0.9144 m by the 1959 international yard and pound agreement). */
export const CUBIC_METRES_PER_CY = 0.764554857984;

export interface TruckTicketInput {
  id: string;
  truckLabel: string;
  date: string;
  bidItemId: string;
  loadVolumeCy: number | null;
}

/**
 * The period's pay quantity of a truck-measure item from its load tickets (a state DOT construction manual,
 * section 109.11: loads counted against the register of measured trucks). Each load is the checker's volume or the
 * truck's bed volume, to 0.01 CY; the loads are summed and the sum paid to the profile's precision (for CY the
 * default computes to 0.01 CY and pays 0.1 CY). A ticket on an unregistered truck or above the bed is held out with
 * its reason. A m3 item takes the sum x 0.764554857984; any other unit holds every ticket. The volume is the loose
 * volume in the truck, as truck measure pays it: no swell or shrinkage is applied.
 */
export function truckTicketPay(
  tickets: readonly TruckTicketInput[],
  register: ReadonlyMap<string, RegisteredTruck>,
  unit: PayUnit,
  precision: Precision,
): TicketPay {
  const held: TicketHold[] = [];
  const paidIds: string[] = [];
  let sumCy = 0;
  for (const t of tickets) {
    const hold = (reasons: HoldReason[]) =>
      held.push({ kind: 'truck', ticketId: t.id, label: t.truckLabel, date: t.date, bidItemId: t.bidItemId, reasons });
    if (unit !== 'CY' && unit !== 'm3') {
      hold(['unit_not_convertible']);
      continue;
    }
    const check = checkTicket({ ...t, truckId: t.truckLabel.toUpperCase() }, register);
    if (check.flags.length > 0) {
      hold(check.flags);
      continue;
    }
    paidIds.push(t.id);
    sumCy = addDecimals(sumCy, check.volumeCy, 2);
  }
  const inUnit = unit === 'm3' ? sumCy * CUBIC_METRES_PER_CY : sumCy;
  return finish(inUnit, precision, paidIds, held);
}

export interface ScaleTicketInput {
  id: string;
  ticketNumber: string;
  date: string;
  bidItemId: string;
  sourceId: string;
  netTons: number;
  moisturePercent: number | null;
}

export interface SourceFactor {
  /** Tons per CY, the factor used (3 decimals). */
  factorUsed: number;
  /** Moisture (percent) above which the net weight is corrected; null: no correction in the contract. */
  statedMoisturePercent: number | null;
}

/**
 * The period's pay quantity of a weight item from its scale tickets (Resident Engineer's Manual section 109.12).
 * Each net weight is corrected for moisture above the source's stated moisture (net x 100 / (100 + M), to 0.01).
 * A TON or t item is paid the corrected weights' sum (the scale weighs in the item's unit). A CY item converts
 * each source's corrected tons with that source's factor (tons / factor to 0.01 CY, banded to 0.5 CY) and sums
 * the sources; any other unit holds every ticket. The sum is paid to the profile's precision.
 */
export function scaleTicketPay(
  tickets: readonly ScaleTicketInput[],
  sources: ReadonlyMap<string, SourceFactor>,
  unit: PayUnit,
  precision: Precision,
): TicketPay {
  const held: TicketHold[] = [];
  const paidIds: string[] = [];
  const tonsBySource = new Map<string, number>();
  for (const t of tickets) {
    const source = sources.get(t.sourceId);
    if (!source || (unit !== 'TON' && unit !== 't' && unit !== 'CY')) {
      held.push({
        kind: 'scale',
        ticketId: t.id,
        label: t.ticketNumber,
        date: t.date,
        bidItemId: t.bidItemId,
        reasons: ['unit_not_convertible'],
      });
      continue;
    }
    const tons =
      source.statedMoisturePercent === null
        ? roundTo(t.netTons, WEIGHT_DECIMALS)
        : moistureCorrected(t.netTons, t.moisturePercent, source.statedMoisturePercent);
    tonsBySource.set(t.sourceId, addDecimals(tonsBySource.get(t.sourceId) ?? 0, tons, WEIGHT_DECIMALS));
    paidIds.push(t.id);
  }
  let total = 0;
  for (const [sourceId, tons] of tonsBySource) {
    const value = unit === 'CY' ? tonsToCubicYards(tons, sources.get(sourceId)!.factorUsed).payCy : tons;
    total = addDecimals(total, value);
  }
  return finish(total, precision, paidIds, held);
}

function finish(value: number, precision: Precision, paidIds: string[], held: TicketHold[]): TicketPay {
  const measuredQuantity = roundTo(value, precision.measuredDecimals);
  return { quantity: roundTo(measuredQuantity, precision.payDecimals), measuredQuantity, paidIds, held };
}
