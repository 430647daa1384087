import type { QuoteVersionLine } from '@cc/shared';
import { compareQuotes, type ComparableQuote } from '../../server/src/quotes/quote-changes';

type Line = ComparableQuote['lines'][number];

function line(lineItemId: number, lineCents: number, extra: Partial<QuoteVersionLine> = {}): Line {
  return {
    lineItemId,
    kind: 'priced',
    code: `code-${lineItemId}`,
    location: `place ${lineItemId}`,
    lineCents,
    quantity: 1,
    entry: { id: 7, key: 'entry', version: 1, name: 'Entry', unit: 'device', mode: 'time-and-materials' },
    ...extra,
  };
}

describe('compareQuotes', () => {
  const previous: ComparableQuote = { version: 1, totalCents: 50_000, lines: [line(1, 20_000), line(2, 10_000), line(3, 5_000)] };

  it('lists items added, removed and changed, and the signed change of the total', () => {
    const current: ComparableQuote = {
      version: 2,
      totalCents: 47_500,
      lines: [line(1, 20_000), line(2, 12_500, { quantity: 2 }), line(4, 3_000), line(3, 0, { kind: 'out-of-scope', entry: null })],
    };
    const changes = compareQuotes(previous, current);
    expect(changes.previousVersion).toBe(1);
    expect(changes.added).toEqual([{ lineItemId: 4, code: 'code-4', location: 'place 4', lineCents: 3_000 }]);
    // An item declined as not in scope counts as removed from the priced work.
    expect(changes.removed).toEqual([{ lineItemId: 3, code: 'code-3', location: 'place 3', lineCents: 5_000 }]);
    expect(changes.changed).toEqual([
      { lineItemId: 2, code: 'code-2', location: 'place 2', lineCents: 12_500, previousLineCents: 10_000, quantity: 2, previousQuantity: 1, entryName: 'Entry', previousEntryName: 'Entry' },
    ]);
    expect([changes.previousTotalCents, changes.totalDeltaCents]).toEqual([50_000, -2_500]);
  });

  it('counts a new entry version as a change even at the same price', () => {
    const current: ComparableQuote = { ...previous, version: 2, lines: [line(1, 20_000, { entry: { id: 7, key: 'entry', version: 2, name: 'Entry', unit: 'device', mode: 'time-and-materials' } }), line(2, 10_000), line(3, 5_000)] };
    expect(compareQuotes(previous, current).changed.map((c) => c.lineItemId)).toEqual([1]);
  });

  it('reports nothing for an identical version', () => {
    expect(compareQuotes(previous, { ...previous, version: 2 })).toMatchObject({ added: [], removed: [], changed: [], totalDeltaCents: 0 });
  });
});
