import { sumCents } from '../../../src/shared/domain/money';
import { addDecimals } from '../../../src/shared/domain/rounding';
import { formatMoney as dollars, formatNumber } from '../../../src/shared/format';
import type { PayAppBackup } from './pay-app-backup';
import { drawTable, sectionTitle, STONE, type PdfColumn, type PdfDoc } from './pdf-table';

const cy = (n: number) => formatNumber(n, 2);
const tons = (n: number) => formatNumber(n, 2);
const count = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;
const sum = (values: number[]) => values.reduce((s, v) => addDecimals(s, v, 4), 0);

function none(doc: PdfDoc, text: string) {
  doc.font('body').fontSize(8).fillColor(STONE).text(text, doc.page.margins.left, doc.y);
  doc.y += 14;
}

/** Appendices A-C: the truck tickets, scale tickets and force account days the application paid or held out. */
export function appendices(doc: PdfDoc, backup: PayAppBackup): void {
  doc.addPage();
  truckTickets(doc, backup.truckTickets);
  scaleTickets(doc, backup.scaleTickets);
  dailySheets(doc, backup.dailySheets);
}

function truckTickets(doc: PdfDoc, rows: PayAppBackup['truckTickets']) {
  sectionTitle(
    doc,
    'Appendix A - Truck tickets',
    "Loads paid on this application (the checker's volume, or the truck's measured bed when none was written) and loads held out with the reason; the total counts paid loads only.",
  );
  if (rows.length === 0) return none(doc, 'No truck ticket paid or held on this application.');
  const paid = rows.filter((r) => r.held === null);
  type R = (typeof rows)[number];
  const cols: PdfColumn<R>[] = [
    { title: 'Delivered', w: 58, cell: (r) => r.deliveredOn },
    { title: 'Item', w: 40, cell: (r) => r.itemNumber },
    { title: 'Truck', w: 44, cell: (r) => r.truckLabel },
    { title: 'Material', w: 90, cell: (r) => r.material },
    { title: 'Source', w: 80, cell: (r) => r.source },
    { title: 'Loaded at', w: 90, cell: (r) => r.loadedAt },
    { title: 'Delivered to', w: 90, cell: (r) => r.deliveredTo },
    { title: 'Checkers', w: 52, cell: (r) => `${r.loadCheckerInitials} / ${r.deliveryCheckerInitials}` },
    { title: 'CY', w: 50, align: 'right', cell: (r) => cy(r.volumeCy) },
    { title: 'Paid or held', w: 126, cell: (r) => (r.held === null ? 'Paid' : `Held: ${r.held}`) },
  ];
  drawTable(doc, cols, rows, [
    count(paid.length, 'load'),
    '',
    '',
    '',
    '',
    '',
    '',
    '',
    cy(sum(paid.map((r) => r.volumeCy))),
    '',
  ]);
}

function scaleTickets(doc: PdfDoc, rows: PayAppBackup['scaleTickets']) {
  sectionTitle(
    doc,
    'Appendix B - Scale tickets',
    "Weighed loads paid on this application (and any held out, with the reason); pay tons after any moisture correction, volume with the source's factor.",
  );
  if (rows.length === 0) return none(doc, 'No scale ticket paid or held on this application.');
  const paid = rows.filter((r) => r.held === null);
  type R = (typeof rows)[number];
  const cols: PdfColumn<R>[] = [
    { title: 'Ticket', w: 56, cell: (r) => r.ticketNumber },
    { title: 'Weighed', w: 58, cell: (r) => r.weighedOn },
    { title: 'Item', w: 40, cell: (r) => r.itemNumber },
    { title: 'Material', w: 70, cell: (r) => r.material },
    { title: 'Source', w: 70, cell: (r) => r.sourceName },
    { title: 'Gross t', w: 54, align: 'right', cell: (r) => tons(r.grossTons) },
    { title: 'Tare t', w: 54, align: 'right', cell: (r) => tons(r.tareTons) },
    { title: 'Net t', w: 54, align: 'right', cell: (r) => tons(r.netTons) },
    {
      title: 'Moisture',
      w: 50,
      align: 'right',
      cell: (r) => (r.moisturePercent === null ? '' : `${r.moisturePercent} %`),
    },
    { title: 'Pay t', w: 54, align: 'right', cell: (r) => tons(r.payTons) },
    { title: 'CY', w: 54, align: 'right', cell: (r) => cy(r.computedCy) },
    { title: 'Checkers', w: 60, cell: (r) => `${r.scaleCheckerInitials} / ${r.deliveryCheckerInitials}` },
    { title: 'Paid', w: 46, cell: (r) => (r.held === null ? 'Paid' : `Held: ${r.held}`) },
  ];
  drawTable(doc, cols, rows, [
    count(paid.length, 'ticket'),
    '',
    '',
    '',
    '',
    tons(sum(paid.map((r) => r.grossTons))),
    tons(sum(paid.map((r) => r.tareTons))),
    tons(sum(paid.map((r) => r.netTons))),
    '',
    tons(sum(paid.map((r) => r.payTons))),
    cy(sum(paid.map((r) => r.computedCy))),
    '',
    '',
  ]);
}

function dailySheets(doc: PdfDoc, rows: PayAppBackup['dailySheets']) {
  sectionTitle(
    doc,
    'Appendix C - Force account days',
    'Days paid on this application (signed by both sides), each group with the markup the contract sets; they make the force account lines of the schedule of values.',
  );
  if (rows.length === 0) return none(doc, 'No force account day paid on this application.');
  type R = (typeof rows)[number];
  const signed = (r: R) =>
    r.complete
      ? 'both sides'
      : r.contractorSignedAt
        ? 'subcontractor only'
        : r.gcSignedAt
          ? 'contractor only'
          : 'not signed';
  const cols: PdfColumn<R>[] = [
    { title: 'Worked', w: 58, cell: (r) => r.workedOn },
    { title: 'Change order', w: 56, cell: (r) => (r.changeOrderNumber === null ? '' : `CO ${r.changeOrderNumber}`) },
    { title: 'Description', w: 200, cell: (r) => r.description },
    { title: 'Labor', w: 72, align: 'right', cell: (r) => dollars(r.totals.labor.totalCents) },
    { title: 'Equipment', w: 72, align: 'right', cell: (r) => dollars(r.totals.equipment.totalCents) },
    { title: 'Materials', w: 72, align: 'right', cell: (r) => dollars(r.totals.materials.totalCents) },
    { title: 'Day total', w: 80, align: 'right', cell: (r) => dollars(r.totalCents) },
    { title: 'Signed by', w: 110, cell: signed },
  ];
  const total = (pick: (r: R) => number) => dollars(sumCents(rows.map(pick)));
  drawTable(doc, cols, rows, [
    count(rows.length, 'day'),
    '',
    '',
    total((r) => r.totals.labor.totalCents),
    total((r) => r.totals.equipment.totalCents),
    total((r) => r.totals.materials.totalCents),
    total((r) => r.totalCents),
    '',
  ]);
}
