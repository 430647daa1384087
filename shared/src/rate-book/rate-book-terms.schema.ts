import * as z from 'zod';
import { INT4_MAX } from '../http/bounds';
import { VisitTermsSchema } from '../pricing/rate-book.schema';

/** The visit terms of a rate book with their version. */
export const RateBookTermsRecordSchema = z.object({
  terms: VisitTermsSchema,
  /** Optimistic-concurrency version: send it back with a change. */
  version: z.number().int(),
  updatedAt: z.string(),
});
export type RateBookTermsRecord = z.infer<typeof RateBookTermsRecordSchema>;

/** New terms; `version` is 0 to start the rate book, else the version the change is based on. */
export const UpdateRateBookTermsSchema = z.object({
  version: z.number().int().min(0).max(INT4_MAX, 'No rate book has this version'),
  terms: VisitTermsSchema,
});
export type UpdateRateBookTerms = z.input<typeof UpdateRateBookTermsSchema>;
