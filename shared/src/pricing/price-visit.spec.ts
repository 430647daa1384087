// Trade check values are common practice, no published source (docs/trade-facts.md, "How small contractors price
// service work", no source): a trip charge per visit, one minimum for the first hour shared by every
// item of the visit, labour after it in 15- or 30-minute increments, tax on the materials line only
// (or none, where the contractor pays it on purchases). Expected figures are worked out in the
// comment beside each row from the demo rate book's terms.
import { DEMO_RATE_BOOK } from './demo-rate-book';
import { PricingError } from './pricing-error';
import { priceVisit, type LineToPrice } from './price-visit';
import type { RateBook, VisitTerms } from './rate-book.schema';

const withTerms = (terms: Partial<VisitTerms>): RateBook => ({ ...DEMO_RATE_BOOK, terms: { ...DEMO_RATE_BOOK.terms, ...terms } });
const visitOf = (...lines: LineToPrice[]) => ({ key: 'v', lines });
const gfci = (key: string, extra: Partial<LineToPrice> = {}): LineToPrice => ({ key, entryId: 'gfci-replace', quantity: 1, ...extra });

describe('priceVisit', () => {
  describe('a single GFCI replacement on its own visit (common practice)', () => {
    it.each([
      // 20 min and 8 min of work: both pay 9,500 + 18,500 + 2,400 + 840 markup; tax 3,240 × 6 % = 194
      ['20 minutes of work', DEMO_RATE_BOOK],
      ['8 minutes of work (under ten)', { ...DEMO_RATE_BOOK, entries: DEMO_RATE_BOOK.entries.map((e) => (e.id === 'gfci-replace' && e.pricing.mode === 'time-and-materials' ? { ...e, pricing: { ...e.pricing, labourMinutesPerUnit: 8 } } : e)) }],
    ])('bills the service charge, the full first-hour minimum and materials with markup for %s', (_name, book) => {
      const priced = priceVisit(book, visitOf(gfci('a')));
      expect(priced).toMatchObject({ serviceCallCents: 9_500, firstHourMinimumCents: 18_500, extraLabourCents: 0, materialsCostCents: 2_400, materialsMarkupCents: 840 });
      expect(priced.subtotalCents).toBe(9_500 + 18_500 + 2_400 + 840);
    });
  });

  describe('a second GFCI on the same visit (common practice)', () => {
    it.each([
      // 20 + 20 = 40 min, still inside the first hour: only its materials 2,400 + 840 are added
      ['inside the first hour', {}, 0],
      // (20 + 30) × 2 = 100 min: 40 min beyond the hour → 45 billed → 45 × 13,500 / 60 = 10,125
      ['beyond the first hour', { adderIds: ['tight-box'] }, 10_125],
    ])('adds only its own labour %s and its materials', (_name, extra, addedLabour) => {
      const one = priceVisit(DEMO_RATE_BOOK, visitOf(gfci('a', extra)));
      const two = priceVisit(DEMO_RATE_BOOK, visitOf(gfci('a', extra), gfci('b', extra)));
      expect(two.serviceCallCents).toBe(one.serviceCallCents);
      expect(two.firstHourMinimumCents).toBe(one.firstHourMinimumCents);
      expect(two.extraLabourCents - one.extraLabourCents).toBe(addedLabour);
      expect(two.subtotalCents - one.subtotalCents).toBe(addedLabour + 2_400 + 840);
    });
  });

  describe('billing increment rounding (common practice: 15- or 30-minute steps, rounded up)', () => {
    // Pool = 20 min per GFCI × quantity; extra = pool − 60; billed = extra rounded up to the increment.
    it.each([
      [15, 3, 0, 0], //   60 min: nothing beyond the first hour
      [15, 4, 20, 30], // 80 min: 20 → 30
      [15, 6, 60, 60], // 120 min: 60 exactly, not rounded further
      [30, 4, 20, 30], // 80 min: 20 → 30
      [30, 5, 40, 60], // 100 min: 40 → 60
      [1, 4, 20, 20], //  1-minute increment: billed as worked
    ])('with %i-min increments, %i GFCIs bill %i extra minutes as %i', (increment, quantity, extra, billed) => {
      const priced = priceVisit(withTerms({ billingIncrementMinutes: increment }), visitOf(gfci('a', { quantity })));
      expect(priced.extraMinutes).toBe(extra);
      expect(priced.billedExtraMinutes).toBe(billed);
      expect(priced.extraLabourCents).toBe((billed * 13_500) / 60);
    });

    it('bills 1 extra minute at a 15-minute increment as 15 minutes: 15 × 13,500 / 60 = 3,375', () => {
      const book = withTerms({ firstHourCoversMinutes: 19 });
      expect(priceVisit(book, visitOf(gfci('a'))).extraLabourCents).toBe(3_375);
    });
  });

  describe('sales tax (common practice: on the materials line only, or none)', () => {
    it.each([
      // materials 2,400 + markup 840 = 3,240; × 6 % = 194.4 → 194
      [600, 194],
      // × 8.88 % = 287.712 → 288
      [888, 288],
      // × 1.25 % = 40.5 → 41 (an exact half goes up)
      [125, 41],
      // zero tax allowed
      [0, 0],
    ])('at %i bp charges %i on one GFCI', (taxBp, tax) => {
      const priced = priceVisit(withTerms({ materialsTaxBp: taxBp }), visitOf(gfci('a')));
      expect(priced.materialsTaxCents).toBe(tax);
      expect(priced.totalCents).toBe(priced.subtotalCents + tax);
    });

    it('does not tax labour, flat lines or the permit', () => {
      const priced = priceVisit(DEMO_RATE_BOOK, {
        key: 'v',
        hasPermit: true,
        lines: [{ key: 'f', entryId: 'gfci-replace-flat', quantity: 3 }, { key: 'e', entryId: 'general-evaluation', quantity: 2 }],
      });
      expect(priced.extraLabourCents).toBeGreaterThan(0);
      expect(priced.flatCents).toBeGreaterThan(0);
      expect(priced.permitCents).toBe(14_000);
      expect(priced.materialsTaxCents).toBe(0);
    });
  });

  describe('flat-rate lines (our rule, docs/pricing.md 1.3)', () => {
    it('charges a visit of flat lines only the service call, no first-hour minimum', () => {
      const priced = priceVisit(DEMO_RATE_BOOK, visitOf({ key: 'f', entryId: 'gfci-replace-flat', quantity: 1 }));
      expect(priced).toMatchObject({ serviceCallCents: 9_500, firstHourMinimumCents: 0, pooledMinutes: 0, totalCents: 9_500 + 17_500 });
    });

    it('charges the first-unit price once per entry per visit, across lines', () => {
      const priced = priceVisit(
        DEMO_RATE_BOOK,
        visitOf(
          { key: 'a', entryId: 'gfci-replace-flat', quantity: 2 },
          { key: 'b', entryId: 'afci-breaker-flat', quantity: 1 },
          { key: 'c', entryId: 'gfci-replace-flat', quantity: 1 },
        ),
      );
      expect(priced.lines.map((l) => l.flatCents)).toEqual([17_500 + 8_500, 22_500, 8_500]);
    });

    it('leaves the first hour to the time-and-materials lines', () => {
      const alone = priceVisit(DEMO_RATE_BOOK, visitOf(gfci('a', { quantity: 3 })));
      const withFlat = priceVisit(DEMO_RATE_BOOK, visitOf(gfci('a', { quantity: 3 }), { key: 'f', entryId: 'afci-breaker-flat', quantity: 2 }));
      expect(withFlat.extraLabourCents).toBe(alone.extraLabourCents);
      expect(withFlat.subtotalCents - alone.subtotalCents).toBe(22_500 + 17_500);
    });

    it('refuses a labour adder on a flat line', () => {
      const act = () => priceVisit(DEMO_RATE_BOOK, visitOf({ key: 'f', entryId: 'gfci-replace-flat', quantity: 1, adderIds: ['tight-box'] }));
      expect(act).toThrow(expect.objectContaining({ reason: 'adder-not-for-flat', path: ['lines', 0, 'adderIds', 0] }));
    });
  });

  describe('site conditions', () => {
    it('counts a per-visit adder once however many lines flag it (+20 min)', () => {
      const plain = priceVisit(DEMO_RATE_BOOK, visitOf(gfci('a'), gfci('b')));
      const flagged = priceVisit(DEMO_RATE_BOOK, {
        key: 'v',
        adderIds: ['panel-shutoff'],
        lines: [gfci('a', { adderIds: ['panel-shutoff'] }), gfci('b', { adderIds: ['panel-shutoff'] })],
      });
      expect(flagged.visitAdderMinutes).toBe(20);
      expect(flagged.pooledMinutes - plain.pooledMinutes).toBe(20);
    });

    it('applies visit-level labour adders to every time-and-materials line: 20 × 1.4 = 28 min each', () => {
      const priced = priceVisit(DEMO_RATE_BOOK, { key: 'v', adderIds: ['built-before-1960'], lines: [gfci('a'), gfci('b', { adderIds: ['built-before-1960'] })] });
      expect(priced.lines.map((l) => l.labourMinutes)).toEqual([28, 28]);
    });

    it('compounds multipliers in rate-book order whatever order they are ticked', () => {
      const one = priceVisit(DEMO_RATE_BOOK, visitOf(gfci('a', { adderIds: ['plaster-walls', 'tile-or-stone'] })));
      const other = priceVisit(DEMO_RATE_BOOK, visitOf(gfci('a', { adderIds: ['tile-or-stone', 'plaster-walls'] })));
      // 20 × 1.2 × 1.3 = 31.2 → 31
      expect(one.lines[0].labourMinutes).toBe(31);
      expect(other.lines[0].labourMinutes).toBe(31);
    });
  });

  describe('when the input names something the rate book does not have', () => {
    it.each([
      ['an unknown entry', visitOf({ key: 'a', entryId: 'no-such-entry', quantity: 1 }), 'unknown-entry', ['lines', 0, 'entryId']],
      ['an unknown adder on a line', visitOf(gfci('a', { adderIds: ['no-such-adder'] })), 'unknown-adder', ['lines', 0, 'adderIds', 0]],
      ['an unknown adder on the visit', { key: 'v', adderIds: ['nope'], lines: [gfci('a')] }, 'unknown-adder', ['adderIds', 0]],
      ['no lines', visitOf(), 'empty-visit', ['lines']],
    ])('throws a PricingError for %s', (_name, visit, reason, path) => {
      let error: unknown;
      try {
        priceVisit(DEMO_RATE_BOOK, visit);
      } catch (e) {
        error = e;
      }
      expect(error).toBeInstanceOf(PricingError);
      expect(error).toMatchObject({ reason, path });
    });
  });
});
