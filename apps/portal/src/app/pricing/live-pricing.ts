import {
  applyPricingChange,
  ClaimedTotals,
  lineCents,
  linesToPrice,
  MONEY_TOTAL_FIELDS,
  PricingChange,
  PricingError,
  PricingItem,
  priceQuote,
  QuoteBreakdown,
  QuoteToPrice,
  RequestPricing,
} from '@cc/shared';

/** One change the contractor is about to apply to several items (the body of a bulk change). */
export interface PendingChange {
  itemIds: readonly number[];
  set: PricingChange;
}

/** What the shared engine makes of the items as the contractor sees them now. */
export interface LivePrice {
  /** Null when no item is priced yet (or the engine refused the choice). */
  breakdown: QuoteBreakdown | null;
  /** Why the engine refused the items as they stand (e.g. a labour adder on a flat entry). */
  problem: string | null;
}

/** The items with a pending change applied, by the shared rule the server applies it with. */
export function applyChange(items: readonly PricingItem[], change: PendingChange | null): PricingItem[] {
  return change ? applyPricingChange(items, change.itemIds, change.set) : [...items];
}

/** The engine input for a request's items, chosen by the shared rule the server prices with. */
export function quoteToPrice(pricing: RequestPricing, items: readonly PricingItem[]): QuoteToPrice | null {
  const book = pricing.rateBook;
  if (!book) return null;
  const live = { entryIds: new Set(book.entries.map((e) => Number(e.id))), adderIds: new Set(book.adders.map((a) => Number(a.id))) };
  return linesToPrice(items, pricing.visits, live).quote;
}

/** Prices the request's items (with a pending change, if any) with the shared engine, as the server will. */
export function livePrice(pricing: RequestPricing, change: PendingChange | null = null): LivePrice {
  const input = quoteToPrice(pricing, applyChange(pricing.items, change));
  if (!input || !pricing.rateBook) return { breakdown: null, problem: null };
  try {
    return { breakdown: priceQuote(pricing.rateBook, input), problem: null };
  } catch (err: unknown) {
    if (err instanceof PricingError) return { breakdown: null, problem: err.message };
    throw err;
  }
}

/** The totals the contractor sees, sent with a change so the server can refuse it if its own differ. */
export function claimedTotals(breakdown: QuoteBreakdown | null): ClaimedTotals {
  if (!breakdown) return { totalCents: 0 };
  const claimed: ClaimedTotals = { totalCents: breakdown.totalCents };
  for (const field of MONEY_TOTAL_FIELDS) claimed[field] = breakdown[field];
  claimed.visits = breakdown.visits.map((v) => ({ key: v.key, totalCents: v.totalCents }));
  return claimed;
}

/** A line's own money from the breakdown: its labour share, materials and flat price. */
export function lineCentsOf(breakdown: QuoteBreakdown | null, itemId: number): number | null {
  for (const visit of breakdown?.visits ?? []) {
    const line = visit.lines.find((l) => l.key === String(itemId));
    if (line) return lineCents(line);
  }
  return null;
}
