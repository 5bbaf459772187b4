import { formatMoneyPlain as decimal, formatQuantityPlain as num } from '../../../src/shared/format';
import type { PayAppDetail } from '../../../src/shared/schemas/pay-app';

/**
 * A text cell a spreadsheet could read as a formula (= + - @, tab, carriage return) gets a leading apostrophe
 * (OWASP, CSV injection). Numbers are written by us in plain decimal form and are not text cells.
 */
export function neutralise(text: string): string {
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

const quote = (cell: string) => (/[",\r\n]/.test(cell) ? `"${cell.replace(/"/g, '""')}"` : cell);

export const CSV_HEADER = [
  'item_number',
  'description',
  'pay_unit',
  'unit_price',
  'contract_quantity',
  'previous_quantity',
  'this_period_quantity',
  'to_date_quantity',
  'previous_amount',
  'this_period_amount',
  'amount_to_date',
  'retainage',
  'review_status',
  'scheduled_value',
  'materials_stored',
  'completed_and_stored',
  'percent_done',
  'balance_to_finish',
];

const percent = (bps: number | null) => (bps === null ? '' : (bps / 100).toFixed(2));

/**
 * One row per line (quantities, then the schedule of values columns), the totals row, the summary lines (one row
 * each, the amount under `amount_to_date`, the label under `description`), then one row per change order counted
 * and the change order totals. Money in dollars with two decimals; every figure from `app.package`.
 */
export function payAppCsv(app: PayAppDetail): string {
  const rows: string[][] = [CSV_HEADER];
  const pkg = app.package;
  app.lines.forEach((l, i) => {
    const s = pkg.schedule[i]!;
    rows.push([
      neutralise(l.itemNumber),
      neutralise(l.description),
      l.payUnit,
      decimal(l.unitPriceCents),
      num(l.contractQuantity),
      num(l.previousQuantity),
      num(l.thisPeriodQuantity),
      num(l.toDateQuantity),
      decimal(l.previousAmountCents),
      decimal(l.thisPeriodAmountCents),
      decimal(l.amountToDateCents),
      decimal(l.retainageCents),
      l.reviewStatus,
      decimal(s.scheduledValueCents),
      decimal(s.storedMaterialsCents),
      decimal(s.completedAndStoredCents),
      percent(s.percentBps),
      decimal(s.balanceToFinishCents),
    ]);
  });
  // Force account lines follow the items in the schedule, one per change order, in the same order.
  // (Days drawing on an allowance item are in that item's schedule columns above.)
  pkg.schedule.slice(app.lines.length).forEach((s) => {
    rows.push([
      neutralise(s.itemNumber),
      neutralise(s.description),
      '',
      '',
      '',
      '',
      '',
      '',
      decimal(s.previousCents),
      decimal(s.thisPeriodCents),
      decimal(s.completedAndStoredCents),
      decimal(s.retainageCents),
      'signed',
      decimal(s.scheduledValueCents),
      decimal(s.storedMaterialsCents),
      decimal(s.completedAndStoredCents),
      percent(s.percentBps),
      decimal(s.balanceToFinishCents),
    ]);
  });
  const t = pkg.totals;
  const blank = (label: string, description: string, amount: string) => [
    label,
    description,
    '',
    '',
    '',
    '',
    '',
    '',
    '',
    '',
    amount,
    '',
    '',
    '',
    '',
    '',
    '',
    '',
  ];
  rows.push([
    'TOTAL',
    `Pay application ${app.number} revision ${app.revision}`,
    '',
    '',
    '',
    '',
    '',
    '',
    decimal(t.previousCents),
    decimal(t.thisPeriodCents),
    decimal(app.earnedToDateCents),
    decimal(t.retainageCents),
    app.status,
    decimal(t.scheduledValueCents),
    decimal(t.storedMaterialsCents),
    decimal(t.completedAndStoredCents),
    percent(t.percentBps),
    decimal(t.balanceToFinishCents),
  ]);
  for (const s of pkg.summary) rows.push(blank(`SUMMARY_${snake(s.key)}`, s.label, decimal(s.amountCents)));
  for (const co of pkg.changeOrders.lines)
    rows.push(
      blank(
        `CHANGE_ORDER_${co.number}`,
        neutralise(
          `${co.title} (approved ${co.approvedAt.slice(0, 10)}${co.forceAccountCents ? `; force account ${decimal(co.forceAccountCents)}` : ''})`,
        ),
        decimal(co.amountCents),
      ),
    );
  rows.push(
    blank('CHANGE_ORDERS_BEFORE_LAST', 'Approved before the last application', decimal(pkg.changeOrders.beforeCents)),
  );
  rows.push(
    blank('CHANGE_ORDERS_SINCE_LAST', 'Approved since the last application', decimal(pkg.changeOrders.sinceLastCents)),
  );
  rows.push(
    blank(
      'CHANGE_ORDERS_NET',
      `Net change, ${pkg.changeOrders.approvedCount} approved to date`,
      decimal(pkg.changeOrders.netChangeCents),
    ),
  );
  return rows.map((r) => r.map(quote).join(',')).join('\r\n') + '\r\n';
}

const snake = (key: string) => key.replace(/[A-Z]/g, (c) => `_${c}`).toUpperCase();
