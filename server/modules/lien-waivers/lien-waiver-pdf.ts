import { createRequire } from 'node:module';
import type { LienWaiverKind } from '../../../src/shared/constants';
import {
  exceptionsSentence,
  LIEN_WAIVER_TITLES,
  statutoryNotice,
  waiverBody,
} from '../../../src/shared/domain/lien-waiver-text';
import { sumCents } from '../../../src/shared/domain/money';
import type { WaiverExceptionView } from '../../../src/shared/schemas/payment';
import { formatMoney as formatCentsPlain } from '../../../src/shared/format';

const require = createRequire(import.meta.url);
// .woff, not .woff2: pdfkit writes invisible text with woff2 (stack.md pitfall 10).
const FONT = require.resolve('@fontsource/work-sans/files/work-sans-latin-400-normal.woff');
const FONT_BOLD = require.resolve('@fontsource/work-sans/files/work-sans-latin-600-normal.woff');

export type WaiverPdfInput = {
  kind: LienWaiverKind;
  state: string;
  project: string;
  location: string;
  claimant: string;
  customer: string;
  owner: string;
  payAppNumber: number;
  amountCents: number;
  throughDate: string;
  signedName: string;
  signedByEmail: string;
  signedAt: Date;
  paymentRef: string | null;
  exceptions: readonly WaiverExceptionView[];
};

const EXCEPTION_LABELS: Record<WaiverExceptionView['kind'], string> = {
  retainage_held: 'Retainage held',
  disputed: 'Disputed',
  change_order_unpaid: 'Change order',
  signer_added: 'Added by signer',
};

/** The exceptions as a table (kind, description, amount) under the sentence that keeps them out of the release. */
function printExceptions(doc: PDFKit.PDFDocument, exceptions: readonly WaiverExceptionView[]) {
  const total = formatCentsPlain(sumCents(exceptions.map((e) => e.amountCents)));
  doc
    .moveDown(1)
    .font('bold')
    .fontSize(10)
    .fillColor('#1f2a24')
    .text(exceptionsSentence(exceptions.length, total), 60, doc.y, { width: 490 });
  if (exceptions.length === 0) return;
  doc.moveDown(0.5);
  for (const e of exceptions) {
    const y = doc.y;
    doc.font('bold').fontSize(9.5).text(EXCEPTION_LABELS[e.kind], 60, y, { width: 100 });
    doc.font('body').text(e.description, 165, y, { width: 295 });
    const bottom = doc.y;
    doc.text(formatCentsPlain(e.amountCents), 465, y, { width: 85, align: 'right' });
    doc.y = Math.max(bottom, doc.y);
    doc.moveDown(0.3);
  }
  const y = doc.y;
  doc.moveTo(165, y).lineTo(550, y).strokeColor('#dedad2').stroke();
  doc.moveDown(0.3);
  const ty = doc.y;
  doc.font('bold').text('Excepted in all', 165, ty, { width: 295 });
  doc.text(total, 465, ty, { width: 85, align: 'right' });
}

/** Tallyard's own waiver template as a one-page PDF (Work Sans), signed by the typed name. */
export async function renderWaiverPdf(w: WaiverPdfInput): Promise<Buffer> {
  // pdfkit loads with the first document, not at start (it is a large part of the start-up time).
  const { default: PDFDocument } = await import('pdfkit');
  const doc = new PDFDocument({
    size: 'LETTER',
    margin: 60,
    info: { Title: `${LIEN_WAIVER_TITLES[w.kind]}, ${w.project}`, Author: 'Tallyard' },
  });
  doc.registerFont('body', FONT);
  doc.registerFont('bold', FONT_BOLD);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));
  const amount = formatCentsPlain(w.amountCents);

  doc.font('bold').fontSize(17).fillColor('#1f2a24').text(LIEN_WAIVER_TITLES[w.kind]);
  doc
    .moveDown(0.3)
    .font('body')
    .fontSize(9)
    .fillColor('#6b6459')
    .text(`Pay application ${w.payAppNumber} · ${w.project}${w.location ? `, ${w.location}` : ''}`);
  doc.moveDown(1).fontSize(10).fillColor('#1f2a24');
  const rows: [string, string][] = [
    ['Claimant', w.claimant],
    ['Customer', w.customer],
    ['Owner', w.owner],
    ['Job', w.project],
    ['Amount', amount],
    ['Work through', w.throughDate],
    ...(w.paymentRef ? ([['Payment reference', w.paymentRef]] as [string, string][]) : []),
  ];
  for (const [label, value] of rows) {
    const y = doc.y;
    doc.font('bold').text(label, 60, y, { width: 130 });
    doc.font('body').text(value || '—', 200, y, { width: 350 });
    doc.moveDown(0.35);
  }
  doc
    .moveDown(1)
    .font('body')
    .fontSize(11)
    .text(
      waiverBody(w.kind, {
        claimant: w.claimant,
        customer: w.customer,
        owner: w.owner,
        project: w.project,
        amount,
        throughDate: w.throughDate,
      }),
      60,
      doc.y,
      { width: 490, align: 'left', lineGap: 2 },
    );
  printExceptions(doc, w.exceptions);
  doc.moveDown(2).font('bold').fontSize(10).fillColor('#1f2a24').text('Signed', 60, doc.y);
  doc.font('body').fontSize(14).text(w.signedName);
  doc
    .fontSize(8.5)
    .fillColor('#6b6459')
    .text(`Signed electronically by typing the name, by ${w.signedByEmail}, at ${w.signedAt.toISOString()}.`);
  doc.moveDown(2).fontSize(8.5).fillColor('#6b6459').text(statutoryNotice(w.state), { width: 490 });
  doc.end();
  return done;
}
