import * as z from 'zod';
import { QuantitySchema } from '../http/bounds';

/** A ballpark asks for a range from finding codes before a contractor prices anything. */
export const BallparkRequestSchema = z.object({
  items: z
    .array(
      z.object({
        code: z.string().min(1).max(60),
        /** Null when the report says "several" or "multiple". */
        quantity: QuantitySchema.nullable(),
      }),
    )
    .min(1)
    .max(200),
  /** Year the house was built; null when not known. */
  yearBuilt: z.number().int().min(1700).max(2100).nullable(),
  /** Site conditions already known (rate-book adder ids); they apply to the whole request. */
  siteAdderIds: z.array(z.string().min(1).max(60)).max(20).default([]),
});
export type BallparkRequest = z.infer<typeof BallparkRequestSchema>;

export const BALLPARK_LABEL = 'Estimate, not a quote';

const side = z.object({
  /** Before rounding to the ballpark step. */
  exactCents: z.number().int().nonnegative(),
  visits: z.number().int().nonnegative(),
  labourMinutes: z.number().int().nonnegative(),
});

export const BallparkSchema = z.object({
  kind: z.literal('estimate'),
  label: z.literal(BALLPARK_LABEL),
  /** Low figure rounded down and high figure rounded up to whole steps (R6). */
  lowCents: z.number().int().nonnegative(),
  highCents: z.number().int().nonnegative(),
  low: side,
  high: side,
  /** Codes the rate book has no entry for: left out of the range. */
  unpricedCodes: z.array(z.string()),
  /** Site conditions each side assumed (adder ids). */
  lowAdderIds: z.array(z.string()),
  highAdderIds: z.array(z.string()),
});
export type Ballpark = z.infer<typeof BallparkSchema>;
