// Figures are derived by hand from the demo rate book (common practice values) in the comment
// beside each case; docs/pricing.md Example 5 is asserted in pricing-worked-examples.spec.ts.
import { ballpark, UNKNOWN_QUANTITY } from './ballpark';
import { BallparkSchema } from './ballpark.schema';
import { DEMO_RATE_BOOK } from './demo-rate-book';

const book = DEMO_RATE_BOOK;

describe('ballpark', () => {
  it('returns an estimate that matches its schema and has low ≤ high', () => {
    const range = ballpark(book, { yearBuilt: 1978, items: [{ code: 'gfci-missing', quantity: 2 }, { code: 'double-tap', quantity: 1 }] });
    expect(BallparkSchema.parse(range)).toEqual(range);
    expect(range.lowCents).toBeLessThanOrEqual(range.highCents);
  });

  describe('house age', () => {
    const items = [{ code: 'receptacle-damaged', quantity: 4 }];
    it.each([
      [1948, [], ['built-before-1960']],
      [1995, [], []],
      [null, [], ['built-before-1960']],
    ])('built %p assumes low %j and high %j', (yearBuilt, low, high) => {
      const range = ballpark(book, { yearBuilt, items });
      expect(range.lowAdderIds).toEqual(low);
      expect(range.highAdderIds).toEqual(high);
    });

    it('prices an older house higher on the hard side only: 4 × 20 min = 80 min, × 1.4 = 112 min; easy side 4 × 10 = 40 min', () => {
      const old = ballpark(book, { yearBuilt: 1948, items });
      const newer = ballpark(book, { yearBuilt: 1995, items });
      expect(newer.high.labourMinutes).toBe(80);
      expect(old.high.labourMinutes).toBe(112);
      // A quote need not charge the age condition (no old wiring found), so the easy side leaves it out.
      expect(old.low.labourMinutes).toBe(40);
    });
  });

  it('applies flagged site conditions to the hard side: (20 + 30) × 4 = 200 min; the easy side assumes none: 10 × 4 = 40 min', () => {
    const range = ballpark(book, { yearBuilt: 2001, siteAdderIds: ['tight-box'], items: [{ code: 'receptacle-damaged', quantity: 4 }] });
    expect(range.low.labourMinutes).toBe(40);
    expect(range.high.labourMinutes).toBe(200);
  });

  it(`assumes ${UNKNOWN_QUANTITY.low} units low and ${UNKNOWN_QUANTITY.high} high for "several" (a quote assumes 1 too): switches 1 × 10 and 4 × 20 min`, () => {
    const range = ballpark(book, { yearBuilt: 2001, items: [{ code: 'switch-issue', quantity: null }] });
    expect(range.low.labourMinutes).toBe(10);
    expect(range.high.labourMinutes).toBe(80);
  });

  it('splits a long request into visits of at most a working day (480 min)', () => {
    // knob-and-tube evaluation 60–180 min and service mast 120–360 min: low 180 min on 1 visit,
    // high 540 min does not fit one 480-min visit → 2 visits, each with its own service call.
    const range = ballpark(book, { yearBuilt: 2001, items: [{ code: 'knob-and-tube', quantity: 1 }, { code: 'service-equipment', quantity: 1 }] });
    expect(range.low.visits).toBe(1);
    expect(range.high.visits).toBe(2);
  });

  it('lists codes the rate book cannot price and leaves them out', () => {
    const custom = { ...book, entries: book.entries.filter((e) => e.code !== 'fan-support') };
    const range = ballpark(custom, { yearBuilt: 2001, items: [{ code: 'fan-support', quantity: 1 }, { code: 'fan-support', quantity: 2 }] });
    expect(range.unpricedCodes).toEqual(['fan-support']);
    expect(range).toMatchObject({ lowCents: 0, highCents: 0, low: { visits: 0 } });
  });
});
