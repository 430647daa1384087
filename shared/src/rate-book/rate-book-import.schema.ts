import * as z from 'zod';

/** What an import of entries from CSV did. Rows match entries by `key`; entries not in the file stay. */
export const RateBookImportResultSchema = z.object({
  created: z.number().int(),
  updated: z.number().int(),
  unchanged: z.number().int(),
});
export type RateBookImportResult = z.infer<typeof RateBookImportResultSchema>;

/** The largest CSV file an import takes. */
export const MAX_RATE_BOOK_CSV_BYTES = 1_000_000;
