// Property test: a ballpark range from a rate book must hold the total of any quote for the same
// items priced from the same book the way a contractor prices them (one entry of the rate book per
// finding, as auto-pricing and the group change set them; the report's quantity or 1 when it gave
// none; the work on one visit; none or some of the site conditions flagged on the request). A quote can only leave the range through what the range could
// not know (conditions nobody flagged, more visits than needed, a quantity found on site).
import fc from 'fast-check';
import { ballpark, DEMO_RATE_BOOK, priceQuote, type RateBook, type RateBookEntry } from '@cc/shared';

const book: RateBook = DEMO_RATE_BOOK;
const byCode = new Map<string, RateBookEntry[]>();
for (const entry of book.entries) if (entry.code) byCode.set(entry.code, [...(byCode.get(entry.code) ?? []), entry]);
const codes = [...byCode.keys()];
const flaggable = book.adders.filter((a) => a.appliesWhenBuiltBefore === null).map((a) => a.id);

const itemArb = fc.record({
  code: fc.constantFrom(...codes),
  quantity: fc.option(fc.integer({ min: 1, max: 8 }), { nil: null }),
});

const caseArb = fc.record({
  items: fc.array(itemArb, { minLength: 1, maxLength: 12 }),
  /** Which of each finding's entries the contractor picks (by position, one per code). */
  picks: fc.array(fc.nat(), { minLength: codes.length, maxLength: codes.length }),
  yearBuilt: fc.option(fc.integer({ min: 1900, max: 2025 }), { nil: null }),
  flagged: fc.subarray(flaggable, { maxLength: 3 }),
  useFlagged: fc.boolean(),
});

describe('ballpark against the quote for the same items and rate book', () => {
  it('holds the priced total: low ≤ quote ≤ high (fast-check, 400 random item sets)', () => {
    fc.assert(
      fc.property(caseArb, ({ items, picks, yearBuilt, flagged, useFlagged }) => {
        const range = ballpark(book, { yearBuilt, siteAdderIds: flagged, items: items.map(({ code, quantity }) => ({ code, quantity })) });
        const quote = priceQuote(book, {
          visits: [{ key: 'visit-1', adderIds: useFlagged ? flagged : [] }],
          lines: items.map((item, i) => {
            const candidates = byCode.get(item.code)!;
            return { key: `line-${i}`, entryId: candidates[picks[codes.indexOf(item.code)] % candidates.length].id, quantity: item.quantity ?? 1, visitKey: 'visit-1' };
          }),
        });
        expect(range.lowCents).toBeLessThanOrEqual(quote.totalCents);
        expect(quote.totalCents).toBeLessThanOrEqual(range.highCents);
      }),
      { numRuns: 400 },
    );
  });

  it('holds the quote for an older house whose quote leaves out the age condition', () => {
    // built-before-1960 is tied to the age of the house; a contractor who finds no old wiring on site
    // does not charge it, so the easy side must not assume it.
    const items = [{ code: 'receptacle-damaged', quantity: 4 }];
    const range = ballpark(book, { yearBuilt: 1948, items });
    const entry = byCode.get('receptacle-damaged')![0];
    const quote = priceQuote(book, { visits: [{ key: 'v' }], lines: [{ key: 'l', entryId: entry.id, quantity: 4, visitKey: 'v' }] });
    expect(range.lowCents).toBeLessThanOrEqual(quote.totalCents);
    expect(range.highAdderIds).toEqual(['built-before-1960']);
  });
});
