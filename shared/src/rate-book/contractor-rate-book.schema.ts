import * as z from 'zod';
import { RateBookEntryRecordSchema } from './rate-book-entry.schema';
import { RateBookTermsRecordSchema } from './rate-book-terms.schema';
import { SiteAdderRecordSchema } from './site-adder-record.schema';

/** The whole rate book of the signed-in contractor's organisation. */
export const ContractorRateBookSchema = z.object({
  organisationId: z.number().int(),
  contractorName: z.string(),
  /** Null until the terms are saved the first time. */
  terms: RateBookTermsRecordSchema.nullable(),
  entries: z.array(RateBookEntryRecordSchema),
  adders: z.array(SiteAdderRecordSchema),
});
export type ContractorRateBook = z.infer<typeof ContractorRateBookSchema>;
