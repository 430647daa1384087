import type { ReadRefusal } from '../integrations/report-reader/read-report';
import type { PoolRefusal } from '../integrations/report-reader/report-reader';
import { DomainError, TooLargeError, UnavailableError, UnprocessableError, UnsupportedTypeError } from '../errors';

export interface UploadedFile {
  buffer: Buffer;
  originalName: string;
  /** The type the browser declared; never trusted alone. */
  declaredType: string;
}

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

/** Whether the bytes open as a PDF does: `%PDF-` first (after a byte-order mark or blank lines). */
function startsLikePdf(buffer: Buffer): boolean {
  const head = buffer.subarray(0, 64).toString('latin1').replace(/^\uFEFF|^\xEF\xBB\xBF/, '').trimStart();
  return head.startsWith('%PDF-');
}

/**
 * Checks an upload's declared and sniffed type before anything reads it, and says how to read it.
 * Throws a domain error with a clear message for each way it can be wrong; nothing is stored before this.
 */
export function checkUpload(file: UploadedFile): 'pdf' | 'text' {
  const kind = declaredKind(file);
  if (kind === null) {
    throw new UnsupportedTypeError('Only PDF and plain-text reports can be read', fileDetail('Upload a PDF or a .txt file, or paste the text'));
  }
  if (file.buffer.length === 0) throw new UnprocessableError('The file is empty', fileDetail('The file has no content'));
  // A PDF may carry its header anywhere in its first kilobyte; a text file that merely mentions
  // "%PDF-" there is still text.
  if (kind === 'pdf' && !file.buffer.subarray(0, 1024).includes(PDF_MAGIC)) {
    throw new UnsupportedTypeError('The file is named or typed as a PDF but is not one', fileDetail('This file does not start like a PDF'));
  }
  if (kind === 'text' && startsLikePdf(file.buffer)) {
    throw new UnsupportedTypeError('The file is a PDF named as text', fileDetail('Upload it with its .pdf name'));
  }
  return kind;
}

/** The domain error for a report the reader refused. */
export function refusalError({ status, message, hint }: ReadRefusal | PoolRefusal, field = 'file'): DomainError {
  const details = [{ path: field, message: hint }];
  if (status === 413) return new TooLargeError(message, details);
  if (status === 415) return new UnsupportedTypeError(message, details);
  if (status === 503) return new UnavailableError(message, details);
  return new UnprocessableError(message, details);
}
