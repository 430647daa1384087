import type { QuoteBreakdown } from '../pricing/pricing-breakdown.schema';
import type { Quote } from '../pricing/pricing-input.schema';
import { priceQuote } from '../pricing/price-quote';
import type { RateBook } from '../pricing/rate-book.schema';

/**
 * One change to the approved scope, as a change order carries it: a new line (an item found on
 * site), a new quantity for an approved line, or an approved line taken out (it cannot be done).
 * `key` is the line item id as a string, as in the priced quote.
 */
export type ScopeChange =
  | { kind: 'add'; key: string; entryId: string; quantity: number; adderIds?: readonly string[] }
  | { kind: 'quantity'; key: string; quantity: number }
  | { kind: 'remove'; key: string };

/** What the scope is priced from: the quote as priced, which of its lines are approved, and the changes since. */
export interface ScopeToPrice {
  /** The rate book the quote was priced with (kept with the quote version). */
  book: RateBook;
  /** The quote's priced input. */
  input: Quote;
  /** Keys of the lines the seller approved. */
  approvedKeys: readonly string[];
  /** Approved change orders' changes, oldest first. */
  changes?: readonly ScopeChange[];
}

/**
 * The approved scope priced by the shared engine: the quote's lines the seller approved, each
 * change applied in order, on the quote's visits (added lines go on the first visit). Visits left
 * without lines are not priced (no service call for a visit with nothing to do). Null when nothing
 * is left to do.
 */
export function priceScope(scope: ScopeToPrice): QuoteBreakdown | null {
  const approved = new Set(scope.approvedKeys);
  let lines = scope.input.lines.filter((l) => approved.has(l.key)).map((l) => ({ ...l, adderIds: [...l.adderIds] }));
  const firstVisit = scope.input.visits[0]?.key;
  for (const change of scope.changes ?? []) {
    if (change.kind === 'add') {
      lines = lines.filter((l) => l.key !== change.key);
      lines.push({ key: change.key, entryId: change.entryId, quantity: change.quantity, adderIds: [...(change.adderIds ?? [])], visitKey: firstVisit });
    } else if (change.kind === 'quantity') {
      lines = lines.map((l) => (l.key === change.key ? { ...l, quantity: change.quantity } : l));
    } else {
      lines = lines.filter((l) => l.key !== change.key);
    }
  }
  if (lines.length === 0) return null;
  const used = new Set(lines.map((l) => l.visitKey));
  return priceQuote(scope.book, { visits: scope.input.visits.filter((v) => used.has(v.key)), lines });
}

/** The total of the scope in cents (0 when nothing is left to do). */
export function scopeTotalCents(scope: ScopeToPrice): number {
  return priceScope(scope)?.totalCents ?? 0;
}
