import {
  ClaimedTotals,
  MONEY_TOTAL_FIELDS,
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
  set: {
    entryId?: number | null;
    adderIds?: readonly number[];
    quantity?: number;
    visitKey?: string;
  };
}

/** What the shared engine makes of the items as the contractor sees them now. */
export interface LivePrice {
  /** Null when no item is priced yet (or the engine refused the choice). */
  breakdown: QuoteBreakdown | null;
  /** Why the engine refused the items as they stand (e.g. a labour adder on a flat entry). */
  problem: string | null;
}

/** The items with a pending change applied, the way the server applies it. */
export function applyChange(items: readonly PricingItem[], change: PendingChange | null): PricingItem[] {
  if (!change) return [...items];
  const ids = new Set(change.itemIds);
  const { set } = change;
  return items.map((item) => {
    if (!ids.has(item.id)) return item;
    const next: PricingItem = { ...item };
    if (set.entryId !== undefined) {
      next.entryId = set.entryId;
      if (set.entryId !== null && item.status === 'out-of-scope') Object.assign(next, { status: 'open', outOfScopeReason: null });
      if (set.entryId !== null && set.quantity === undefined && item.pricingQuantity === null) {
        Object.assign(next, { pricingQuantity: 1, isQuantityAssumed: true });
      }
    }
    if (set.quantity !== undefined) Object.assign(next, { pricingQuantity: set.quantity, isQuantityAssumed: false });
    if (set.adderIds !== undefined) next.adderIds = [...new Set(set.adderIds)];
    if (set.visitKey !== undefined) next.visitKey = set.visitKey;
    return next;
  });
}

/**
 * The engine input for a request's items: every open or priced item with an entry of the rate book
 * and a quantity is a line on its visit; conditions no longer in the rate book are left out; visits
 * without lines are not priced. The same selection the server makes before it prices.
 */
export function quoteToPrice(pricing: RequestPricing, items: readonly PricingItem[]): QuoteToPrice | null {
  const book = pricing.rateBook;
  if (!book) return null;
  const entryIds = new Set(book.entries.map((e) => e.id));
  const adderIds = new Set(book.adders.map((a) => a.id));
  const liveAdders = (ids: readonly number[]) => ids.map(String).filter((id) => adderIds.has(id));
  const lines = items.filter(
    (i) => (i.status === 'open' || i.status === 'priced') && i.entryId !== null && entryIds.has(String(i.entryId)) && i.pricingQuantity !== null,
  );
  if (lines.length === 0) return null;
  const used = new Set(lines.map((i) => i.visitKey));
  const visits = pricing.visits.filter((v) => used.has(v.key)).map((v) => ({ key: v.key, adderIds: liveAdders(v.adderIds), hasPermit: v.hasPermit }));
  for (const key of used) if (!visits.some((v) => v.key === key)) visits.push({ key, adderIds: [], hasPermit: false });
  return {
    visits,
    lines: lines.map((i) => ({
      key: String(i.id),
      entryId: String(i.entryId),
      quantity: i.pricingQuantity as number,
      adderIds: liveAdders(i.adderIds),
      visitKey: i.visitKey,
    })),
  };
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
    if (line) return line.labourCents + line.materialsCents + line.flatCents;
  }
  return null;
}
