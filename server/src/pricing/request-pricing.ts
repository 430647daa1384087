import { PricingError, priceQuote, type LineBreakdown, type PricingVisit, type Quote, type QuoteBreakdown } from '@cc/shared';
import type { StoredPricingItem } from './item-pricing.repository';
import { engineId } from '../rate-book/engine-rate-book';
import type { LoadedRateBook } from '../rate-book/rate-book.service';

/** The visit every item is on until the contractor plans more than one. */
export const DEFAULT_VISIT_KEY = 'visit-1';

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

/** The quantity an item is priced at: the contractor's, else the report's; null while unknown. */
export function effectiveQuantity(item: Pick<StoredPricingItem, 'pricingQuantity' | 'quantity'>): number | null {
  return item.pricingQuantity ?? item.quantity;
}

/** The visits of a request: those planned, or the single default visit. */
export function visitsOrDefault(visits: readonly PricingVisit[]): PricingVisit[] {
  return visits.length ? [...visits] : [{ key: DEFAULT_VISIT_KEY, adderIds: [], hasPermit: false }];
}

/** Whether the item is a line of the priced total. */
export function isPricedLine(item: StoredPricingItem, liveEntryIds: ReadonlySet<number>): boolean {
  return (item.status === 'open' || item.status === 'priced') && item.entryId !== null && liveEntryIds.has(item.entryId) && effectiveQuantity(item) !== null;
}

/**
 * Prices the request's items (those with a live entry and a quantity) in their visits. Adders
 * that are no longer in the rate book are left out; visits without items are not priced.
 */
export function priceRequest(loaded: LoadedRateBook, items: readonly StoredPricingItem[], plannedVisits: readonly PricingVisit[]): PricedRequest {
  const liveEntryIds = new Set(loaded.entries.map((e) => e.id));
  const liveAdderIds = new Set(loaded.adders.map((a) => a.id));
  const liveAdders = (ids: readonly number[]) => ids.filter((id) => liveAdderIds.has(id)).map(engineId);
  const visits = visitsOrDefault(plannedVisits);

  const lineItems = items.filter((item) => isPricedLine(item, liveEntryIds));
  const unpricedItemIds = items.filter((i) => (i.status === 'open' || i.status === 'priced') && !lineItems.includes(i)).map((i) => i.id);
  const empty = { input: null, breakdown: null, problem: null, lineByItem: new Map<number, LineBreakdown>(), unpricedItemIds };
  if (lineItems.length === 0) return empty;

  const used = new Set(lineItems.map((i) => i.visitKey));
  for (const key of used) if (!visits.some((v) => v.key === key)) visits.push({ key, adderIds: [], hasPermit: false });
  const input: Quote = {
    visits: visits.filter((v) => used.has(v.key)).map((v) => ({ key: v.key, adderIds: liveAdders(v.adderIds), hasPermit: v.hasPermit })),
    lines: lineItems.map((item) => ({
      key: String(item.id),
      entryId: engineId(item.entryId as number),
      quantity: effectiveQuantity(item) as number,
      adderIds: liveAdders(item.adderIds),
      visitKey: item.visitKey,
    })),
  };
  try {
    const breakdown = priceQuote(loaded.book, input);
    const lineByItem = new Map<number, LineBreakdown>();
    for (const visit of breakdown.visits) for (const line of visit.lines) lineByItem.set(Number(line.key), line);
    return { input, breakdown, problem: null, lineByItem, unpricedItemIds };
  } catch (err) {
    if (!(err instanceof PricingError)) throw err;
    const lineIndex = err.path[0] === 'lines' && typeof err.path[1] === 'number' ? err.path[1] : null;
    const visitLine = err.path[0] === 'visits' && err.path[2] === 'lines' && typeof err.path[3] === 'number' ? err.path[3] : null;
    let itemId: number | null = lineIndex !== null ? lineItems[lineIndex]?.id ?? null : null;
    if (visitLine !== null && typeof err.path[1] === 'number') {
      const visitKey = input.visits[err.path[1]]?.key;
      itemId = lineItems.filter((i) => i.visitKey === visitKey)[visitLine]?.id ?? null;
    }
    return { ...empty, input, problem: { itemId, message: err.message } };
  }
}

/** The line's own money: its labour share, materials with markup and flat price. */
export function lineCents(line: LineBreakdown): number {
  return line.labourCents + line.materialsCents + line.flatCents;
}
