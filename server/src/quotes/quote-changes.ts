import type { QuoteChanges, QuoteVersionLine } from '@cc/shared';

type Line = Pick<QuoteVersionLine, 'lineItemId' | 'kind' | 'code' | 'location' | 'lineCents' | 'quantity' | 'entry'>;

/** A quote version as the comparison needs it. */
export interface ComparableQuote {
  version: number;
  totalCents: number;
  lines: readonly Line[];
}

const keyOf = (line: Line, index: number) => (line.lineItemId === null ? `line-${index}` : `item-${line.lineItemId}`);
const brief = (line: Line) => ({ lineItemId: line.lineItemId, code: line.code, location: line.location, lineCents: line.lineCents });

/**
 * What `current` changed against `previous`: priced items added and removed (declining an item as
 * not in scope removes it), items whose price, quantity or entry changed, and the change of the total.
 */
export function compareQuotes(previous: ComparableQuote, current: ComparableQuote): QuoteChanges {
  const pricedOf = (quote: ComparableQuote) => new Map(quote.lines.map((l, i) => [keyOf(l, i), l] as const).filter(([, l]) => l.kind === 'priced'));
  const before = pricedOf(previous);
  const after = pricedOf(current);
  const changes: QuoteChanges = {
    previousVersion: previous.version,
    added: [],
    removed: [],
    changed: [],
    previousTotalCents: previous.totalCents,
    totalDeltaCents: current.totalCents - previous.totalCents,
  };
  for (const [key, line] of after) {
    const old = before.get(key);
    if (!old) changes.added.push(brief(line));
    else if (old.lineCents !== line.lineCents || old.quantity !== line.quantity || old.entry?.id !== line.entry?.id || old.entry?.version !== line.entry?.version) {
      changes.changed.push({
        ...brief(line),
        previousLineCents: old.lineCents,
        quantity: line.quantity,
        previousQuantity: old.quantity,
        entryName: line.entry?.name ?? null,
        previousEntryName: old.entry?.name ?? null,
      });
    }
  }
  for (const [key, line] of before) if (!after.has(key)) changes.removed.push(brief(line));
  return changes;
}
