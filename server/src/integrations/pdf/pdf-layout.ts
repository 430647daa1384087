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

export interface PdfLayoutOptions {
  info: PDFKit.DocumentInfo;
  /** Room kept free at the foot of each page (for page numbers written at the end). */
  footerHeight?: number;
}

export interface PdfLayout {
  doc: PDFKit.PDFDocument;
  /** Starts a new page unless `height` points still fit above the footer. */
  ensureSpace(height: number): void;
  heading(text: string): void;
  /** A heading kept on the same page as the start of its paragraph. */
  section(title: string, text: string): void;
  paragraph(text: string, size?: number, color?: string): void;
  /** A row of description, quantity and amount, kept together on one page. */
  row(description: string, qty: string, amount: string, font?: 'body' | 'strong'): void;
  /** "Page n of N" and `reference` at the foot of every page (needs `footerHeight`). */
  pageNumbers(reference: string): void;
  /** Ends the document; resolves with its bytes. */
  finish(): Promise<Buffer>;
}

export function createPdfLayout({ info, footerHeight = 0 }: PdfLayoutOptions): PdfLayout {
  // Pages stay in memory so that page numbers can be written once the last page exists.
  // The bottom margin holds the footer: text flowing onto a new page stops above it, never over it.
  const doc = new PDFDocument({ size: 'LETTER', margins: { top: MARGIN, left: MARGIN, right: MARGIN, bottom: MARGIN + footerHeight }, info, bufferPages: footerHeight > 0 });
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  doc.registerFont('body', join(FONT_DIR, 'SourceSans3-Regular.ttf'));
  doc.registerFont('strong', join(FONT_DIR, 'SourceSans3-Semibold.ttf'));
  const ensureSpace = (height: number) => {
    if (doc.y + height > doc.page.height - MARGIN - footerHeight) doc.addPage();
  };
  const heading = (text: string) => {
    ensureSpace(40);
    doc.moveDown(0.8).font('strong').fontSize(13).fillColor('black').text(text, MARGIN, doc.y, { width: CONTENT_WIDTH });
    doc.moveDown(0.3);
  };
  const paragraph = (text: string, size = 10, color = 'black') => {
    doc.font('body').fontSize(size).fillColor(color).text(text, MARGIN, doc.y, { width: CONTENT_WIDTH });
  };
  return {
    doc,
    ensureSpace,
    heading,
    section(title, text) {
      doc.font('body').fontSize(10);
      ensureSpace(40 + Math.min(doc.heightOfString(text, { width: CONTENT_WIDTH }), 60));
      heading(title);
      paragraph(text);
    },
    paragraph,
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
    pageNumbers(reference) {
      const { start, count } = doc.bufferedPageRange();
      for (let i = start; i < start + count; i++) {
        doc.switchToPage(i);
        // Writing inside the bottom margin would start a new page: lift the margin while the footer is written.
        const margin = doc.page.margins.bottom;
        doc.page.margins.bottom = 0;
        const y = doc.page.height - MARGIN - 10;
        doc.font('body').fontSize(8).fillColor(MUTED);
        doc.text(reference, MARGIN, y, { width: CONTENT_WIDTH / 2, lineBreak: false });
        doc.text(`Page ${i - start + 1} of ${count}`, MARGIN + CONTENT_WIDTH / 2, y, { width: CONTENT_WIDTH / 2, align: 'right', lineBreak: false });
        doc.page.margins.bottom = margin;
      }
    },
    finish() {
      doc.end();
      return done;
    },
  };
}
