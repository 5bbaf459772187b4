import { createRequire } from 'node:module';
import { SCHEDULE_TITLES } from '../../../src/shared/domain/pay-app-package';
import {
  formatMoney as dollars,
  formatNumber,
  formatPercentBps as percentText,
  formatQuantityNumber,
} from '../../../src/shared/format';
import type { PayAppDetail } from '../../../src/shared/schemas/pay-app';
import { appendices } from './pay-app-pdf-appendices';
import type { PayAppBackup } from './pay-app-backup';
import { drawTable, INK, RULE, sectionTitle, SPRUCE, STONE, type PdfColumn, type PdfDoc } from './pdf-table';

const require = createRequire(import.meta.url);
// .woff, not .woff2: pdfkit writes invisible text with woff2 (stack.md pitfall 10).
const FONT = require.resolve('@fontsource/work-sans/files/work-sans-latin-400-normal.woff');
const FONT_BOLD = require.resolve('@fontsource/work-sans/files/work-sans-latin-600-normal.woff');

export type PdfFacts = {
  projectName: string;
  contractNumber: string;
  location: string;
  bandOverBps: number;
  parties: { subcontractor: string; generalContractor: string; owner: string };
};

/** Lines whose quantity to date already passes the project's over-run band (variance flag on the document). */
export function beyondBand(app: PayAppDetail, bandOverBps: number) {
  return app.lines.filter(
    (l) => l.contractQuantity > 0 && l.toDateQuantity * 10_000 > l.contractQuantity * (10_000 + bandOverBps),
  );
}

const percentOrDash = (bps: number | null) => (bps === null ? '-' : percentText(bps));

/**
 * The pay application package as a PDF of our own layout, Work Sans embedded: page 1 the summary, the change
 * orders, the flags and the signatures; then the schedule of values, the quantities, deductions and adjustments,
 * and the field records (truck tickets, scale tickets, force account days) as appendices. Every figure comes from
 * `app.package` (payAppPackage) or the stored lines, the same as the screen and the CSV. Resolves with the bytes.
 */
export async function payAppPdf(app: PayAppDetail, f: PdfFacts, backup: PayAppBackup): Promise<Buffer> {
  // pdfkit loads with the first document, not at start (it is a large part of the start-up time).
  const { default: PDFDocument } = await import('pdfkit');
  const doc = new PDFDocument({
    size: 'LETTER',
    layout: 'landscape',
    margin: 36,
    bufferPages: true,
    info: { Title: `${f.projectName} pay application ${app.number}`, Author: 'Tallyard' },
  });
  doc.registerFont('body', FONT);
  doc.registerFont('bold', FONT_BOLD);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  header(doc, app, f);
  firstPage(doc, app, f);
  doc.addPage();
  schedule(doc, app);
  quantities(doc, app);
  adjustments(doc, app);
  appendices(doc, backup);
  footers(doc, app, f);
  doc.end();
  return done;
}

function header(doc: PdfDoc, app: PayAppDetail, f: PdfFacts) {
  const left = doc.page.margins.left;
  doc.rect(0, 0, doc.page.width, 6).fill(SPRUCE);
  const title = `Pay application No. ${app.number}`;
  doc.fillColor(INK).font('bold').fontSize(16).text(title, left, 22, { lineBreak: false });
  const titleWidth = doc.widthOfString(title);
  if (app.revision > 0)
    doc
      .font('body')
      .fontSize(10)
      .fillColor(STONE)
      .text(`revision ${app.revision}`, left + titleWidth + 10, 28, { lineBreak: false });
  doc.font('body').fontSize(10).fillColor(INK);
  doc.text('', left, 46);
  doc.text(
    `${f.projectName}${f.contractNumber ? `  -  contract ${f.contractNumber}` : ''}${f.location ? `  -  ${f.location}` : ''}`,
  );
  doc.text(
    `Period ${app.periodStart} to ${app.periodEnd}${app.isFinal ? '  (final)' : ''}   Status: ${app.status.replace('_', ' ')}`,
  );
  doc
    .fillColor(STONE)
    .text(
      `Subcontractor: ${f.parties.subcontractor}   General contractor: ${f.parties.generalContractor}   Owner: ${f.parties.owner}`,
    );
  doc.moveDown(0.8);
}

/** Summary lines (left), change order summary (right), quantity flags, signatures. */
function firstPage(doc: PdfDoc, app: PayAppDetail, f: PdfFacts) {
  const left = doc.page.margins.left;
  const width = doc.page.width - left - doc.page.margins.right;
  const top = doc.y;
  const pkg = app.package;
  doc.font('bold').fontSize(11).fillColor(INK).text('Application summary', left, top);
  doc.y += 4;
  for (const s of pkg.summary) {
    const strong = s.key === 'currentDue';
    const ruled = s.key === 'contractToDate' || s.key === 'earnedLessRetainage' || s.key === 'currentDue';
    const y = doc.y + (ruled ? 3 : 0);
    if (ruled)
      doc
        .moveTo(left, y - 2)
        .lineTo(left + 330, y - 2)
        .strokeColor(RULE)
        .lineWidth(0.5)
        .stroke();
    doc
      .font(strong ? 'bold' : 'body')
      .fontSize(strong ? 11 : 9)
      .fillColor(strong ? SPRUCE : INK);
    doc.text(s.label, left, y, { width: 220 });
    doc.text(dollars(s.amountCents), left + 220, y, { width: 110, align: 'right' });
    doc.y += 1.5;
  }
  doc
    .font('body')
    .fontSize(8)
    .fillColor(STONE)
    .text(`${percentOrDash(pkg.totals.percentBps)} of the scheduled value done and stored.`, left, doc.y + 2, {
      width: 330,
    });
  const leftBottom = doc.y;

  const cx = left + 380;
  const cw = width - 380;
  const co = pkg.changeOrders;
  doc.font('bold').fontSize(11).fillColor(INK).text('Change orders', cx, top, { width: cw });
  doc.y += 4;
  const coRows: [string, number][] = [
    ['Approved before the last application', co.beforeCents],
    ['Approved since the last application', co.sinceLastCents],
    [`Net change, ${co.approvedCount} approved to date`, co.netChangeCents],
  ];
  for (const [label, cents] of coRows) {
    const y = doc.y;
    const strong = label.startsWith('Net');
    doc
      .font(strong ? 'bold' : 'body')
      .fontSize(9)
      .fillColor(INK);
    doc.text(label, cx, y, { width: cw - 110 });
    doc.text(dollars(cents), cx + cw - 110, y, { width: 110, align: 'right' });
    doc.y += 1.5;
  }
  doc.y += 4;
  const shown = co.lines.slice(-10);
  if (co.lines.length === 0) {
    doc
      .font('body')
      .fontSize(8)
      .fillColor(STONE)
      .text('No change order approved before this application was compiled.', cx, doc.y, { width: cw });
  }
  if (co.lines.length > shown.length) {
    doc
      .font('body')
      .fontSize(7.5)
      .fillColor(STONE)
      .text(
        `${co.lines.length - shown.length} earlier change orders not listed; their amounts are in the lines above.`,
        cx,
        doc.y,
        { width: cw },
      );
  }
  for (const l of shown) {
    const y = doc.y;
    doc.font('body').fontSize(8).fillColor(INK);
    const fa = l.forceAccountCents ? ` (force account ${dollars(l.forceAccountCents)})` : '';
    doc.text(`CO ${l.number}  ${l.title}${fa}`, cx, y, { width: cw - 170 });
    const bottom = doc.y;
    doc.fillColor(STONE).text(l.approvedAt.slice(0, 10), cx + cw - 170, y, { width: 60 });
    doc.fillColor(INK).text(dollars(l.amountCents), cx + cw - 110, y, { width: 110, align: 'right' });
    doc.y = Math.max(bottom, doc.y) + 1;
  }
  doc.y = Math.max(doc.y, leftBottom) + 14;

  const flags = beyondBand(app, f.bandOverBps);
  doc.font('bold').fontSize(9).fillColor(INK).text('Quantity flags', left, doc.y, { width });
  doc
    .font('body')
    .fontSize(8)
    .fillColor(flags.length ? '#9a3b2e' : STONE);
  if (flags.length === 0)
    doc.text(`No item is past ${percentText(10_000 + f.bandOverBps)} of its contract quantity to date.`, { width });
  for (const l of flags) {
    doc.text(
      `Item ${l.itemNumber}: ${formatQuantityNumber(l.toDateQuantity, l.payUnit)} ${l.payUnit} to date is ${percentText(Math.round((l.toDateQuantity / l.contractQuantity) * 10_000))} of the contract quantity ${formatQuantityNumber(l.contractQuantity, l.payUnit)} (band +${percentText(f.bandOverBps)}).`,
      { width },
    );
  }

  doc.y += 16;
  if (doc.y > doc.page.height - 150) doc.addPage();
  const sigY = doc.y;
  const sigW = (width - 40) / 3;
  const signers: [string, string, string][] = [
    ['Subcontractor', f.parties.subcontractor, 'Submitted by'],
    [
      'General contractor',
      f.parties.generalContractor,
      app.certifiedBy ? `Certified by ${app.certifiedBy} on ${app.certifiedAt?.slice(0, 10)}` : 'Certified by',
    ],
    ['Owner', f.parties.owner, 'Received by'],
  ];
  signers.forEach(([role, company, caption], i) => {
    const x = left + i * (sigW + 20);
    doc.font('bold').fontSize(8.5).fillColor(INK).text(role, x, sigY, { width: sigW });
    doc.font('body').fontSize(8).fillColor(STONE).text(company, x, doc.y, { width: sigW });
    doc
      .moveTo(x, sigY + 48)
      .lineTo(x + sigW, sigY + 48)
      .strokeColor(INK)
      .stroke();
    doc.text(caption, x, sigY + 52, { width: sigW });
    doc.text('Signature and date', x, doc.y, { width: sigW });
  });
  doc
    .font('body')
    .fontSize(7)
    .fillColor(STONE)
    .text(
      "Quantities follow the contract's measurement provisions; payment follows the contract and the governing statute. Tallyard is not legal advice.",
      left,
      sigY + 84,
      { width },
    );
}

type ScheduleRow = PayAppDetail['package']['schedule'][number];

function schedule(doc: PdfDoc, app: PayAppDetail) {
  const T = SCHEDULE_TITLES;
  const money = (k: keyof typeof T) => (r: ScheduleRow) => dollars(r[k] as number);
  const cols: PdfColumn<ScheduleRow>[] = [
    { title: 'Item', w: 44, cell: (r) => r.itemNumber },
    { title: 'Description', w: 150, cell: (r) => r.description },
    { title: T.scheduledValueCents, w: 70, align: 'right', cell: money('scheduledValueCents') },
    { title: T.previousCents, w: 66, align: 'right', cell: money('previousCents') },
    { title: T.thisPeriodCents, w: 66, align: 'right', cell: money('thisPeriodCents') },
    { title: T.storedMaterialsCents, w: 62, align: 'right', cell: money('storedMaterialsCents') },
    { title: T.completedAndStoredCents, w: 72, align: 'right', cell: money('completedAndStoredCents') },
    { title: T.percentBps, w: 42, align: 'right', cell: (r) => percentOrDash(r.percentBps) },
    { title: T.balanceToFinishCents, w: 70, align: 'right', cell: money('balanceToFinishCents') },
    { title: T.retainageCents, w: 66, align: 'right', cell: money('retainageCents') },
  ];
  const t = app.package.totals;
  sectionTitle(
    doc,
    'Schedule of values',
    'Amounts to date on each bid item, with materials stored and not yet built in. Force account is paid on its signed days: on the allowance item its change order added, or on a line of its own after the items.',
  );
  drawTable(doc, cols, app.package.schedule, [
    'Total',
    '',
    dollars(t.scheduledValueCents),
    dollars(t.previousCents),
    dollars(t.thisPeriodCents),
    dollars(t.storedMaterialsCents),
    dollars(t.completedAndStoredCents),
    percentOrDash(t.percentBps),
    dollars(t.balanceToFinishCents),
    dollars(t.retainageCents),
  ]);
}

type Line = PayAppDetail['lines'][number];

function quantities(doc: PdfDoc, app: PayAppDetail) {
  const q = (k: 'contractQuantity' | 'previousQuantity' | 'thisPeriodQuantity' | 'toDateQuantity') => (l: Line) =>
    formatQuantityNumber(l[k], l.payUnit);
  const cols: PdfColumn<Line>[] = [
    { title: 'Item', w: 44, cell: (l) => l.itemNumber },
    { title: 'Description', w: 170, cell: (l) => l.description },
    { title: 'Unit', w: 32, cell: (l) => l.payUnit },
    { title: 'Unit price', w: 62, align: 'right', cell: (l) => dollars(l.unitPriceCents) },
    { title: 'Contract qty', w: 66, align: 'right', cell: q('contractQuantity') },
    { title: 'Qty before', w: 66, align: 'right', cell: q('previousQuantity') },
    { title: 'Qty this period', w: 66, align: 'right', cell: q('thisPeriodQuantity') },
    { title: 'Qty to date', w: 66, align: 'right', cell: q('toDateQuantity') },
    { title: 'Amount to date', w: 80, align: 'right', cell: (l) => dollars(l.amountToDateCents) },
    { title: 'Review', w: 56, cell: (l) => l.reviewStatus },
  ];
  sectionTitle(
    doc,
    'Quantities',
    "In each item's pay unit; amount to date = quantity to date at the unit price, rounded once to the cent. Force account days are not quantities: they are in the schedule of values.",
  );
  drawTable(doc, cols, app.lines);
  heldTickets(doc, app);
}

/** Tickets of truck-measure and weight items left out of the quantities, each with why (also in the appendices). */
function heldTickets(doc: PdfDoc, app: PayAppDetail) {
  if (app.ticketHolds.length === 0) return;
  type Hold = PayAppDetail['ticketHolds'][number];
  sectionTitle(
    doc,
    'Tickets held out',
    'Not in the quantities above until the reason is cleared; they are taken on the next application after that.',
  );
  const cols: PdfColumn<Hold>[] = [
    { title: 'Item', w: 60, cell: (h) => h.itemNumber },
    { title: 'Ticket', w: 90, cell: (h) => (h.kind === 'truck' ? `Truck ${h.label}` : `Scale ${h.label}`) },
    { title: 'Dated', w: 70, cell: (h) => h.date },
    { title: 'Reason', w: 500, cell: (h) => h.reasons.join('; ') },
  ];
  drawTable(doc, cols, app.ticketHolds);
}

function adjustments(doc: PdfDoc, app: PayAppDetail) {
  type Adj = PayAppDetail['adjustments'][number];
  sectionTitle(doc, 'Deductions and adjustments to date', 'On their own lines, apart from the item quantities.');
  if (app.adjustments.length === 0) {
    doc
      .font('body')
      .fontSize(8)
      .fillColor(STONE)
      .text('None dated up to the end of this period.', doc.page.margins.left, doc.y);
    doc.y += 12;
    return;
  }
  const cols: PdfColumn<Adj>[] = [
    { title: 'Dated', w: 70, cell: (a) => a.appliesOn },
    { title: 'Kind', w: 110, cell: (a) => a.kind.replace(/_/g, ' ') },
    { title: 'Description', w: 360, cell: (a) => a.description },
    { title: 'Amount', w: 90, align: 'right', cell: (a) => dollars(a.amountCents) },
  ];
  drawTable(doc, cols, app.adjustments, ['Total', '', '', dollars(app.adjustmentsCents)]);
}

/** Page numbers and the application's name at the foot of every page. */
function footers(doc: PdfDoc, app: PayAppDetail, f: PdfFacts) {
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const left = doc.page.margins.left;
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc
      .font('body')
      .fontSize(7)
      .fillColor(STONE)
      .text(
        `${f.projectName} - pay application No. ${app.number}, period ending ${app.periodEnd} - page ${formatNumber(i + 1, 0)} of ${formatNumber(range.count, 0)}`,
        left,
        doc.page.height - 24,
        { width: doc.page.width - left * 2, align: 'center', lineBreak: false },
      );
    doc.page.margins.bottom = bottom;
  }
}
