import * as z from 'zod';

export const RATE_BOOK_SUBJECTS = ['terms', 'entry', 'adder'] as const;
export const RATE_BOOK_ACTIONS = ['create', 'update', 'delete', 'import'] as const;

/** One recorded change of a rate book: who, when, what, and the record before and after. */
export const RateBookChangeSchema = z.object({
  id: z.number().int(),
  at: z.string(),
  byName: z.string().nullable(),
  subject: z.enum(RATE_BOOK_SUBJECTS),
  subjectId: z.number().int().nullable(),
  action: z.enum(RATE_BOOK_ACTIONS),
  before: z.unknown().nullable(),
  after: z.unknown().nullable(),
});
export type RateBookChange = z.infer<typeof RateBookChangeSchema>;
