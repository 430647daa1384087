// Hand-built PDFs that attack a reader (written for the reliability tests): a huge page tree, a
// stream that inflates to far more than the file, and a page whose content takes long to scan.
import { deflateSync } from 'node:zlib';

/** A PDF with the given objects (1 = catalog) and a correct cross-reference table. */
function assemble(objects: (string | Buffer)[]): Buffer {
  const parts: Buffer[] = [Buffer.from('%PDF-1.4\n')];
  const offsets: number[] = [];
  let length = parts[0].length;
  objects.forEach((body, i) => {
    offsets.push(length);
    const chunk = Buffer.concat([Buffer.from(`${i + 1} 0 obj\n`), Buffer.isBuffer(body) ? body : Buffer.from(body), Buffer.from('\nendobj\n')]);
    parts.push(chunk);
    length += chunk.length;
  });
  const xref = [`xref\n0 ${objects.length + 1}\n`, '0000000000 65535 f \n', ...offsets.map((o) => `${String(o).padStart(10, '0')} 00000 n \n`)].join('');
  parts.push(Buffer.from(`${xref}trailer\n<< /Size ${objects.length + 1} /Root 1 0 R >>\nstartxref\n${length}\n%%EOF\n`));
  return Buffer.concat(parts);
}

const stream = (data: Buffer, filter?: string) =>
  Buffer.concat([Buffer.from(`<< /Length ${data.length}${filter ? ` /Filter /${filter}` : ''} >>\nstream\n`), data, Buffer.from('\nendstream')]);

const FONT = '<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica >>';

/** `pageCount` pages that all show one short line (objects 5… are the pages). */
export function manyPagesPdf(pageCount: number): Buffer {
  const kids = Array.from({ length: pageCount }, (_, i) => `${i + 5} 0 R`).join(' ');
  const page = '<< /Type /Page /Parent 2 0 R /MediaBox [0 0 612 792] /Contents 3 0 R /Resources << /Font << /F1 4 0 R >> >> >>';
  return assemble([
    '<< /Type /Catalog /Pages 2 0 R >>',
    `<< /Type /Pages /Kids [${kids}] /Count ${pageCount} >>`,
    stream(Buffer.from('BT /F1 12 Tf 72 720 Td (ELECTRICAL: open junction box in the garage.) Tj ET')),
    FONT,
    ...Array.from({ length: pageCount }, () => page),
  ]);
}

/** One page whose content stream, Flate-compressed, expands to `inflatedBytes` of blank content. */
export function inflatingPdf(inflatedBytes: number): Buffer {
  const content = deflateSync(Buffer.alloc(inflatedBytes, 0x20), { level: 9 });
  return assemble([
    '<< /Type /Catalog /Pages 2 0 R >>',
    '<< /Type /Pages /Kids [3 0 R] /Count 1 >>',
    '<< /Type /Page /Parent 2 0 R /MediaBox [0 0 612 792] /Contents 4 0 R /Resources << /Font << /F1 5 0 R >> >> >>',
    stream(content, 'FlateDecode'),
    FONT,
  ]);
}

/**
 * One page whose content is `operations` drawing operators and one line of text: small once
 * compressed and within the expansion limit, but slow to scan for text.
 */
export function slowPdf(operations: number): Buffer {
  const ops = Buffer.alloc(operations * 14, '0 0 m 1 1 l S\n');
  const content = Buffer.concat([ops, Buffer.from('BT /F1 12 Tf 72 720 Td (ELECTRICAL: open junction box in the garage.) Tj ET')]);
  return assemble([
    '<< /Type /Catalog /Pages 2 0 R >>',
    '<< /Type /Pages /Kids [3 0 R] /Count 1 >>',
    '<< /Type /Page /Parent 2 0 R /MediaBox [0 0 612 792] /Contents 4 0 R /Resources << /Font << /F1 5 0 R >> >> >>',
    stream(deflateSync(content), 'FlateDecode'),
    FONT,
  ]);
}
