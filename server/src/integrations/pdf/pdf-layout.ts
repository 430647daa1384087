import { dirname, join } from 'node:path';
import PDFDocument from 'pdfkit';

// A Letter page in Source Sans 3 (the portal's typeface, from the `source-sans` package: pdfkit
// embeds TrueType/OpenType, not woff2) and the few blocks the product's papers are made of.
const FONT_DIR = join(dirname(require.resolve('source-sans/package.json')), 'TTF');
export const MARGIN = 54;
const PAGE_WIDTH = 612;
export const CONTENT_WIDTH = PAGE_WIDTH - 2 * MARGIN;
const AMOUNT_WIDTH = 90;
const QTY_WIDTH = 50;
export const MUTED = '#555555';

export interface PdfLayout {
  doc: PDFKit.PDFDocument;
  heading(text: string): void;
  paragraph(text: string, size?: number, color?: string): void;
  /** A row of description, quantity and amount, kept together on one page. */
  row(description: string, qty: string, amount: string, font?: 'body' | 'strong'): void;
  /** Ends the document; resolves with its bytes. */
  finish(): Promise<Buffer>;
}

export function createPdfLayout(info: PDFKit.DocumentInfo): PdfLayout {
  const doc = new PDFDocument({ size: 'LETTER', margin: MARGIN, info });
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  doc.registerFont('body', join(FONT_DIR, 'SourceSans3-Regular.ttf'));
  doc.registerFont('strong', join(FONT_DIR, 'SourceSans3-Semibold.ttf'));
  const ensureSpace = (height: number) => {
    if (doc.y + height > doc.page.height - MARGIN) doc.addPage();
  };
  return {
    doc,
    heading(text) {
      ensureSpace(40);
      doc.moveDown(0.8).font('strong').fontSize(13).fillColor('black').text(text, MARGIN, doc.y, { width: CONTENT_WIDTH });
      doc.moveDown(0.3);
    },
    paragraph(text, size = 10, color = 'black') {
      doc.font('body').fontSize(size).fillColor(color).text(text, MARGIN, doc.y, { width: CONTENT_WIDTH });
    },
    row(description, qty, amount, font = 'body') {
      const descWidth = CONTENT_WIDTH - QTY_WIDTH - AMOUNT_WIDTH - 12;
      doc.font(font).fontSize(10).fillColor('black');
      const height = Math.max(doc.heightOfString(description, { width: descWidth }), doc.heightOfString(amount, { width: AMOUNT_WIDTH }));
      ensureSpace(height + 4);
      const y = doc.y;
      doc.text(description, MARGIN, y, { width: descWidth });
      doc.text(qty, MARGIN + descWidth + 6, y, { width: QTY_WIDTH, align: 'right' });
      doc.text(amount, PAGE_WIDTH - MARGIN - AMOUNT_WIDTH, y, { width: AMOUNT_WIDTH, align: 'right' });
      doc.x = MARGIN;
      doc.y = y + height + 4;
    },
    finish() {
      doc.end();
      return done;
    },
  };
}
