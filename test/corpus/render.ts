// How an excerpt reaches the parser, as its manifest entry says: "text" is parsed as written
// (form feeds split pages); "pdf-pages" and "pdf-two-column" are laid out in a real PDF with
// pdfkit and read back through the project's own text extraction (server/src/integrations/pdf-text.ts),
// so those excerpts test extraction as well as parsing.
import { dirname, join } from 'node:path';
import PDFDocument from 'pdfkit';
import { parseReport, parseText, type ParseResult } from '@cc/shared';
import { extractPdfPages } from '../../server/src/integrations/pdf-text';

export const RENDERS = ['text', 'pdf-pages', 'pdf-two-column'] as const;
export type Render = (typeof RENDERS)[number];

const FONT = join(dirname(require.resolve('source-sans/package.json')), 'TTF', 'SourceSans3-Regular.ttf');
const MARGIN = 54;
/** Room kept above and below the body for the running header and footer. */
const BAND = 36;
const HEADER = 'Larkhaven Property Inspections · 1180 Cottonwood Row, Marlow Springs, CO';

function pdfOf(text: string, twoColumns: boolean, totalPages: number | null): Promise<{ pdf: Buffer; pageCount: number }> {
  return new Promise((resolve, reject) => {
    const doc = new PDFDocument({
      autoFirstPage: false,
      size: 'LETTER',
      margins: { top: MARGIN + BAND, bottom: MARGIN + BAND, left: MARGIN, right: MARGIN },
    });
    const chunks: Buffer[] = [];
    let pageCount = 0;
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve({ pdf: Buffer.concat(chunks), pageCount }));
    doc.on('error', reject);
    doc.registerFont('body', FONT);
    const width = 612 - 2 * MARGIN;
    // Running header and footer, drawn first on every page (as most report generators do).
    doc.on('pageAdded', () => {
      pageCount++;
      const { top, bottom } = doc.page.margins;
      doc.page.margins.top = 0;
      doc.page.margins.bottom = 0;
      doc.font('body').fontSize(8);
      doc.text(HEADER, MARGIN, MARGIN, { width, lineBreak: false });
      doc.text(`Page ${pageCount} of ${totalPages ?? '?'}`, MARGIN, doc.page.height - MARGIN - 10, { width, align: 'center', lineBreak: false });
      doc.page.margins.top = top;
      doc.page.margins.bottom = bottom;
      doc.font('body').fontSize(10);
      doc.x = MARGIN;
      doc.y = top;
    });
    // A form feed in the excerpt is a page break the writer asked for.
    for (const page of text.replace(/\t/g, '    ').split('\f')) {
      doc.addPage();
      doc.text(page, MARGIN, doc.page.margins.top, twoColumns ? { width, columns: 2, columnGap: 18 } : { width });
    }
    doc.end();
  });
}

/**
 * A report generator lays out paragraphs, not the hard line breaks of a text file: lines of prose
 * are joined into their paragraph before layout (list items, headings and table rows keep their lines).
 */
export function reflow(text: string): string {
  const lines = text.split('\n');
  const out: string[] = [];
  const isProse = (line: string) => line.trim().length >= 55 && !/\t|\||\S {3,}\S/.test(line.trim());
  const startsItem = (line: string) => /^\s*(?:[-•*]|\d+(?:\.\d+)*[.)]?\s|[a-z][.)]\s)/i.test(line) || line.trim() === line.trim().toUpperCase();
  for (const line of lines) {
    const prev = out.length > 0 ? out[out.length - 1] : null;
    if (prev !== null && isProse(prev) && line.trim().length > 0 && !startsItem(line) && !line.includes('\f') && !prev.includes('\f')) {
      out[out.length - 1] = `${prev.trimEnd()} ${line.trim()}`;
    } else {
      out.push(line);
    }
  }
  return out.join('\n');
}

/** The pages the parser reads for an excerpt shown as `render`. */
export async function renderPages(text: string, render: Render): Promise<string[]> {
  if (render === 'text') return text.split('\f');
  // Laid out twice: the first pass counts the pages for the "Page N of M" footer.
  const laidOut = reflow(text);
  const { pageCount } = await pdfOf(laidOut, render === 'pdf-two-column', null);
  const { pdf } = await pdfOf(laidOut, render === 'pdf-two-column', pageCount);
  return (await extractPdfPages(pdf)).pages;
}

/** Parses an excerpt as `render` shows it; `pages` is what the parser read. */
export async function parseRendered(text: string, render: Render): Promise<{ pages: string[]; result: ParseResult }> {
  if (render === 'text') return { pages: text.split('\f'), result: parseText(text) };
  const pages = await renderPages(text, render);
  return { pages, result: parseReport(pages) };
}
