import PDFDocument from 'pdfkit';
import { EncryptedPdfError, extractPdfPages, InvalidPdfError } from './pdf-text';

function makePdf(pages: string[], options: PDFKit.PDFDocumentOptions = {}): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const doc = new PDFDocument({ ...options, autoFirstPage: false });
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    for (const text of pages) doc.addPage().text(text);
    doc.end();
  });
}

describe('extractPdfPages', () => {
  it('returns the text of each page in order', async () => {
    const result = await extractPdfPages(await makePdf(['ELECTRICAL', 'Double tap at the panel.']));
    expect(result.pageCount).toBe(2);
    expect(result.pages).toEqual(['ELECTRICAL', 'Double tap at the panel.']);
    expect(result.isEncrypted).toBe(false);
  });

  it('rejects bytes that are not a PDF', async () => {
    await expect(extractPdfPages(Buffer.from('plain text report'))).rejects.toBeInstanceOf(InvalidPdfError);
  });

  it('rejects a broken PDF as invalid', async () => {
    await expect(extractPdfPages(Buffer.from('%PDF-1.4\nbroken'))).rejects.toMatchObject({ reason: 'invalid' });
  });

  it('rejects a password-protected PDF', async () => {
    const pdf = await makePdf(['secret'], { userPassword: 'u', ownerPassword: 'o' });
    await expect(extractPdfPages(pdf)).rejects.toBeInstanceOf(EncryptedPdfError);
  });

  it('reads an owner-password-only PDF and reports it as encrypted', async () => {
    const pdf = await makePdf(['Open ground at the den.'], { ownerPassword: 'o', permissions: { copying: false } });
    const result = await extractPdfPages(pdf);
    expect(result.isEncrypted).toBe(true);
    expect(result.pages).toEqual(['Open ground at the den.']);
  });
});
