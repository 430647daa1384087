import * as z from 'zod';

const line = z.object({
  lineItemId: z.number().int().nullable(),
  code: z.string(),
  location: z.string(),
  lineCents: z.number().int(),
});

/** What a quote version changed against the version before it. */
export const QuoteChangesSchema = z.object({
  previousVersion: z.number().int(),
  /** Items priced now that were not priced before. */
  added: z.array(line),
  /** Items priced before that are not priced now (taken off or declined as not in scope). */
  removed: z.array(line),
  /** Items priced in both whose price, quantity or entry changed. */
  changed: z.array(
    line.extend({
      previousLineCents: z.number().int(),
      quantity: z.number().int().nullable(),
      previousQuantity: z.number().int().nullable(),
      entryName: z.string().nullable(),
      previousEntryName: z.string().nullable(),
    }),
  ),
  previousTotalCents: z.number().int(),
  /** Signed: positive when the total went up. */
  totalDeltaCents: z.number().int(),
});
export type QuoteChanges = z.infer<typeof QuoteChangesSchema>;
