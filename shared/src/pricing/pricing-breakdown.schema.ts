import * as z from 'zod';

/** What the engine returns: every line's figures and the totals of each visit and of the quote. */

const cents = z.number().int().nonnegative();
const minutes = z.number().int().nonnegative();

export const LineBreakdownSchema = z.object({
  key: z.string(),
  entryId: z.string(),
  entryName: z.string(),
  code: z.string().nullable(),
  mode: z.enum(['time-and-materials', 'flat']),
  quantity: z.number().int().positive(),
  /** Time-and-materials labour of the line after its adders (0 for a flat line). */
  labourMinutes: minutes,
  /** The line's share of the visit's labour charge (first-hour minimum + extra labour), by minutes. */
  labourCents: cents,
  materialsCostCents: cents,
  materialsMarkupCents: cents,
  /** Materials as charged: cost plus markup. */
  materialsCents: cents,
  /** Flat-rate price of the line (0 for a time-and-materials line). */
  flatCents: cents,
});
export type LineBreakdown = z.infer<typeof LineBreakdownSchema>;

/** The money of a visit or a quote. `subtotal` is before tax; `total` includes it. */
export const MoneyTotalsSchema = z.object({
  serviceCallCents: cents,
  firstHourMinimumCents: cents,
  extraLabourCents: cents,
  flatCents: cents,
  materialsCostCents: cents,
  materialsMarkupCents: cents,
  materialsTaxCents: cents,
  permitCents: cents,
  subtotalCents: cents,
  totalCents: cents,
  /** Deposit due on a card payment, from `totalCents`. */
  depositCents: cents,
});
export type MoneyTotals = z.infer<typeof MoneyTotalsSchema>;

export const MONEY_TOTAL_FIELDS = Object.keys(MoneyTotalsSchema.shape) as (keyof MoneyTotals)[];

export const VisitBreakdownSchema = MoneyTotalsSchema.extend({
  key: z.string(),
  lines: z.array(LineBreakdownSchema),
  /** Minutes added once for the visit by per-visit site conditions. */
  visitAdderMinutes: minutes,
  /** Share of the labour charge that falls on the per-visit minutes. */
  visitAdderLabourCents: cents,
  /** All time-and-materials minutes of the visit: its lines plus the per-visit minutes. */
  pooledMinutes: minutes,
  /** Pooled minutes beyond what the first-hour minimum covers, before and after rounding up. */
  extraMinutes: minutes,
  billedExtraMinutes: minutes,
});
export type VisitBreakdown = z.infer<typeof VisitBreakdownSchema>;

export const QuoteBreakdownSchema = MoneyTotalsSchema.extend({
  visits: z.array(VisitBreakdownSchema),
  quoteValidityDays: z.number().int().positive(),
  warrantyText: z.string(),
});
export type QuoteBreakdown = z.infer<typeof QuoteBreakdownSchema>;
