import * as z from 'zod';
import { SkippedTextSchema } from '../findings/finding.schema';
import { plainText } from '../http/bounds';

/** Most pages a report excerpt may have; longer uploads are refused before anything is kept. */
export const MAX_REPORT_PAGES = 150;
/** Largest upload accepted (PDF or text file). */
export const MAX_REPORT_BYTES = 25 * 1024 * 1024;
/** Most characters of text kept for one report (pasted, or read from a file). */
export const MAX_REPORT_TEXT_CHARS = 400_000;
/** Longest pasted text accepted (characters). */
export const MAX_PASTED_CHARS = MAX_REPORT_TEXT_CHARS;
/** Most findings one report may yield; more means more than the electrical part was sent. */
export const MAX_FINDINGS_PER_REPORT = 500;

export const REPORT_KINDS = ['pdf', 'text', 'pasted'] as const;

export const PasteReportSchema = z.object({
  text: plainText(MAX_PASTED_CHARS, `Paste at most ${MAX_PASTED_CHARS.toLocaleString('en-US')} characters`)
    .refine((t) => t.trim().length >= 20, { error: 'Paste the electrical part of the report (at least a sentence)' }),
  name: plainText(200).trim().optional(),
});
export type PasteReport = z.infer<typeof PasteReportSchema>;

export const ReportFileSchema = z.object({
  id: z.number().int(),
  kind: z.enum(REPORT_KINDS),
  originalName: z.string(),
  sizeBytes: z.number().int(),
  pageCount: z.number().int(),
  sha256: z.string(),
  /** Characters of text kept (the pages themselves come from GET …/reports/:reportId/text). */
  textLength: z.number().int(),
  skipped: z.array(SkippedTextSchema),
  uploadedByName: z.string().nullable(),
  createdAt: z.string(),
});
export type ReportFile = z.infer<typeof ReportFileSchema>;

/** The text of one report, one entry per page; evidence offsets refer to `pages.join('\f')`. */
export const ReportTextSchema = z.object({
  id: z.number().int(),
  pages: z.array(z.string()),
});
export type ReportText = z.infer<typeof ReportTextSchema>;

/** Answer of an upload: the stored report and how many items the reader proposed from it. */
export const UploadResultSchema = z.object({
  report: ReportFileSchema,
  /** Whether the same file was uploaded to this request before (nothing new was stored). */
  isDuplicate: z.boolean(),
  proposedCount: z.number().int(),
  skippedCount: z.number().int(),
});
export type UploadResult = z.infer<typeof UploadResultSchema>;
