import { createRequire } from 'node:module';
import type { PayAppDetail } from '../../../src/shared/schemas/pay-app';
import { formatMoney as dollars, formatPercentBps as percentText, formatQuantityNumber } from '../../../src/shared/format';

const require = createRequire(import.meta.url);
// .woff, not .woff2: pdfkit writes invisible text with woff2 (stack.md pitfall 10).
const FONT = require.resolve('@fontsource/work-sans/files/work-sans-latin-400-normal.woff');
const FONT_BOLD = require.resolve('@fontsource/work-sans/files/work-sans-latin-600-normal.woff');

export type PdfFacts = { projectName: string; contractNumber: string; location: string; bandOverBps: number; parties: { subcontractor: string; generalContractor: string; owner: string } };

const SPRUCE = '#2f6b4f';
const STONE = '#6b716d';
const INK = '#1f2a24';
const COLS = [
  { key: 'item', title: 'Item', w: 44, align: 'left' },
  { key: 'desc', title: 'Description', w: 150, align: 'left' },
  { key: 'unit', title: 'Unit', w: 30, align: 'left' },
  { key: 'price', title: 'Unit price', w: 56, align: 'right' },
  { key: 'contract', title: 'Contract qty', w: 62, align: 'right' },
  { key: 'prev', title: 'Previous', w: 60, align: 'right' },
  { key: 'this', title: 'This period', w: 60, align: 'right' },
  { key: 'todate', title: 'To date', w: 62, align: 'right' },
  { key: 'amount', title: 'Amount to date', w: 78, align: 'right' },
  { key: 'ret', title: 'Retainage', w: 62, align: 'right' },
  { key: 'review', title: 'Review', w: 48, align: 'left' },
] as const;

/** Lines whose quantity to date already passes the project's over-run band (variance flag on the document). */
export function beyondBand(app: PayAppDetail, bandOverBps: number) {
  return app.lines.filter((l) => l.contractQuantity > 0 && l.toDateQuantity * 10_000 > l.contractQuantity * (10_000 + bandOverBps));
}

/** The pay application as a PDF of our own layout, Work Sans embedded; resolves with the bytes. */
export async function payAppPdf(app: PayAppDetail, f: PdfFacts): Promise<Buffer> {
  // pdfkit loads with the first document, not at start (it is a large part of the start-up time).
  const { default: PDFDocument } = await import('pdfkit');
  const doc = new PDFDocument({ size: 'LETTER', layout: 'landscape', margin: 36, info: { Title: `${f.projectName} pay application ${app.number}`, Author: 'Tallyard' } });
  doc.registerFont('body', FONT);
  doc.registerFont('bold', FONT_BOLD);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const left = doc.page.margins.left;
  const width = doc.page.width - left - doc.page.margins.right;

  doc.rect(0, 0, doc.page.width, 6).fill(SPRUCE);
  const title = `Pay application No. ${app.number}`;
  doc.fillColor(INK).font('bold').fontSize(16).text(title, left, 22, { lineBreak: false });
  const titleWidth = doc.widthOfString(title);
  if (app.revision > 0) doc.font('body').fontSize(10).fillColor(STONE).text(`revision ${app.revision}`, left + titleWidth + 10, 28, { lineBreak: false });
  doc.font('body').fontSize(10).fillColor(INK);
  doc.text('', left, 46);
  doc.text(`${f.projectName}${f.contractNumber ? `  -  contract ${f.contractNumber}` : ''}${f.location ? `  -  ${f.location}` : ''}`);
  doc.text(`Period ${app.periodStart} to ${app.periodEnd}${app.isFinal ? '  (final)' : ''}   Status: ${app.status.replace('_', ' ')}`);
  doc.fillColor(STONE).text(`Subcontractor: ${f.parties.subcontractor}   General contractor: ${f.parties.generalContractor}   Owner: ${f.parties.owner}`);
  doc.moveDown(0.8);

  const header = () => {
    let x = left;
    const y = doc.y;
    doc.font('bold').fontSize(7.5).fillColor(STONE);
    for (const c of COLS) {
      doc.text(c.title, x, y, { width: c.w - (c.align === 'right' ? 10 : 4), align: c.align });
      x += c.w;
    }
    doc.moveTo(left, doc.y + 2).lineTo(left + width, doc.y + 2).strokeColor('#c9cdc9').lineWidth(0.5).stroke();
    doc.y += 5;
  };
  header();
  for (const l of app.lines) {
    if (doc.y > doc.page.height - 80) {
      doc.addPage();
      header();
    }
    const cells: Record<(typeof COLS)[number]['key'], string> = {
      item: l.itemNumber, desc: l.description, unit: l.payUnit, price: dollars(l.unitPriceCents), contract: formatQuantityNumber(l.contractQuantity, l.payUnit),
      prev: formatQuantityNumber(l.previousQuantity, l.payUnit), this: formatQuantityNumber(l.thisPeriodQuantity, l.payUnit), todate: formatQuantityNumber(l.toDateQuantity, l.payUnit),
      amount: dollars(l.amountToDateCents), ret: dollars(l.retainageCents), review: l.reviewStatus,
    };
    const y = doc.y;
    let x = left;
    let bottom = y;
    doc.font('body').fontSize(8).fillColor(INK);
    for (const c of COLS) {
      doc.text(cells[c.key], x, y, { width: c.w - (c.align === 'right' ? 10 : 4), align: c.align });
      bottom = Math.max(bottom, doc.y);
      x += c.w;
    }
    doc.y = bottom + 3;
  }
  doc.moveTo(left, doc.y).lineTo(left + width, doc.y).strokeColor('#c9cdc9').stroke();
  doc.y += 8;
  if (doc.y > doc.page.height - 230) doc.addPage();

  const totalsTop = doc.y;
  const rows: [string, string][] = [
    ['Contract sum', dollars(app.contractSumCents)],
    ['Work this period', dollars(app.thisPeriodCents)],
    ['Earned to date', dollars(app.earnedToDateCents)],
    [`Retainage (${percentText(app.retainageBps)})`, dollars(app.retainageCents)],
    ['Earned less retainage', dollars(app.earnedToDateCents - app.retainageCents)],
    ['Less previous certified', dollars(app.previousCertifiedCents)],
    ['Current due', dollars(app.currentDueCents)],
  ];
  const tx = left + width - 260;
  for (const [label, value] of rows) {
    const last = label === 'Current due';
    doc.font(last ? 'bold' : 'body').fontSize(last ? 11 : 9).fillColor(last ? SPRUCE : INK);
    const y = doc.y;
    doc.text(label, tx, y, { width: 150 });
    doc.text(value, tx + 150, y, { width: 110, align: 'right' });
  }
  doc.font('body').fontSize(8).fillColor(STONE).text(`Complete to date: ${percentText(app.percentCompleteBps)}`, tx, doc.y + 2);

  const flags = beyondBand(app, f.bandOverBps);
  doc.y = totalsTop;
  doc.font('bold').fontSize(9).fillColor(INK).text('Quantity flags', left, doc.y, { width: 360 });
  doc.font('body').fontSize(8).fillColor(flags.length ? '#9a3b2e' : STONE);
  if (flags.length === 0) doc.text(`No item is past ${percentText(10_000 + f.bandOverBps)} of its contract quantity to date.`, { width: 360 });
  for (const l of flags) {
    doc.text(`Item ${l.itemNumber}: ${formatQuantityNumber(l.toDateQuantity, l.payUnit)} ${l.payUnit} to date is ${percentText(Math.round((l.toDateQuantity / l.contractQuantity) * 10_000))} of the contract quantity ${formatQuantityNumber(l.contractQuantity, l.payUnit)} (band +${percentText(f.bandOverBps)}).`, { width: 360 });
  }

  doc.y = Math.max(doc.y, totalsTop + 120) + 16;
  const sigY = doc.y;
  const sigW = (width - 40) / 3;
  const signers: [string, string, string][] = [
    ['Subcontractor', f.parties.subcontractor, 'Submitted by'],
    ['General contractor', f.parties.generalContractor, app.certifiedBy ? `Certified by ${app.certifiedBy} on ${app.certifiedAt?.slice(0, 10)}` : 'Certified by'],
    ['Owner', f.parties.owner, 'Received by'],
  ];
  signers.forEach(([role, company, caption], i) => {
    const x = left + i * (sigW + 20);
    doc.font('bold').fontSize(8.5).fillColor(INK).text(role, x, sigY, { width: sigW });
    doc.font('body').fontSize(8).fillColor(STONE).text(company, x, doc.y, { width: sigW });
    doc.moveTo(x, sigY + 48).lineTo(x + sigW, sigY + 48).strokeColor(INK).stroke();
    doc.text(caption, x, sigY + 52, { width: sigW });
    doc.text('Signature and date', x, doc.y, { width: sigW });
  });
  doc.font('body').fontSize(7).fillColor(STONE).text('Quantities follow the contract\'s measurement provisions; payment follows the contract and the governing statute. Tallyard is not legal advice.', left, sigY + 84, { width });
  doc.end();
  return done;
}
