import * as z from 'zod';
import { MONEY_TOTAL_FIELDS, MoneyTotalsSchema, type QuoteBreakdown } from './pricing-breakdown.schema';
import { priceQuote, type QuoteToPrice } from './price-quote';
import type { RateBook } from './rate-book.schema';

/** Totals a client shows and sends with a quote. Only `totalCents` is required; every field sent is checked. */
export const ClaimedTotalsSchema = MoneyTotalsSchema.partial()
  .required({ totalCents: true })
  .extend({
    visits: z.array(MoneyTotalsSchema.partial().extend({ key: z.string() })).optional(),
  });
export type ClaimedTotals = z.infer<typeof ClaimedTotalsSchema>;

export interface TotalsMismatch {
  /** e.g. `totalCents` or `visits[v1].extraLabourCents`. */
  path: string;
  claimedCents: number;
  computedCents: number | null;
}

export interface TotalsCheck {
  isMatch: boolean;
  mismatches: TotalsMismatch[];
  /** The authoritative breakdown, to store and to show instead of the claim. */
  breakdown: QuoteBreakdown;
}

/**
 * Recomputes the quote with the same engine the client runs and compares every claimed figure.
 * The server stores the recomputed breakdown and refuses a quote whose claim differs.
 */
export function verifyTotals(input: { rateBook: RateBook; quote: QuoteToPrice }, claimed: ClaimedTotals): TotalsCheck {
  const breakdown = priceQuote(input.rateBook, input.quote);
  const mismatches = compareTotals(breakdown, claimed);
  return { isMatch: mismatches.length === 0, mismatches, breakdown };
}

/** Every claimed figure that differs from `breakdown` (the engine's result, priced once by the caller). */
export function compareTotals(breakdown: QuoteBreakdown, claimed: ClaimedTotals): TotalsMismatch[] {
  const mismatches: TotalsMismatch[] = [];
  for (const field of MONEY_TOTAL_FIELDS) {
    const value = claimed[field];
    if (value !== undefined && value !== breakdown[field]) {
      mismatches.push({ path: field, claimedCents: value, computedCents: breakdown[field] });
    }
  }
  for (const claimedVisit of claimed.visits ?? []) {
    const visit = breakdown.visits.find((v) => v.key === claimedVisit.key);
    for (const field of MONEY_TOTAL_FIELDS) {
      const value = claimedVisit[field];
      if (value !== undefined && value !== (visit ? visit[field] : undefined)) {
        mismatches.push({ path: `visits[${claimedVisit.key}].${field}`, claimedCents: value, computedCents: visit ? visit[field] : null });
      }
    }
  }
  return mismatches;
}
