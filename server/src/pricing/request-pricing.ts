import { linesToPrice, PricingError, priceQuote, type LineBreakdown, type PricingVisit, type Quote, type QuoteBreakdown } from '@cc/shared';
import type { StoredPricingItem } from './item-pricing.repository';
import type { LoadedRateBook } from '../rate-book/rate-book.service';

/** A request's items priced with the shared engine. */
export interface PricedRequest {
  /** What the engine priced (null when no item is priced yet). */
  input: Quote | null;
  breakdown: QuoteBreakdown | null;
  /** A stored choice the engine refuses, with the item it is on. */
  problem: { itemId: number | null; message: string } | null;
  lineByItem: Map<number, LineBreakdown>;
  /** Open or priced items without a live entry: they hold up the quote. */
  unpricedItemIds: number[];
}

/**
 * Prices the request's items with the shared engine: the lines are those the shared rule chooses
 * (`linesToPrice`, the same the portal prices live), site conditions no longer in the rate book are
 * left out, visits without items are not priced. A refusal of the engine is named with its item.
 */
export function priceRequest(loaded: LoadedRateBook, items: readonly StoredPricingItem[], plannedVisits: readonly PricingVisit[]): PricedRequest {
  const live = { entryIds: new Set(loaded.entries.map((e) => e.id)), adderIds: new Set(loaded.adders.map((a) => a.id)) };
  const { quote: input, lines, unpricedItemIds } = linesToPrice(items, plannedVisits, live);
  const empty = { input: null, breakdown: null, problem: null, lineByItem: new Map<number, LineBreakdown>(), unpricedItemIds };
  if (!input) return empty;
  try {
    const breakdown = priceQuote(loaded.book, input);
    const lineByItem = new Map<number, LineBreakdown>();
    for (const visit of breakdown.visits) for (const line of visit.lines) lineByItem.set(Number(line.key), line);
    return { input, breakdown, problem: null, lineByItem, unpricedItemIds };
  } catch (err) {
    if (!(err instanceof PricingError)) throw err;
    const lineIndex = err.path[0] === 'lines' && typeof err.path[1] === 'number' ? err.path[1] : null;
    const visitLine = err.path[0] === 'visits' && err.path[2] === 'lines' && typeof err.path[3] === 'number' ? err.path[3] : null;
    let itemId: number | null = lineIndex !== null ? lines[lineIndex]?.id ?? null : null;
    if (visitLine !== null && typeof err.path[1] === 'number') {
      const visitKey = input.visits[err.path[1]]?.key;
      itemId = lines.filter((i) => i.visitKey === visitKey)[visitLine]?.id ?? null;
    }
    return { ...empty, input, problem: { itemId, message: err.message } };
  }
}
