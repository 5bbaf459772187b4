/** A small table printer for pdfkit: column titles repeated on each page, rows wrapped, an optional totals row. */
export type PdfDoc = PDFKit.PDFDocument;

export type PdfColumn<R> = { title: string; w: number; align?: 'left' | 'right'; cell: (row: R) => string };

export const INK = '#1f2a24';
export const STONE = '#6b716d';
export const SPRUCE = '#2f6b4f';
export const RULE = '#c9cdc9';

const pad = (align: 'left' | 'right' | undefined) => (align === 'right' ? 8 : 4);

/** A section title in the house style, on a new page when fewer than `need` points are left. */
export function sectionTitle(doc: PdfDoc, text: string, note?: string, need = 90): void {
  const left = doc.page.margins.left;
  if (doc.y > doc.page.height - doc.page.margins.bottom - need) doc.addPage();
  doc.font('bold').fontSize(11).fillColor(INK).text(text, left, doc.y);
  if (note)
    doc
      .font('body')
      .fontSize(8)
      .fillColor(STONE)
      .text(note, left, doc.y + 1);
  doc.y += 6;
}

export function drawTable<R>(doc: PdfDoc, cols: readonly PdfColumn<R>[], rows: readonly R[], totals?: string[]): void {
  const left = doc.page.margins.left;
  const width = cols.reduce((s, c) => s + c.w, 0);
  const bottom = () => doc.page.height - doc.page.margins.bottom - 14;
  const line = (cells: string[], font: 'body' | 'bold', size: number, color: string) => {
    doc.font(font).fontSize(size);
    const height = Math.max(
      ...cells.map((c, i) => doc.heightOfString(c || ' ', { width: cols[i]!.w - pad(cols[i]!.align) })),
    );
    return {
      height,
      draw: (y: number) => {
        let x = left;
        // The font again: a page break in between drew the header in bold and left it set.
        doc.font(font).fontSize(size).fillColor(color);
        cells.forEach((c, i) => {
          const col = cols[i]!;
          doc.text(c, x, y, { width: col.w - pad(col.align), align: col.align ?? 'left', lineBreak: true });
          x += col.w;
        });
      },
    };
  };
  const header = () => {
    const h = line(
      cols.map((c) => c.title),
      'bold',
      7,
      STONE,
    );
    const y = doc.y;
    h.draw(y);
    doc
      .moveTo(left, y + h.height + 2)
      .lineTo(left + width, y + h.height + 2)
      .strokeColor(RULE)
      .lineWidth(0.5)
      .stroke();
    doc.y = y + h.height + 5;
  };
  header();
  for (const r of rows) {
    const l = line(
      cols.map((c) => c.cell(r)),
      'body',
      7.5,
      INK,
    );
    if (doc.y + l.height > bottom()) {
      doc.addPage();
      header();
    }
    const y = doc.y;
    l.draw(y);
    doc.y = y + l.height + 3;
  }
  if (totals) {
    const t = line(totals, 'bold', 7.5, INK);
    if (doc.y + t.height + 4 > bottom()) {
      doc.addPage();
      header();
    }
    doc
      .moveTo(left, doc.y)
      .lineTo(left + width, doc.y)
      .strokeColor(RULE)
      .lineWidth(0.5)
      .stroke();
    const y = doc.y + 3;
    t.draw(y);
    doc.y = y + t.height + 3;
  } else {
    doc
      .moveTo(left, doc.y)
      .lineTo(left + width, doc.y)
      .strokeColor(RULE)
      .lineWidth(0.5)
      .stroke();
  }
  doc.x = left;
  doc.y += 10;
}
