import { inflateSync } from 'node:zlib';
import type { ParseResult } from '@cc/shared';
// The parser's entry point, imported by itself: a worker thread that loads the whole shared package
// (and pdf.js, below) before its first report starts seconds slower.
import { parseReport } from '../../../../shared/src/findings/report-parser';

/**
 * What the report worker reads and parses. Runs inside a worker thread (see report-worker.ts), so
 * it takes and returns plain data: a refusal is a value, not a thrown error class.
 */
export type ReadJob =
  | { kind: 'pdf'; bytes: Uint8Array }
  | { kind: 'text'; bytes: Uint8Array }
  | { kind: 'pasted'; text: string }
  /** A stored report read again. */
  | { kind: 'pages'; pages: string[] };

/** Status and wording of a refusal; the service turns it into its domain error. */
export interface ReadRefusal {
  status: 413 | 415 | 422;
  message: string;
  hint: string;
}

export type ReadOutcome = { ok: true; pages: string[]; parsed: ParseResult } | { ok: false; refusal: ReadRefusal };

export interface ReadLimits {
  maxPages: number;
  maxChars: number;
  maxFindings: number;
  /** Most bytes the compressed streams of a PDF may expand to, all together. */
  maxInflatedBytes: number;
}

class Refused extends Error {
  constructor(readonly refusal: ReadRefusal) {
    super(refusal.message);
  }
}

const refuse = (status: ReadRefusal['status'], message: string, hint: string): never => {
  throw new Refused({ status, message, hint });
};

const count = (n: number) => n.toLocaleString('en-US');

const PDF_FAILURES: Record<'encrypted' | 'invalid' | 'unreadable', [string, string]> = {
  encrypted: ['The PDF is password-protected', 'Upload a copy without a password, or paste the text'],
  invalid: ['The PDF is damaged and could not be read', 'Export the report to PDF again, or paste the text'],
  unreadable: ['The PDF text could not be read', 'Paste the electrical findings into the text box instead'],
};

const STREAM = Buffer.from('stream');
const END_STREAM = Buffer.from('endstream');

/**
 * Adds up what the Flate-compressed streams of a PDF expand to, inflating each with a cap, and
 * refuses the file once the sum passes `maxBytes` (a small file that expands to gigabytes would
 * otherwise fill the memory of whoever reads it). Streams that do not inflate are left to pdf.js.
 */
export function checkInflatedSize(pdf: Buffer, maxBytes: number): void {
  let total = 0;
  let at = 0;
  while (at < pdf.length) {
    const start = pdf.indexOf(STREAM, at);
    if (start === -1) break;
    const end = pdf.indexOf(END_STREAM, start + STREAM.length);
    if (end === -1) break;
    at = end + END_STREAM.length;
    if (pdf[start - 3] === 0x65 && pdf[start - 2] === 0x6e && pdf[start - 1] === 0x64) continue; // "endstream" itself
    let dataStart = start + STREAM.length;
    if (pdf[dataStart] === 0x0d) dataStart++;
    if (pdf[dataStart] === 0x0a) dataStart++;
    let layer: Buffer = pdf.subarray(dataStart, end);
    // Filters can be chained ([/FlateDecode /FlateDecode]): inflate while the result still inflates.
    for (let depth = 0; depth < 4; depth++) {
      let inflated: Buffer;
      try {
        inflated = inflateSync(layer, { maxOutputLength: Math.max(1, maxBytes - total + 1) });
      } catch (err) {
        if ((err as { code?: string }).code === 'ERR_BUFFER_TOO_LARGE') {
          refuse(422, 'The PDF expands to far more content than a report excerpt', 'Export only the electrical pages to PDF, or paste the text');
        }
        break;
      }
      total += inflated.length;
      if (total > maxBytes) {
        refuse(422, 'The PDF expands to far more content than a report excerpt', 'Export only the electrical pages to PDF, or paste the text');
      }
      layer = inflated;
    }
  }
}

async function pdfPages(bytes: Uint8Array, limits: ReadLimits): Promise<string[]> {
  checkInflatedSize(Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength), limits.maxInflatedBytes);
  // Loaded on the first PDF only (pdf.js takes seconds to load); require, because the worker's
  // TypeScript loader (tsx, CommonJS) handles require but not import().
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  const pdfText = require('../pdf-text') as typeof import('../pdf-text');
  try {
    return (await pdfText.extractPdfPages(bytes, { maxPages: limits.maxPages, maxChars: limits.maxChars })).pages;
  } catch (err) {
    if (!(err instanceof pdfText.PdfTextError)) throw err;
    if (err instanceof pdfText.TooManyPagesError) {
      return refuse(422, `The report has ${count(err.pageCount)} pages; at most ${limits.maxPages} are read`, 'Upload only the electrical part of the report');
    }
    if (err instanceof pdfText.TooMuchTextError) {
      return refuse(422, `The report holds more than ${count(limits.maxChars)} characters of text`, 'Upload only the electrical part of the report');
    }
    const [message, hint] = PDF_FAILURES[err.reason === 'encrypted' || err.reason === 'invalid' ? err.reason : 'unreadable'];
    return refuse(422, message, hint);
  }
}

/** Text of a plain-text upload: strict UTF-8, no binary content; pages split at form feeds. */
function textPages(bytes: Uint8Array, limits: ReadLimits): string[] {
  // UTF-8 takes at most 4 bytes a character: a longer file cannot be within the limit.
  if (bytes.length > limits.maxChars * 4) {
    refuse(413, `The text file is longer than ${count(limits.maxChars)} characters`, 'Upload only the electrical part of the report');
  }
  let text = '';
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    refuse(422, 'The text file is not UTF-8 text', 'Save the file as UTF-8 text, or paste the text instead');
  }
  if (text.includes('\u0000')) refuse(415, 'This is not a text file', 'Upload a PDF or a plain-text file');
  if (text.length > limits.maxChars) {
    refuse(413, `The text file is longer than ${count(limits.maxChars)} characters`, 'Upload only the electrical part of the report');
  }
  return text.replace(/^\uFEFF/, '').replace(/\r\n?/g, '\n').split('\f');
}

function pagesOf(job: ReadJob, limits: ReadLimits): Promise<string[]> | string[] {
  switch (job.kind) {
    case 'pdf':
      return pdfPages(job.bytes, limits);
    case 'text':
      return textPages(job.bytes, limits);
    case 'pasted':
      return job.text.replace(/\r\n?/g, '\n').split('\f');
    case 'pages':
      return job.pages;
  }
}

/** Extracts the pages of a report within the limits and parses them into findings. */
export async function readReport(job: ReadJob, limits: ReadLimits): Promise<ReadOutcome> {
  try {
    const pages = await pagesOf(job, limits);
    if (pages.length > limits.maxPages) {
      refuse(422, `The report has ${count(pages.length)} pages; at most ${limits.maxPages} are read`, 'Upload only the electrical part of the report');
    }
    const chars = pages.reduce((sum, page) => sum + page.length, 0);
    if (chars > limits.maxChars) {
      refuse(413, `The report is longer than ${count(limits.maxChars)} characters`, 'Send only the electrical part of the report');
    }
    if ((job.kind === 'pdf' || job.kind === 'text') && pages.join('').replace(/\s+/g, '').length < 20) {
      refuse(
        422,
        job.kind === 'pdf' ? 'This PDF has no text layer (it looks like scanned images)' : 'The text file has no text',
        'Paste the electrical findings into the text box instead',
      );
    }
    const parsed = parseReport(pages);
    if (parsed.findings.length > limits.maxFindings) {
      refuse(
        422,
        `The report yields ${count(parsed.findings.length)} findings; at most ${limits.maxFindings} are read from one report`,
        'Send only the electrical part of the report, or split it into several',
      );
    }
    return { ok: true, pages, parsed };
  } catch (err) {
    if (err instanceof Refused) return { ok: false, refusal: err.refusal };
    throw err;
  }
}
