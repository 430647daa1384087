import { MAX_REPORT_PAGES } from '@cc/shared';
import { extractPdfPages, PdfTextError } from '../integrations/pdf-text';
import { UnprocessableError, UnsupportedTypeError } from '../errors';

/** What an upload turned out to be, after its bytes were checked. */
export interface CheckedReport {
  kind: 'pdf' | 'text';
  pages: string[];
}

export interface UploadedFile {
  buffer: Buffer;
  originalName: string;
  /** The type the browser declared; never trusted alone. */
  declaredType: string;
}

export type PdfPageReader = (buffer: Buffer) => Promise<string[]>;

const PDF_MAGIC = Buffer.from('%PDF-');
const PDF_TYPES = ['application/pdf', 'application/x-pdf'];
const TEXT_TYPES = ['text/plain', 'application/octet-stream', ''];

function declaredKind(file: UploadedFile): 'pdf' | 'text' | null {
  const name = file.originalName.toLowerCase();
  if (PDF_TYPES.includes(file.declaredType) || name.endsWith('.pdf')) return 'pdf';
  if ((TEXT_TYPES.includes(file.declaredType) && (name.endsWith('.txt') || name.endsWith('.text'))) || file.declaredType === 'text/plain') {
    return 'text';
  }
  return null;
}

const fileDetail = (message: string) => [{ path: 'file', message }];

const PDF_FAILURES: Record<PdfTextError['reason'], [string, string]> = {
  encrypted: ['The PDF is password-protected', 'Upload a copy without a password, or paste the text'],
  invalid: ['The PDF is damaged and could not be read', 'Export the report to PDF again, or paste the text'],
  unreadable: ['The PDF text could not be read', 'Paste the electrical findings into the text box instead'],
};

/** Page texts of a PDF, with the extractor's failures turned into clear 422 answers. */
export async function readPdfPages(buffer: Buffer): Promise<string[]> {
  try {
    return (await extractPdfPages(buffer)).pages;
  } catch (err) {
    if (!(err instanceof PdfTextError)) throw err;
    const [message, hint] = PDF_FAILURES[err.reason];
    throw new UnprocessableError(message, fileDetail(hint));
  }
}

/** Text of a plain-text upload: strict UTF-8, no binary content; pages split at form feeds. */
export function decodeTextPages(buffer: Buffer): string[] {
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(buffer);
  } catch {
    throw new UnprocessableError('The text file is not UTF-8 text', fileDetail('Save the file as UTF-8 text, or paste the text instead'));
  }
  if (text.includes('\u0000')) {
    throw new UnsupportedTypeError('This is not a text file', fileDetail('Upload a PDF or a plain-text file'));
  }
  return text.replace(/^\uFEFF/, '').replace(/\r\n?/g, '\n').split('\f');
}

/**
 * Checks an upload's declared and sniffed type and its content, and extracts its pages. Throws a
 * domain error with a clear message for each way it can be wrong; nothing is stored before this.
 */
export async function checkReport(file: UploadedFile, readPdfPages: PdfPageReader): Promise<CheckedReport> {
  const kind = declaredKind(file);
  const looksLikePdf = file.buffer.subarray(0, 1024).includes(PDF_MAGIC);
  if (kind === null) {
    throw new UnsupportedTypeError('Only PDF and plain-text reports can be read', fileDetail('Upload a PDF or a .txt file, or paste the text'));
  }
  if (file.buffer.length === 0) throw new UnprocessableError('The file is empty', fileDetail('The file has no content'));
  if (kind === 'pdf' && !looksLikePdf) {
    throw new UnsupportedTypeError('The file is named or typed as a PDF but is not one', fileDetail('This file does not start like a PDF'));
  }
  if (kind === 'text' && looksLikePdf) {
    throw new UnsupportedTypeError('The file is a PDF named as text', fileDetail('Upload it with its .pdf name'));
  }

  const pages = kind === 'pdf' ? await readPdfPages(file.buffer) : decodeTextPages(file.buffer);
  if (pages.length > MAX_REPORT_PAGES) {
    throw new UnprocessableError(`The report has ${pages.length} pages; at most ${MAX_REPORT_PAGES} are read`, fileDetail('Upload only the electrical part of the report'));
  }
  if (pages.join('').replace(/\s+/g, '').length < 20) {
    throw new UnprocessableError(
      kind === 'pdf' ? 'This PDF has no text layer (it looks like scanned images)' : 'The text file has no text',
      fileDetail('Paste the electrical findings into the text box instead'),
    );
  }
  return { kind, pages };
}
