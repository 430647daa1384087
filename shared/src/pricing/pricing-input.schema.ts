import * as z from 'zod';
import { QuantitySchema } from '../http/bounds';

/** What the engine prices: lines that name rate-book entries, grouped into visits. */

const key = z.string().trim().min(1).max(80);
const adderIds = z.array(z.string().min(1).max(60)).max(20);

export const PricingLineSchema = z.object({
  /** The caller's id for the line (a line item id), echoed in the breakdown. */
  key,
  entryId: z.string().min(1).max(60),
  quantity: QuantitySchema,
  /** Site conditions that apply to this line (rate-book adder ids). */
  adderIds: adderIds.default([]),
});
export type PricingLine = z.infer<typeof PricingLineSchema>;

/** Adds an issue for every key of `items` that an earlier item already used. */
function refuseRepeatedKeys(items: readonly { key: string }[], what: string, path: string, ctx: z.RefinementCtx): void {
  const seen = new Set<string>();
  items.forEach((item, i) => {
    if (seen.has(item.key)) ctx.addIssue({ code: 'custom', path: [path, i, 'key'], message: `${what} "${item.key}" is listed twice` });
    seen.add(item.key);
  });
}

export const VisitSchema = z
  .object({
    key,
    lines: z.array(PricingLineSchema).min(1).max(500),
    /** Site conditions for the visit as a whole (e.g. a panel shutoff). */
    adderIds: adderIds.default([]),
    /** Whether a permit is pulled for work on this visit (one permit line, per the rate book). */
    hasPermit: z.boolean().default(false),
  })
  .superRefine((visit, ctx) => refuseRepeatedKeys(visit.lines, 'Line', 'lines', ctx));
export type Visit = z.infer<typeof VisitSchema>;

/** A quote: its items, each assigned to one of its visits. */
export const QuoteSchema = z
  .object({
    visits: z
      .array(
        z.object({
          key,
          adderIds: adderIds.default([]),
          hasPermit: z.boolean().default(false),
        }),
      )
      .min(1)
      .max(50),
    lines: z.array(PricingLineSchema.extend({ visitKey: key })).min(1).max(2_000),
  })
  .superRefine((quote, ctx) => {
    refuseRepeatedKeys(quote.visits, 'Visit', 'visits', ctx);
    refuseRepeatedKeys(quote.lines, 'Line', 'lines', ctx);
    const visitKeys = new Set(quote.visits.map((v) => v.key));
    const used = new Set<string>();
    quote.lines.forEach((line, i) => {
      if (!visitKeys.has(line.visitKey)) {
        ctx.addIssue({ code: 'custom', path: ['lines', i, 'visitKey'], message: `No visit "${line.visitKey}" in this quote` });
      }
      used.add(line.visitKey);
    });
    quote.visits.forEach((v, i) => {
      if (!used.has(v.key)) ctx.addIssue({ code: 'custom', path: ['visits', i], message: `Visit "${v.key}" has no items` });
    });
  });
export type Quote = z.infer<typeof QuoteSchema>;
export type QuoteInput = z.input<typeof QuoteSchema>;
export type QuoteLine = Quote['lines'][number];
