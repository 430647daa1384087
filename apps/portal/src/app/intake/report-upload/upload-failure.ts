import { HttpErrorResponse } from '@angular/common/http';
import { MAX_REPORT_BYTES } from '@cc/shared';
import { apiErrorOf, describeFailure } from '../../core/http/api-error-of';

/** Why an upload was refused, in the server's words, and whether pasting the text is the way out. */
export interface UploadFailure {
  readonly message: string;
  /** What to do about it (the server's detail for the file field). */
  readonly hint: string | null;
  /** Whether the file's text could not be read (scan, password, damage), so pasting is offered. */
  readonly offersPaste: boolean;
}

const MAX_MB = Math.round(MAX_REPORT_BYTES / (1024 * 1024));
/** 422 answers about a PDF whose text cannot be had (no text layer, password-protected, damaged). */
const UNREADABLE = /no text layer|password|damaged|could not be read|not UTF-8/i;

export function tooLarge(): UploadFailure {
  return { message: `The file is larger than ${MAX_MB} MB.`, hint: 'Upload only the electrical part of the report, or paste the text.', offersPaste: true };
}

export function uploadFailure(err: unknown): UploadFailure {
  const body = apiErrorOf(err);
  const status = err instanceof HttpErrorResponse ? err.status : 0;
  if (status === 413) return { ...tooLarge(), message: body?.error ? `${body.error} (at most ${MAX_MB} MB).` : tooLarge().message };
  const hint = body?.details.find((d) => d.path === 'file')?.message ?? null;
  const message = status === 415 || status === 422 ? (body?.error ?? describeFailure(err)) : describeFailure(err);
  return { message, hint, offersPaste: status === 422 && UNREADABLE.test(message) };
}
