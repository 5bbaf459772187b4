import { DomainError } from '../domain-error';
import { sumCents, type Cents } from '../money';
import type { PayAppLineInput } from '../pay-app';
import { roundTo } from '../rounding';

/** A signed daily sheet not yet paid. */
export interface SignedDay {
  id: string;
  changeOrderId: string;
  totalCents: Cents;
}

/** One change order's force account on a pay application. */
export interface ForceAccountPayLine {
  changeOrderId: string;
  /** Paid on certified applications before (the previous application's amount to date). */
  previousCents: Cents;
  /** The days newly paid: sum of their totals. */
  thisPeriodCents: Cents;
  /** Days newly paid. */
  days: number;
  sheetIds: string[];
}

/**
 * The force account lines of a pay application (MoDOT EPG 109.5: force account work is paid on the signed daily
 * records under the change order that authorised it), one per change order with days paid before or now, in the
 * order of `orderOf` (the change order's number). A day counts once: the caller passes only signed days not yet
 * paid. Pure.
 */
export function forceAccountPayLines(
  previousByOrder: ReadonlyMap<string, Cents>,
  days: readonly SignedDay[],
  orderOf: (changeOrderId: string) => number,
): ForceAccountPayLine[] {
  const lines = new Map<string, ForceAccountPayLine>();
  const lineOf = (id: string) => {
    let line = lines.get(id);
    if (!line) {
      line = {
        changeOrderId: id,
        previousCents: previousByOrder.get(id) ?? 0,
        thisPeriodCents: 0,
        days: 0,
        sheetIds: [],
      };
      lines.set(id, line);
    }
    return line;
  };
  for (const id of previousByOrder.keys()) lineOf(id);
  days.forEach((day, i) => {
    if (!Number.isSafeInteger(day.totalCents) || day.totalCents < 0) {
      throw new DomainError('INVALID_NUMBER', 'A daily sheet total is whole cents, 0 or more', [
        'days',
        i,
        'totalCents',
      ]);
    }
    const line = lineOf(day.changeOrderId);
    line.thisPeriodCents = sumCents([line.thisPeriodCents, day.totalCents]);
    line.days += 1;
    line.sheetIds.push(day.id);
  });
  return [...lines.values()].sort((a, b) => orderOf(a.changeOrderId) - orderOf(b.changeOrderId));
}

/**
 * A force account line in the pay application arithmetic (payApplication): priced at one cent a unit with
 * quantities in cents, so amounts are the cents themselves, exactly; its scheduled value is its amount to date
 * (time-and-materials work is valued as it is done, common practice), so it is 100 % done and leaves nothing to
 * finish (unless it draws on an allowance item, whose value it then counts against). Retainage is held on it like any other line (common practice; the contract may say otherwise).
 */
export function forceAccountAsPayLine(
  line: Pick<ForceAccountPayLine, 'previousCents' | 'thisPeriodCents'>,
  drawsOnAllowance = false,
): PayAppLineInput {
  const toDate = sumCents([line.previousCents, line.thisPeriodCents]);
  return {
    unitPriceCents: 1,
    // Drawing on an allowance item, the contract value is already the item's: none of its own.
    contractQuantity: drawsOnAllowance ? 0 : toDate,
    previousQuantity: line.previousCents,
    thisPeriodQuantity: line.thisPeriodCents,
    previousAmountCents: line.previousCents,
  };
}

/**
 * How much of an allowance item the force account days drawn on it come to, in the item's pay unit: their amount
 * over the item's unit price, to the stored 4 decimals ($576.00 drawn on a 1 LS allowance at $1,500.00 is 0.384 LS).
 * The quantity watch shows it so an allowance runs against its band like any item. Pure.
 */
export function allowanceDrawnQuantity(drawnCents: Cents, unitPriceCents: Cents): number {
  if (!Number.isSafeInteger(drawnCents) || drawnCents < 0) {
    throw new DomainError('INVALID_NUMBER', 'An amount drawn is whole cents, 0 or more', ['drawnCents']);
  }
  if (!Number.isSafeInteger(unitPriceCents) || unitPriceCents <= 0) return 0;
  return roundTo(drawnCents / unitPriceCents, 4);
}
