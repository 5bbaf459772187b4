import type { PayAppDetail } from '../../../src/shared/schemas/pay-app';
import { sumCents } from '../../../src/shared/domain/money';
import { formatMoneyPlain as decimal, formatQuantityPlain as num } from '../../../src/shared/format';

/**
 * A text cell a spreadsheet could read as a formula (= + - @, tab, carriage return) gets a leading apostrophe
 * (OWASP, CSV injection). Numbers are written by us in plain decimal form and are not text cells.
 */
export function neutralise(text: string): string {
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

const quote = (cell: string) => (/[",\r\n]/.test(cell) ? `"${cell.replace(/"/g, '""')}"` : cell);

export const CSV_HEADER = [
  'item_number', 'description', 'pay_unit', 'unit_price', 'contract_quantity', 'previous_quantity', 'this_period_quantity',
  'to_date_quantity', 'previous_amount', 'this_period_amount', 'amount_to_date', 'retainage', 'review_status',
];

/** One row per line, then the totals and the payment summary rows; money in dollars with two decimals. */
export function payAppCsv(app: PayAppDetail): string {
  const rows: string[][] = [CSV_HEADER];
  for (const l of app.lines) {
    rows.push([
      neutralise(l.itemNumber), neutralise(l.description), l.payUnit, decimal(l.unitPriceCents), num(l.contractQuantity), num(l.previousQuantity),
      num(l.thisPeriodQuantity), num(l.toDateQuantity), decimal(l.previousAmountCents), decimal(l.thisPeriodAmountCents), decimal(l.amountToDateCents),
      decimal(l.retainageCents), l.reviewStatus,
    ]);
  }
  const previous = sumCents(app.lines.map((l) => l.previousAmountCents));
  const blank = (label: string, amount: string) => [label, '', '', '', '', '', '', '', '', '', amount, '', ''];
  rows.push(['TOTAL', `Pay application ${app.number} revision ${app.revision}`, '', '', '', '', '', '', decimal(previous), decimal(app.thisPeriodCents), decimal(app.earnedToDateCents), decimal(app.retainageCents), app.status]);
  rows.push(blank('EARNED_TO_DATE', decimal(app.earnedToDateCents)));
  rows.push(blank('LESS_RETAINAGE', decimal(app.retainageCents)));
  rows.push(blank('LESS_PREVIOUS_CERTIFIED', decimal(app.previousCertifiedCents)));
  rows.push(blank('CURRENT_DUE', decimal(app.currentDueCents)));
  return rows.map((r) => r.map(quote).join(',')).join('\r\n') + '\r\n';
}
