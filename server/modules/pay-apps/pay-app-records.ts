import type { PayUnit } from '../../../src/shared/constants';
import { forceAccountPayLines } from '../../../src/shared/domain/provisions/force-account-pay';
import { precisionFor } from '../../../src/shared/domain/provisions/precision';
import { scaleTicketPay, truckTicketPay, type TicketHold } from '../../../src/shared/domain/provisions/ticket-pay';
import type { Executor } from '../../db/client';
import { AppError } from '../../lib/app-error';
import type { profilesByItem } from './pay-app-provisions.repository';
import * as records from './pay-app-records.repository';

type Item = { id: string; payUnit: string };
type Profiles = Awaited<ReturnType<typeof profilesByItem>>;

/** What the period's tickets pay: a quantity per ticket-measured item, the tickets taken and those held out. */
export type TicketQuantities = {
  byItem: Map<string, number>;
  truckIds: string[];
  scaleIds: string[];
  holds: TicketHold[];
};

/**
 * The pay quantity this period of every truck-measure and weight item, from its tickets dated up to the period's
 * end and not paid before (a ticket held last time and cleared since, such as a truck registered late, is paid
 * now). Those items are paid from tickets only: their tallies stay unbilled.
 */
export async function ticketQuantities(
  tx: Executor,
  projectId: string,
  periodEnd: string,
  items: readonly Item[],
  profiles: Profiles,
): Promise<TicketQuantities> {
  const of = (profile: string) => items.filter((i) => profiles.get(i.id)?.profile === profile);
  const truckItems = of('truck_measure');
  const scaleItems = of('weight');
  const result: TicketQuantities = { byItem: new Map(), truckIds: [], scaleIds: [], holds: [] };
  const precision = (item: Item) => precisionFor(item.payUnit as PayUnit, profiles.get(item.id)!.payDecimals);
  if (truckItems.length > 0) {
    const tickets = await records.unpaidTruckTickets(
      tx,
      projectId,
      truckItems.map((i) => i.id),
      periodEnd,
    );
    const register = new Map(
      (await records.projectTrucks(tx, projectId)).map((t) => {
        const id = t.label.toUpperCase();
        return [id, { id, bedVolumeCy: t.bedVolumeCy }];
      }),
    );
    for (const item of truckItems) {
      const mine = tickets.filter((t) => t.bidItemId === item.id);
      const pay = truckTicketPay(mine, register, item.payUnit as PayUnit, precision(item));
      result.byItem.set(item.id, pay.quantity);
      result.truckIds.push(...pay.paidIds);
      result.holds.push(...pay.held);
    }
  }
  if (scaleItems.length > 0) {
    const tickets = await records.unpaidScaleTickets(
      tx,
      projectId,
      scaleItems.map((i) => i.id),
      periodEnd,
    );
    const sources = new Map((await records.projectSources(tx, projectId)).map((s) => [s.id, s]));
    for (const item of scaleItems) {
      const mine = tickets.filter((t) => t.bidItemId === item.id);
      const pay = scaleTicketPay(mine, sources, item.payUnit as PayUnit, precision(item));
      result.byItem.set(item.id, pay.quantity);
      result.scaleIds.push(...pay.paidIds);
      result.holds.push(...pay.held);
    }
  }
  return result;
}

/** The force account lines of a new application: each change order's signed days not yet paid, after its previous. */
export async function forceAccountForPeriod(
  tx: Executor,
  projectId: string,
  periodEnd: string,
  previousAppId: string | undefined,
) {
  const previous = previousAppId ? await records.forceAccountLines(tx, previousAppId) : [];
  const sheets = await records.unpaidSignedSheets(tx, projectId, periodEnd);
  const orders = new Map((await records.projectChangeOrders(tx, projectId)).map((o) => [o.id, o]));
  const lines = forceAccountPayLines(
    new Map(previous.map((l) => [l.changeOrderId, l.amountToDateCents])),
    sheets,
    (id) => orders.get(id)?.number ?? 0,
  );
  return lines.map((l) => ({
    ...l,
    number: orders.get(l.changeOrderId)!.number,
    title: orders.get(l.changeOrderId)!.title,
  }));
}

/** Links the tickets and days a new application pays to it; a count short of the list means a concurrent change. */
export async function markPaid(
  tx: Executor,
  payAppId: string,
  tickets: TicketQuantities,
  sheetIds: string[],
): Promise<void> {
  const expected = tickets.truckIds.length + tickets.scaleIds.length + sheetIds.length;
  const marked =
    (await records.markTicketsPaid(tx, payAppId, tickets.truckIds, tickets.scaleIds)) +
    (await records.markSheetsPaid(tx, payAppId, sheetIds));
  if (marked !== expected) {
    throw new AppError(
      409,
      'RECORD_ALREADY_PAID',
      'A ticket or daily sheet of the period was paid while the pay application was compiled; try again.',
    );
  }
}
