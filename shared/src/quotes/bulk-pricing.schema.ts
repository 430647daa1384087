import * as z from 'zod';
import { plainText, QuantitySchema, RecordIdSchema, VersionSchema } from '../http/bounds';
import { ClaimedTotalsSchema } from '../pricing/verify-totals';
import { PricingVisitSchema, RequestPricingSchema, VisitKeySchema } from './request-pricing.schema';

/** An item as the client saw it: the change applies only if it is still at this version. */
export const ItemRefSchema = z.object({ id: RecordIdSchema, version: VersionSchema });
export type ItemRef = z.infer<typeof ItemRefSchema>;

const itemRefs = z
  .array(ItemRefSchema)
  .min(1, 'Select at least one item')
  .max(500)
  .refine((refs) => new Set(refs.map((r) => r.id)).size === refs.length, { error: 'An item is listed twice' });

/** One change applied to many items at once. */
export const BulkPriceItemsSchema = z.object({
  items: itemRefs,
  set: z
    .object({
      /** A rate-book entry id, or null to take the entry off. */
      entryId: RecordIdSchema.nullable().optional(),
      /** Site conditions of the items (replaces theirs). */
      adderIds: z.array(RecordIdSchema).max(20).optional(),
      quantity: QuantitySchema.optional(),
      visitKey: VisitKeySchema.optional(),
    })
    .refine((s) => s.entryId !== undefined || s.adderIds !== undefined || s.quantity !== undefined || s.visitKey !== undefined, {
      error: 'Choose something to change',
    }),
  /** The totals the client shows after the change; the server refuses the change when its own differ. */
  claimedTotals: ClaimedTotalsSchema.optional(),
});
export type BulkPriceItems = z.infer<typeof BulkPriceItemsSchema>;

/** Auto-pricing: every open item without an entry gets the suggested one; `items` narrows it. */
export const AutoPriceItemsSchema = z.object({ items: itemRefs.optional() });
export type AutoPriceItems = z.infer<typeof AutoPriceItemsSchema>;

export const AutoPriceResultSchema = z.object({
  pricing: RequestPricingSchema,
  pricedItemIds: z.array(z.number().int()),
  /** Items whose report gave no quantity: priced at 1 and flagged for the contractor to check. */
  assumedQuantityItemIds: z.array(z.number().int()),
  /** Items whose code has no entry in the rate book: still unpriced. */
  noEntryItemIds: z.array(z.number().int()),
});
export type AutoPriceResult = z.infer<typeof AutoPriceResultSchema>;

/** The contractor declines items as not in their scope. */
export const MarkOutOfScopeSchema = z.object({
  items: itemRefs,
  reason: plainText(500).trim().min(3, 'Say why these items are not in your scope').max(500),
});
export type MarkOutOfScope = z.infer<typeof MarkOutOfScopeSchema>;

/** The visits of a request (their site conditions and permit); items name their visit by key. */
export const UpdatePricingVisitsSchema = z.object({
  visits: z
    .array(PricingVisitSchema)
    .min(1)
    .max(20)
    .refine((visits) => new Set(visits.map((v) => v.key)).size === visits.length, { error: 'A visit is listed twice' }),
});
export type UpdatePricingVisits = z.input<typeof UpdatePricingVisitsSchema>;
