// Source of every expected figure: the worked examples of docs/pricing.md, section 3, computed by
// hand step by step from the demo rate book (values common practice, no published source: docs/trade-facts.md).
import { ballpark } from './ballpark';
import { DEMO_RATE_BOOK } from './demo-rate-book';
import { priceQuote } from './price-quote';
import { priceVisit, type VisitToPrice } from './price-visit';
import type { VisitBreakdown } from './pricing-breakdown.schema';

const book = DEMO_RATE_BOOK;

const example1: VisitToPrice = { key: 'v1', lines: [{ key: 'a', entryId: 'gfci-replace', quantity: 1 }] };
const example2: VisitToPrice = {
  key: 'v1',
  lines: [
    { key: 'a', entryId: 'gfci-replace', quantity: 1, adderIds: ['tight-box'] },
    { key: 'b', entryId: 'gfci-replace', quantity: 1, adderIds: ['tight-box'] },
  ],
};
const example3: VisitToPrice = {
  key: 'v1',
  hasPermit: true,
  lines: [
    { key: 'l1', entryId: 'receptacle-replace', quantity: 3, adderIds: ['plaster-walls', 'built-before-1960'] },
    { key: 'l2', entryId: 'double-tap-pigtail', quantity: 1, adderIds: ['panel-shutoff'] },
    { key: 'l3', entryId: 'gfci-replace-flat', quantity: 2 },
  ],
};

type Expected = Partial<Omit<VisitBreakdown, 'lines' | 'key'>> & { lineLabourCents: number[]; lineMinutes: number[] };

describe('docs/pricing.md worked examples', () => {
  describe.each<[string, VisitToPrice, Expected]>([
    [
      'Example 1: one GFCI on its own visit',
      example1,
      {
        serviceCallCents: 9_500, firstHourMinimumCents: 18_500, pooledMinutes: 20, extraMinutes: 0, billedExtraMinutes: 0,
        extraLabourCents: 0, materialsCostCents: 2_400, materialsMarkupCents: 840, materialsTaxCents: 194,
        subtotalCents: 31_240, totalCents: 31_434, depositCents: 15_717, lineMinutes: [20], lineLabourCents: [18_500],
      },
    ],
    [
      'Example 2: two GFCIs in shallow boxes on one visit',
      example2,
      {
        pooledMinutes: 100, extraMinutes: 40, billedExtraMinutes: 45, extraLabourCents: 10_125, materialsCostCents: 4_800,
        materialsMarkupCents: 1_680, materialsTaxCents: 389, subtotalCents: 44_605, totalCents: 44_994, depositCents: 22_497,
        lineMinutes: [50, 50], lineLabourCents: [14_313, 14_312],
      },
    ],
    [
      'Example 3: a mixed visit with multipliers, a panel shutoff, flat lines and a permit',
      example3,
      {
        visitAdderMinutes: 20, pooledMinutes: 122, extraMinutes: 62, billedExtraMinutes: 75, extraLabourCents: 16_875,
        flatCents: 26_000, materialsCostCents: 1_750, materialsMarkupCents: 1_050, materialsTaxCents: 168, permitCents: 14_000,
        subtotalCents: 87_675, totalCents: 87_843, depositCents: 43_922, visitAdderLabourCents: 5_799,
        lineMinutes: [82, 20, 0], lineLabourCents: [23_777, 5_799, 0],
      },
    ],
  ])('%s', (_name, visit, expected) => {
    const { lineLabourCents, lineMinutes, ...totals } = expected;
    const priced = priceVisit(book, visit);

    it('gives the hand-computed visit figures', () => {
      expect(priced).toMatchObject(totals);
    });

    it('gives the hand-computed line minutes and labour shares', () => {
      expect(priced.lines.map((l) => l.labourMinutes)).toEqual(lineMinutes);
      expect(priced.lines.map((l) => l.labourCents)).toEqual(lineLabourCents);
    });
  });

  it('Example 2: the second GFCI adds 13,560 cents to Example 1 (labour beyond the first hour, materials, their tax)', () => {
    const one = priceVisit(book, { key: 'v1', lines: [example2.lines[0]] });
    const two = priceVisit(book, example2);
    expect(two.totalCents - one.totalCents).toBe(13_560);
    expect(two.serviceCallCents).toBe(one.serviceCallCents);
    expect(two.firstHourMinimumCents).toBe(one.firstHourMinimumCents);
  });

  describe('Example 4: a quote of two visits', () => {
    const quote = priceQuote(book, {
      visits: [{ key: 'v1' }, { key: 'v2' }],
      lines: [
        { key: 'a', visitKey: 'v1', entryId: 'gfci-replace', quantity: 1 },
        { key: 'b', visitKey: 'v2', entryId: 'afci-breaker-flat', quantity: 1 },
        { key: 'c', visitKey: 'v2', entryId: 'afci-breaker-flat', quantity: 1 },
      ],
    });

    it('prices the second visit as flat lines with one first-unit price and no first-hour minimum', () => {
      const v2 = quote.visits[1];
      expect(v2.lines.map((l) => l.flatCents)).toEqual([22_500, 17_500]);
      expect(v2).toMatchObject({ firstHourMinimumCents: 0, materialsTaxCents: 0, subtotalCents: 49_500, totalCents: 49_500, depositCents: 24_750 });
    });

    it('adds the visits and takes the deposit from the quote total', () => {
      expect(quote).toMatchObject({
        serviceCallCents: 19_000, subtotalCents: 80_740, materialsTaxCents: 194, totalCents: 80_934, depositCents: 40_467,
      });
    });
  });

  describe('Example 5: a ballpark', () => {
    const range = ballpark(book, {
      yearBuilt: 1985,
      items: [
        { code: 'gfci-inoperative', quantity: 1 },
        { code: 'cover-plate-missing', quantity: null },
      ],
    });

    it.each([
      ['low', 31_774, 31_000],
      ['high', 53_857, 54_000],
    ] as const)('gives the hand-computed %s figure, rounded to $10', (side, exact, rounded) => {
      expect(range[side].exactCents).toBe(exact);
      expect(range[side === 'low' ? 'lowCents' : 'highCents']).toBe(rounded);
    });

    it('is labelled an estimate and assumes no pre-1960 condition for a 1985 house', () => {
      expect(range).toMatchObject({ kind: 'estimate', label: 'Estimate, not a quote', lowAdderIds: [], highAdderIds: [] });
    });
  });
});
