import { z } from 'zod';

/** What the engine prices: lines that name rate-book entries, grouped into visits. */

const key = z.string().trim().min(1).max(80);
const adderIds = z.array(z.string().min(1).max(60)).max(20);

export const PricingLineSchema = z.object({
  /** The caller's id for the line (a line item id), echoed in the breakdown. */
  key,
  entryId: z.string().min(1).max(60),
  quantity: z.number().int().min(1).max(999),
  /** Site conditions that apply to this line (rate-book adder ids). */
  adderIds: adderIds.default([]),
});
export type PricingLine = z.infer<typeof PricingLineSchema>;

export const VisitSchema = z.object({
  key,
  lines: z.array(PricingLineSchema).min(1).max(500),
  /** Site conditions for the visit as a whole (e.g. a panel shutoff). */
  adderIds: adderIds.default([]),
  /** Whether a permit is pulled for work on this visit (one permit line, per the rate book). */
  hasPermit: z.boolean().default(false),
});
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
    const visitKeys = new Set<string>();
    quote.visits.forEach((v, i) => {
      if (visitKeys.has(v.key)) ctx.addIssue({ code: 'custom', path: ['visits', i, 'key'], message: `Visit "${v.key}" is listed twice` });
      visitKeys.add(v.key);
    });
    const lineKeys = new Set<string>();
    const used = new Set<string>();
    quote.lines.forEach((line, i) => {
      if (lineKeys.has(line.key)) ctx.addIssue({ code: 'custom', path: ['lines', i, 'key'], message: `Line "${line.key}" is listed twice` });
      lineKeys.add(line.key);
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
