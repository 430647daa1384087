import * as z from 'zod';
import { RecordIdSchema } from '../http/bounds';
import { ItemStatusSchema } from '../items/item-status';
import { ItemEditionNoteSchema } from '../items/line-item.schema';
import { QuoteBreakdownSchema } from '../pricing/pricing-breakdown.schema';
import { QuoteSchema } from '../pricing/pricing-input.schema';
import { RateBookSchema } from '../pricing/rate-book.schema';
import { RequestStatusSchema } from '../requests/request-status.schema';

/** Key of a visit of a request (`visit-1`, `visit-2`, or the contractor's own word). */
export const VisitKeySchema = z
  .string()
  .regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, 'Use lower-case letters, digits and single hyphens')
  .max(40);

export const PricingVisitSchema = z.object({
  key: VisitKeySchema,
  /** Site conditions for the whole visit (rate-book adder ids). */
  adderIds: z.array(RecordIdSchema).max(20).default([]),
  /** Whether a permit is pulled for the work of this visit. */
  hasPermit: z.boolean().default(false),
});
export type PricingVisit = z.infer<typeof PricingVisitSchema>;

/** One line item as the contractor prices it. */
export const PricingItemSchema = z.object({
  id: z.number().int(),
  /** Optimistic-concurrency version of the item: send it back with every change. */
  version: z.number().int(),
  code: z.string(),
  room: z.string(),
  location: z.string(),
  /** The quantity the report gave; null when it said "several". */
  quantity: z.number().int().nullable(),
  status: ItemStatusSchema,
  entryId: z.number().int().nullable(),
  adderIds: z.array(z.number().int()),
  /** The contractor's own quantity (null: the report's). The quantity priced is `effectiveQuantity(item)`. */
  pricingQuantity: z.number().int().nullable(),
  /** Whether the report gave no quantity and 1 was assumed when the entry was set: check it. */
  isQuantityAssumed: z.boolean(),
  visitKey: z.string(),
  outOfScopeReason: z.string().nullable(),
  /** The entry auto-pricing would choose: the first entry of the rate book for the item's code. */
  suggestedEntryId: z.number().int().nullable(),
  /** Whether the item is a line of the priced total. */
  isPriced: z.boolean(),
  /** The line's labour share, materials and flat price (no service call, permit or tax). */
  lineCents: z.number().int().nullable(),
  /** The code in force when the house was built and the adopted edition, for this item (information). */
  editionNote: ItemEditionNoteSchema.nullable(),
});
export type PricingItem = z.infer<typeof PricingItemSchema>;

/**
 * A request's items with their pricing, the rate book the portal needs to recompute live, the
 * engine input the server priced and its breakdown. Engine ids are the API ids as strings: entry
 * `12` is `"12"` in `rateBook` and `pricingInput`, item `40` is line key `"40"`.
 */
export const RequestPricingSchema = z.object({
  requestId: z.number().int(),
  status: RequestStatusSchema,
  /** Whether the signed-in user may change the pricing now (assigned contractor, request in pricing or quoted). */
  canEdit: z.boolean(),
  items: z.array(PricingItemSchema),
  visits: z.array(PricingVisitSchema),
  rateBook: RateBookSchema.nullable(),
  pricingInput: QuoteSchema.nullable(),
  breakdown: QuoteBreakdownSchema.nullable(),
  /** A stored choice the engine refuses (e.g. a labour adder on a flat entry), with the item it is on. */
  problem: z.object({ itemId: z.number().int().nullable(), message: z.string() }).nullable(),
  /** Open items that still need an entry (or "not our scope") before the quote can be sent. */
  unpricedItemIds: z.array(z.number().int()),
  currentQuoteVersion: z.number().int().nullable(),
});
export type RequestPricing = z.infer<typeof RequestPricingSchema>;
