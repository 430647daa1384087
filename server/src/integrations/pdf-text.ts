import { PDFParse } from 'pdf-parse';

/** The text layer of a PDF, one string per page (page 1 first). */
export interface PdfPages {
  readonly pages: string[];
  readonly pageCount: number;
  /** Whether the file carries an encryption dictionary (it opened because no user password is set). */
  readonly isEncrypted: boolean;
}

export type PdfTextFailure = 'invalid' | 'encrypted' | 'unreadable';

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

function toError(err: unknown): PdfTextError {
  const name = err instanceof Error ? err.name : '';
  if (name === 'PasswordException') return new EncryptedPdfError(err);
  if (name === 'InvalidPDFException' || name === 'FormatError') return new InvalidPdfError(err);
  return new PdfTextError('unreadable', 'The PDF text could not be read', { cause: err });
}

/**
 * Reads the text of every page with pdf-parse (pdf.js). Throws InvalidPdfError for bytes that
 * are not a PDF, EncryptedPdfError for a password-protected file, PdfTextError otherwise.
 */
export async function extractPdfPages(buffer: Uint8Array): Promise<PdfPages> {
  if (Buffer.from(buffer.subarray(0, 1024)).indexOf(PDF_HEADER) === -1) throw new InvalidPdfError();
  const isEncrypted = Buffer.from(buffer).includes('/Encrypt');
  const parser = new PDFParse({ data: new Uint8Array(buffer) });
  try {
    const result = await parser.getText();
    const pages = [...result.pages].sort((a, b) => a.num - b.num).map((p) => p.text);
    return { pages, pageCount: result.total, isEncrypted };
  } catch (err) {
    throw toError(err);
  } finally {
    await parser.destroy();
  }
}
