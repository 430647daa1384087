import { DEMO_RATE_BOOK } from '../pricing/demo-rate-book';
import { RateBookSchema } from '../pricing/rate-book.schema';
import type { Quote } from '../pricing/pricing-input.schema';
import { priceScope, scopeTotalCents, type ScopeChange } from './scope-pricing';

const book = RateBookSchema.parse(DEMO_RATE_BOOK);
const input: Quote = {
  visits: [
    { key: 'v1', adderIds: [], hasPermit: false },
    { key: 'v2', adderIds: [], hasPermit: false },
  ],
  lines: [
    { key: '1', entryId: 'gfci-replace', quantity: 1, adderIds: [], visitKey: 'v1' },
    { key: '2', entryId: 'afci-breaker-flat', quantity: 1, adderIds: [], visitKey: 'v2' },
    { key: '3', entryId: 'afci-breaker-flat', quantity: 1, adderIds: [], visitKey: 'v2' },
  ],
};

// Expected totals are docs/pricing.md's worked examples (computed by hand from the demo rate book).
describe('priceScope', () => {
  const cases: [string, string[], ScopeChange[], number][] = [
    ['every line approved: Example 4, two visits', ['1', '2', '3'], [], 80_934],
    ['only the GFCI approved: Example 1, the empty visit is not charged', ['1'], [], 31_434],
    ['the AFCI visit alone: Example 4, visit V2', ['2', '3'], [], 49_500],
    ['nothing approved', [], [], 0],
    ['a second GFCI added by change order on the first visit: Example 1 + 3,240 materials and 195 tax', ['1'], [{ kind: 'add', key: '9', entryId: 'gfci-replace', quantity: 1 }], 34_869],
    ['the GFCI quantity raised to 2 (same figures as one added)', ['1'], [{ kind: 'quantity', key: '1', quantity: 2 }], 34_869],
    ['the GFCI taken out: only the AFCI visit is left', ['1', '2', '3'], [{ kind: 'remove', key: '1' }], 49_500],
  ];
  it.each(cases)('%s', (_name, approvedKeys, changes, total) => {
    expect(scopeTotalCents({ book, input, approvedKeys, changes })).toBe(total);
  });

  it('prices a scope with nothing left as null', () => {
    expect(priceScope({ book, input, approvedKeys: ['1'], changes: [{ kind: 'remove', key: '1' }] })).toBeNull();
  });
});
