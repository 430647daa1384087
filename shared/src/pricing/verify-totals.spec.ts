// The quote and its figures are Example 4 of docs/pricing.md (computed by hand there).
import { DEMO_RATE_BOOK } from './demo-rate-book';
import { ClaimedTotalsSchema, verifyTotals } from './verify-totals';

const input = {
  rateBook: DEMO_RATE_BOOK,
  quote: {
    visits: [{ key: 'v1' }, { key: 'v2' }],
    lines: [
      { key: 'a', visitKey: 'v1', entryId: 'gfci-replace', quantity: 1 },
      { key: 'b', visitKey: 'v2', entryId: 'afci-breaker-flat', quantity: 1 },
      { key: 'c', visitKey: 'v2', entryId: 'afci-breaker-flat', quantity: 1 },
    ],
  },
};

describe('verifyTotals', () => {
  describe('when the claim matches the engine', () => {
    it('accepts it and returns the breakdown', () => {
      const check = verifyTotals(input, { totalCents: 80_934, depositCents: 40_467, visits: [{ key: 'v2', totalCents: 49_500 }] });
      expect(check.isMatch).toBe(true);
      expect(check.mismatches).toEqual([]);
      expect(check.breakdown.totalCents).toBe(80_934);
    });
  });

  describe('when the claim differs', () => {
    it.each([
      ['a total one cent off', { totalCents: 80_935 }, [{ path: 'totalCents', claimedCents: 80_935, computedCents: 80_934 }]],
      [
        'a deposit summed over visits instead of taken from the total',
        { totalCents: 80_934, depositCents: 40_468 },
        [{ path: 'depositCents', claimedCents: 40_468, computedCents: 40_467 }],
      ],
      [
        'a visit total that is wrong',
        { totalCents: 80_934, visits: [{ key: 'v1', totalCents: 31_240 }] },
        [{ path: 'visits[v1].totalCents', claimedCents: 31_240, computedCents: 31_434 }],
      ],
      [
        'a visit that is not in the quote',
        { totalCents: 80_934, visits: [{ key: 'v9', totalCents: 1 }] },
        [{ path: 'visits[v9].totalCents', claimedCents: 1, computedCents: null }],
      ],
    ])('rejects %s and names the field', (_name, claimed, mismatches) => {
      const check = verifyTotals(input, claimed);
      expect(check.isMatch).toBe(false);
      expect(check.mismatches).toEqual(mismatches);
    });
  });

  it('requires a claimed total in the request body', () => {
    expect(ClaimedTotalsSchema.safeParse({ depositCents: 1 }).success).toBe(false);
    expect(ClaimedTotalsSchema.safeParse({ totalCents: 80_934 }).success).toBe(true);
  });
});
