import { PDFParse } from 'pdf-parse';

/** The text layer of a PDF, one string per page (page 1 first). */
export interface PdfPages {
  readonly pages: string[];
  readonly pageCount: number;
  /** Whether the file carries an encryption dictionary (it opened because no user password is set). */
  readonly isEncrypted: boolean;
}

export type PdfTextFailure = 'invalid' | 'encrypted' | 'unreadable' | 'too-many-pages' | 'too-much-text';

/** Bounds on what one extraction may read; the page count is checked before any page is read. */
export interface PdfTextLimits {
  maxPages?: number;
  /** Stops reading once the pages hold more characters than this. */
  maxChars?: number;
}

/** Why a PDF's text could not be read; `reason` is stable for callers to map to a response. */
export class PdfTextError extends Error {
  constructor(
    readonly reason: PdfTextFailure,
    message: string,
    options?: { cause?: unknown },
  ) {
    super(message, options);
    this.name = 'PdfTextError';
  }
}

/** The bytes are not a PDF, or its structure is broken. */
export class InvalidPdfError extends PdfTextError {
  constructor(cause?: unknown) {
    super('invalid', 'The file is not a readable PDF', { cause });
    this.name = 'InvalidPdfError';
  }
}

/** The PDF needs a password to open. */
export class EncryptedPdfError extends PdfTextError {
  constructor(cause?: unknown) {
    super('encrypted', 'The PDF is password-protected', { cause });
    this.name = 'EncryptedPdfError';
  }
}

const PDF_HEADER = '%PDF-';

/** The PDF has more pages than allowed (read from its page tree, before any page text). */
export class TooManyPagesError extends PdfTextError {
  constructor(readonly pageCount: number) {
    super('too-many-pages', `The PDF has ${pageCount} pages`);
    this.name = 'TooManyPagesError';
  }
}

/** The pages hold more text than allowed; reading stopped at the limit. */
export class TooMuchTextError extends PdfTextError {
  constructor(readonly maxChars: number) {
    super('too-much-text', `The PDF holds more than ${maxChars} characters of text`);
    this.name = 'TooMuchTextError';
  }
}

function toError(err: unknown): PdfTextError {
  if (err instanceof PdfTextError) return err;
  const name = err instanceof Error ? err.name : '';
  if (name === 'PasswordException') return new EncryptedPdfError(err);
  if (name === 'InvalidPDFException' || name === 'FormatError') return new InvalidPdfError(err);
  return new PdfTextError('unreadable', 'The PDF text could not be read', { cause: err });
}

/**
 * Reads the text of every page with pdf-parse (pdf.js). Throws InvalidPdfError for bytes that
 * are not a PDF, EncryptedPdfError for a password-protected file, PdfTextError otherwise.
 */
export async function extractPdfPages(buffer: Uint8Array, limits: PdfTextLimits = {}): Promise<PdfPages> {
  if (Buffer.from(buffer.subarray(0, 1024)).indexOf(PDF_HEADER) === -1) throw new InvalidPdfError();
  const isEncrypted = Buffer.from(buffer).includes('/Encrypt');
  const parser = new PDFParse({ data: new Uint8Array(buffer) });
  try {
    // The page count comes from the page tree; no page is read before it is known to be allowed.
    const { total } = await parser.getInfo();
    if (limits.maxPages !== undefined && total > limits.maxPages) throw new TooManyPagesError(total);
    const pages: string[] = [];
    let chars = 0;
    for (let num = 1; num <= total; num++) {
      const [page] = (await parser.getText({ partial: [num] })).pages;
      const text = page?.text ?? '';
      chars += text.length;
      if (limits.maxChars !== undefined && chars > limits.maxChars) throw new TooMuchTextError(limits.maxChars);
      pages.push(text);
    }
    return { pages, pageCount: total, isEncrypted };
  } catch (err) {
    throw toError(err);
  } finally {
    await parser.destroy();
  }
}
