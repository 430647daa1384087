import { priceQuote } from '@cc/shared';
import { applyChange, claimedTotals, lineCentsOf, livePrice, quoteToPrice } from './live-pricing';
import { pricingItem, requestPricing, SMALL_BOOK } from './testing/pricing-fixtures';

describe('livePrice', () => {
  it('prices one GFCI on its own visit as worked example 1 of docs/pricing.md', () => {
    const pricing = requestPricing([pricingItem(40, { entryId: 11 }), pricingItem(41)]);
    const { breakdown, problem } = livePrice(pricing);
    expect(problem).toBeNull();
    // docs/pricing.md, Example 1 (computed by hand): 31,434 cents, deposit 15,717.
    expect(breakdown?.totalCents).toBe(31_434);
    expect(breakdown?.depositCents).toBe(15_717);
    expect(lineCentsOf(breakdown, 40)).toBe(18_500 + 2_400 + 840);
    expect(lineCentsOf(breakdown, 41)).toBeNull();
  });

  it('prices a pending change to two items at once as worked example 2', () => {
    const pricing = requestPricing([pricingItem(40, { entryId: 11 }), pricingItem(41)]);
    const { breakdown } = livePrice(pricing, { itemIds: [40, 41], set: { entryId: 11, adderIds: [21] } });
    // docs/pricing.md, Example 2: two GFCIs in shallow boxes on one visit: 44,994, deposit 22,497;
    // line labour shares 14,313 and 14,312 (largest remainder to the earlier line).
    expect(breakdown?.totalCents).toBe(44_994);
    expect(breakdown?.depositCents).toBe(22_497);
    expect(breakdown?.visits[0].lines.map((l) => l.labourCents)).toEqual([14_313, 14_312]);
  });

  it('gives the same figures as the shared engine run on the same lines directly', () => {
    const items = [pricingItem(40, { entryId: 12, quantity: 2, pricingQuantity: 2 }), pricingItem(42, { code: 'double-tap', entryId: 13, adderIds: [22] })];
    const pricing = requestPricing(items, { visits: [{ key: 'visit-1', adderIds: [], hasPermit: true }] });
    const direct = priceQuote(SMALL_BOOK, {
      visits: [{ key: 'visit-1', adderIds: [], hasPermit: true }],
      lines: [
        { key: '40', entryId: '12', quantity: 2, adderIds: [], visitKey: 'visit-1' },
        { key: '42', entryId: '13', quantity: 1, adderIds: ['22'], visitKey: 'visit-1' },
      ],
    });
    expect(livePrice(pricing).breakdown).toEqual(direct);
  });

  it('leaves out items declined as not in scope, without an entry or without a quantity', () => {
    const items = [
      pricingItem(40, { entryId: 11 }),
      pricingItem(41, { entryId: 11, status: 'out-of-scope', outOfScopeReason: 'Needs a panel change' }),
      pricingItem(43, { entryId: 11, quantity: null, pricingQuantity: null }),
    ];
    expect(quoteToPrice(requestPricing(items), items)?.lines.map((l) => l.key)).toEqual(['40']);
  });

  it('reports the refusal of the engine rather than a total', () => {
    // docs/pricing.md rule 5: labour adders cannot be put on a flat line.
    const pricing = requestPricing([pricingItem(40, { entryId: 12, adderIds: [21] })]);
    const { breakdown, problem } = livePrice(pricing);
    expect(breakdown).toBeNull();
    expect(problem).toMatch(/flat/i);
  });
});

describe('applyChange', () => {
  it('prices an item of unknown quantity at 1 and flags it, as the server does', () => {
    const [item] = applyChange([pricingItem(43, { quantity: null, pricingQuantity: null })], { itemIds: [43], set: { entryId: 11 } });
    expect(item).toMatchObject({ entryId: 11, pricingQuantity: 1, isQuantityAssumed: true });
  });

  it('brings an item declined as not in scope back when it gets an entry', () => {
    const [item] = applyChange([pricingItem(41, { status: 'out-of-scope', outOfScopeReason: 'x' })], { itemIds: [41], set: { entryId: 11 } });
    expect(item).toMatchObject({ status: 'open', outOfScopeReason: null });
  });
});

describe('claimedTotals', () => {
  it('claims every money field of the quote and each visit total', () => {
    const { breakdown } = livePrice(requestPricing([pricingItem(40, { entryId: 11 })]));
    const claimed = claimedTotals(breakdown);
    expect(claimed).toMatchObject({ totalCents: 31_434, serviceCallCents: 9_500, materialsTaxCents: 194 });
    expect(claimed.visits).toEqual([{ key: 'visit-1', totalCents: 31_434 }]);
    expect(claimedTotals(null)).toEqual({ totalCents: 0 });
  });
});
