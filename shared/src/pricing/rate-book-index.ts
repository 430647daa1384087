import { foldLabourAdders, type PositionedAdder } from './labour-adders';
import type { LineLabourAdders } from './price-line';
import type { RateBook, RateBookEntry } from './rate-book.schema';

/** Look-ups into one rate book, built once per rate-book object and reused by every price call. */
export interface RateBookIndex {
  readonly entries: ReadonlyMap<string, RateBookEntry>;
  readonly adders: ReadonlyMap<string, IndexedAdder>;
}

export interface IndexedAdder extends PositionedAdder {
  /** What this adder on its own does to a time-and-materials line, folded once per rate book. */
  readonly alone: LineLabourAdders;
}

const cache = new WeakMap<RateBook, RateBookIndex>();

/** The index of `book`. Rate books are treated as immutable: build a new object to change one. */
export function indexRateBook(book: RateBook): RateBookIndex {
  let index = cache.get(book);
  if (!index) {
    const entries = new Map<string, RateBookEntry>();
    for (const entry of book.entries) entries.set(entry.id, entry);
    const adders = new Map<string, IndexedAdder>();
    book.adders.forEach((adder, position) => adders.set(adder.id, { adder, position, alone: foldLabourAdders([{ adder, position }]) }));
    index = { entries, adders };
    cache.set(book, index);
  }
  return index;
}
