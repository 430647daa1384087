// Quote rules of docs/pricing.md section 1.4; figures of Example 1 (section 3, computed by hand).
import { DEMO_RATE_BOOK } from './demo-rate-book';
import { PricingError } from './pricing-error';
import { priceQuote, type QuoteToPrice } from './price-quote';

const gfci = (key: string, visitKey: string) => ({ key, visitKey, entryId: 'gfci-replace', quantity: 1 });

describe('priceQuote', () => {
  it('gives each visit its own service call and first-hour minimum', () => {
    // Two GFCIs on two visits: 2 × Example 1 = 2 × 31,434
    const quote = priceQuote(DEMO_RATE_BOOK, { visits: [{ key: 'v1' }, { key: 'v2' }], lines: [gfci('a', 'v1'), gfci('b', 'v2')] });
    expect(quote).toMatchObject({ serviceCallCents: 19_000, firstHourMinimumCents: 37_000, totalCents: 62_868 });
    expect(quote.visits.map((v) => v.lines.map((l) => l.key))).toEqual([['a'], ['b']]);
  });

  it('carries the rate book’s quote validity and warranty', () => {
    const quote = priceQuote(DEMO_RATE_BOOK, { visits: [{ key: 'v1' }], lines: [gfci('a', 'v1')] });
    expect(quote.quoteValidityDays).toBe(30);
    expect(quote.warrantyText).toBe(DEMO_RATE_BOOK.terms.warrantyText);
  });

  it.each<[string, QuoteToPrice, string, (string | number)[]]>([
    ['a line on a visit that is not there', { visits: [{ key: 'v1' }], lines: [gfci('a', 'v1'), gfci('b', 'v9')] }, 'unknown-visit', ['lines', 1, 'visitKey']],
    ['a repeated visit', { visits: [{ key: 'v1' }, { key: 'v1' }], lines: [gfci('a', 'v1')] }, 'duplicate-visit', ['visits', 1, 'key']],
    ['a visit with no items', { visits: [{ key: 'v1' }, { key: 'v2' }], lines: [gfci('a', 'v1')] }, 'empty-visit', ['visits', 1, 'lines']],
    ['an unknown entry on the second visit', { visits: [{ key: 'v1' }, { key: 'v2' }], lines: [gfci('a', 'v1'), { ...gfci('b', 'v2'), entryId: 'nope' }] }, 'unknown-entry', ['visits', 1, 'lines', 0, 'entryId']],
  ])('throws a PricingError for %s', (_name, quote, reason, path) => {
    expect(() => priceQuote(DEMO_RATE_BOOK, quote)).toThrow(PricingError);
    expect(() => priceQuote(DEMO_RATE_BOOK, quote)).toThrow(expect.objectContaining({ reason, path }));
  });
});
