import * as z from 'zod';
import { SkippedTextSchema } from '../findings/finding.schema';

/** Most pages a report excerpt may have; longer uploads are refused before anything is kept. */
export const MAX_REPORT_PAGES = 150;
/** Largest upload accepted (PDF or text file). */
export const MAX_REPORT_BYTES = 25 * 1024 * 1024;
/** Longest pasted text accepted (characters). */
export const MAX_PASTED_CHARS = 400_000;

export const REPORT_KINDS = ['pdf', 'text', 'pasted'] as const;

export const PasteReportSchema = z.object({
  text: z
    .string()
    .max(MAX_PASTED_CHARS, `Paste at most ${MAX_PASTED_CHARS.toLocaleString('en-US')} characters`)
    .refine((t) => t.trim().length >= 20, { error: 'Paste the electrical part of the report (at least a sentence)' }),
  name: z.string().trim().max(200).optional(),
});
export type PasteReport = z.infer<typeof PasteReportSchema>;

export const ReportFileSchema = z.object({
  id: z.number().int(),
  kind: z.enum(REPORT_KINDS),
  originalName: z.string(),
  sizeBytes: z.number().int(),
  pageCount: z.number().int(),
  sha256: z.string(),
  /** The extracted text, one entry per page. */
  pages: z.array(z.string()),
  skipped: z.array(SkippedTextSchema),
  uploadedByName: z.string().nullable(),
  createdAt: z.string(),
});
export type ReportFile = z.infer<typeof ReportFileSchema>;

/** Answer of an upload: the stored report and how many items the reader proposed from it. */
export const UploadResultSchema = z.object({
  report: ReportFileSchema,
  /** Whether the same file was uploaded to this request before (nothing new was stored). */
  isDuplicate: z.boolean(),
  proposedCount: z.number().int(),
  skippedCount: z.number().int(),
});
export type UploadResult = z.infer<typeof UploadResultSchema>;
