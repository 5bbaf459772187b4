import { BID_ITEM_CSV_COLUMNS } from '@/shared/schemas/bid-item';

/** Invented example rows showing each column's expected form (unit_price in dollars, major yes/no). */
const EXAMPLE_ROWS: readonly (readonly string[])[] = [
  ['110', 'Clearing and grubbing', 'LS', 'bank', '18500.00', '1', 'no', 'manual'],
  ['210', 'Unclassified excavation', 'CY', 'bank', '9.40', '42000', 'yes', 'end-area'],
  ['230', 'Embankment in place', 'CY', 'compacted', '6.85', '31500', 'yes', 'end-area'],
  ['610', 'Trench excavation for 18 in storm pipe', 'LF', 'bank', '27.50', '1240', 'no', 'trench'],
];

function csvCell(value: string): string {
  return /[",\n]/.test(value) ? `"${value.replace(/"/g, '""')}"` : value;
}

/** The bid schedule template: our header row and a few example rows, CRLF line ends. */
export function bidScheduleTemplateCsv(): string {
  return [BID_ITEM_CSV_COLUMNS, ...EXAMPLE_ROWS].map((row) => row.map(csvCell).join(',')).join('\r\n') + '\r\n';
}

/** Offers the template as a file download, generated in the browser. */
export function downloadBidScheduleTemplate(): void {
  const blob = new Blob([bidScheduleTemplateCsv()], { type: 'text/csv;charset=utf-8' });
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = 'tallyard-bid-schedule-template.csv';
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 0);
}
