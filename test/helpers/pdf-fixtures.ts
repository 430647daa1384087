// Real PDFs for tests, written with pdfkit: text pages, encrypted files, and pages with no text layer.
import PDFDocument from 'pdfkit';

function render(build: (doc: PDFKit.PDFDocument) => void, options: PDFKit.PDFDocumentOptions = {}): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const doc = new PDFDocument({ autoFirstPage: false, ...options });
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    build(doc);
    doc.end();
  });
}

/** One PDF page per entry, each holding that text. */
export function textPdf(pages: string[], options: PDFKit.PDFDocumentOptions = {}): Promise<Buffer> {
  return render((doc) => {
    for (const text of pages) {
      doc.addPage({ size: 'LETTER', margin: 54 });
      doc.font('Helvetica').fontSize(11).text(text);
    }
  }, options);
}

/** A password-protected PDF. */
export function encryptedPdf(text: string): Promise<Buffer> {
  return textPdf([text], { userPassword: 'open-sesame', ownerPassword: 'owner-secret', pdfVersion: '1.7' });
}

/** Pages with only drawn shapes, as a scan without a text layer looks to a text extractor. */
export function imageOnlyPdf(pageCount = 2): Promise<Buffer> {
  return render((doc) => {
    for (let i = 0; i < pageCount; i++) {
      doc.addPage({ size: 'LETTER' });
      for (let line = 0; line < 30; line++) doc.rect(54, 60 + line * 20, 300 + ((line * 37) % 200), 8).fill('#333333');
    }
  });
}
