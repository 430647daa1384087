// Property tests: fast-check builds random rate books and visits; an independent computation with
// decimal.js (npm reference library for exact decimal arithmetic, ROUND_HALF_UP / ROUND_CEIL) follows
// the rules of docs/pricing.md (sections 1.3 and 2) and must give the engine's figures exactly.
import DecimalLib from 'decimal.js';
import fc from 'fast-check';
import {
  allocateByWeight,
  divideRoundHalfUp,
  priceQuote,
  priceVisit,
  RateBookSchema,
  verifyTotals,
  type RateBook,
  type RateBookEntry,
  type SiteAdder,
  type VisitToPrice,
} from '@cc/shared';

const Decimal = DecimalLib.clone({ precision: 60 });
type Dec = InstanceType<typeof Decimal>;
const halfUp = (d: Dec) => d.toDecimalPlaces(0, Decimal.ROUND_HALF_UP).toNumber();
const shareOf = (amount: number, bp: number) => halfUp(new Decimal(amount).times(bp).div(10_000));

// ---- arbitraries -------------------------------------------------------------------------------

const entryArb = (i: number): fc.Arbitrary<RateBookEntry> =>
  fc.oneof(
    fc.record({
      minutes: fc.integer({ min: 0, max: 600 }),
      cost: fc.integer({ min: 0, max: 100_000 }),
      markup: fc.option(fc.integer({ min: 0, max: 20_000 }), { nil: null }),
    }).map(({ minutes, cost, markup }): RateBookEntry => ({
      id: `tm-${i}`, code: null, name: `Timed ${i}`, unit: 'each',
      pricing: { mode: 'time-and-materials', labourMinutesPerUnit: minutes, materialsCentsPerUnit: cost, markupBp: markup, materials: [], minutesLow: 0, minutesHigh: minutes },
    })),
    fc.record({ first: fc.integer({ min: 0, max: 100_000 }), ratio: fc.integer({ min: 0, max: 100 }) }).map(({ first, ratio }): RateBookEntry => ({
      id: `flat-${i}`, code: null, name: `Flat ${i}`, unit: 'each',
      pricing: { mode: 'flat', firstUnitCents: first, additionalUnitCents: Math.floor((first * ratio) / 100), hardSiteMultiplierBp: 10_000 },
    })),
  );

const adderArb = (i: number): fc.Arbitrary<SiteAdder> =>
  fc.oneof(
    fc.integer({ min: 1, max: 120 }).map((minutes) => ({ kind: 'minutes-per-unit' as const, minutes })),
    fc.integer({ min: 10_000, max: 40_000 }).map((multiplierBp) => ({ kind: 'labour-multiplier' as const, multiplierBp })),
    fc.integer({ min: 1, max: 120 }).map((minutes) => ({ kind: 'minutes-per-visit' as const, minutes })),
  ).map((effect) => ({ id: `adder-${i}`, name: `Condition ${i}`, effect, appliesWhenBuiltBefore: null }));

const bookArb: fc.Arbitrary<RateBook> = fc
  .record({
    serviceCallCents: fc.integer({ min: 0, max: 30_000 }),
    firstHourMinimumCents: fc.integer({ min: 0, max: 40_000 }),
    firstHourCoversMinutes: fc.integer({ min: 1, max: 120 }),
    hourlyRateCents: fc.integer({ min: 1, max: 30_000 }),
    billingIncrementMinutes: fc.integer({ min: 1, max: 60 }),
    materialsMarkupBp: fc.integer({ min: 0, max: 20_000 }),
    materialsTaxBp: fc.integer({ min: 0, max: 2_000 }),
    permit: fc.record({ feeCents: fc.integer({ min: 0, max: 50_000 }), handlingCents: fc.integer({ min: 0, max: 20_000 }) }),
    cardDepositBp: fc.integer({ min: 0, max: 10_000 }),
    entryCount: fc.integer({ min: 1, max: 6 }),
    adderCount: fc.integer({ min: 0, max: 5 }),
  })
  .chain(({ entryCount, adderCount, ...terms }) =>
    fc.record({
      entries: fc.tuple(...Array.from({ length: entryCount }, (_, i) => entryArb(i))),
      adders: adderCount === 0 ? fc.constant([] as SiteAdder[]) : fc.tuple(...Array.from({ length: adderCount }, (_, i) => adderArb(i))),
    }).map(({ entries, adders }): RateBook => ({
      contractorName: 'Property Test Electric',
      terms: { ...terms, quoteValidityDays: 30, warrantyText: 'One year.', visitCapacityMinutes: 480 },
      entries,
      adders,
    })),
  );

/** A visit on `book`: line adders only where the engine accepts them (labour adders not on flat lines). */
const visitArb = (book: RateBook, key: string): fc.Arbitrary<VisitToPrice> => {
  const adderIds = fc.subarray(book.adders.map((a) => a.id));
  const perVisitIds = fc.subarray(book.adders.filter((a) => a.effect.kind === 'minutes-per-visit').map((a) => a.id));
  return fc.record({
    key: fc.constant(key),
    hasPermit: fc.boolean(),
    adderIds,
    lines: fc.array(
      fc.record({ entry: fc.constantFrom(...book.entries), quantity: fc.integer({ min: 1, max: 50 }), all: adderIds, perVisit: perVisitIds }),
      { minLength: 1, maxLength: 12 },
    ).map((lines) =>
      lines.map((l, i) => ({ key: `${key}-line-${i}`, entryId: l.entry.id, quantity: l.quantity, adderIds: l.entry.pricing.mode === 'flat' ? l.perVisit : l.all })),
    ),
  });
};

const bookAndVisitArb = bookArb.chain((book) => visitArb(book, 'v').map((visit) => ({ book, visit })));

// ---- independent reference ---------------------------------------------------------------------

function referenceVisit(book: RateBook, visit: VisitToPrice) {
  const terms = book.terms;
  const adder = (id: string) => book.adders.find((a) => a.id === id)!;
  const position = (id: string) => book.adders.findIndex((a) => a.id === id);
  const perVisit = new Set<string>();
  for (const id of [...(visit.adderIds ?? []), ...visit.lines.flatMap((l) => l.adderIds ?? [])]) {
    if (adder(id).effect.kind === 'minutes-per-visit') perVisit.add(id);
  }
  const visitWide = (visit.adderIds ?? []).filter((id) => adder(id).effect.kind !== 'minutes-per-visit');
  const flatUnits = new Map<string, number>();
  let pool = new Decimal(0);
  let flat = 0;
  let materials = 0;
  let markup = 0;
  const lineMinutes: number[] = [];
  for (const line of visit.lines) {
    const entry = book.entries.find((e) => e.id === line.entryId)!;
    const p = entry.pricing;
    if (p.mode === 'flat') {
      const before = flatUnits.get(entry.id) ?? 0;
      flatUnits.set(entry.id, before + line.quantity);
      flat += before === 0 ? p.firstUnitCents + (line.quantity - 1) * p.additionalUnitCents : line.quantity * p.additionalUnitCents;
      lineMinutes.push(0);
      continue;
    }
    const applied = [...new Set([...(line.adderIds ?? []), ...visitWide])].filter((id) => adder(id).effect.kind !== 'minutes-per-visit');
    applied.sort((a, b) => position(a) - position(b));
    let perUnit = 0;
    let multiplier = new Decimal(1);
    for (const id of applied) {
      const effect = adder(id).effect;
      if (effect.kind === 'minutes-per-unit') perUnit += effect.minutes;
      if (effect.kind === 'labour-multiplier') multiplier = multiplier.times(effect.multiplierBp).div(10_000).toDecimalPlaces(4, Decimal.ROUND_HALF_UP);
    }
    const minutes = halfUp(new Decimal(p.labourMinutesPerUnit + perUnit).times(line.quantity).times(multiplier));
    lineMinutes.push(minutes);
    pool = pool.plus(minutes);
    const cost = new Decimal(p.materialsCentsPerUnit).times(line.quantity).toNumber();
    materials += cost;
    markup += shareOf(cost, p.markupBp ?? terms.materialsMarkupBp);
  }
  const visitMinutes = [...perVisit].reduce((sum, id) => {
    const effect = adder(id).effect;
    return sum + (effect.kind === 'minutes-per-visit' ? effect.minutes : 0);
  }, 0);
  pool = pool.plus(visitMinutes);
  const firstHour = pool.gt(0) ? terms.firstHourMinimumCents : 0;
  const extra = Decimal.max(0, pool.minus(terms.firstHourCoversMinutes));
  const billed = extra.div(terms.billingIncrementMinutes).toDecimalPlaces(0, Decimal.ROUND_CEIL).times(terms.billingIncrementMinutes);
  const extraLabour = halfUp(billed.times(terms.hourlyRateCents).div(60));
  const tax = shareOf(materials + markup, terms.materialsTaxBp);
  const permit = visit.hasPermit ? terms.permit.feeCents + terms.permit.handlingCents : 0;
  const subtotal = new Decimal(terms.serviceCallCents).plus(firstHour).plus(extraLabour).plus(flat).plus(materials).plus(markup).plus(permit).toNumber();
  return {
    lineMinutes,
    visitMinutes,
    totals: {
      serviceCallCents: terms.serviceCallCents,
      firstHourMinimumCents: firstHour,
      extraLabourCents: extraLabour,
      flatCents: flat,
      materialsCostCents: materials,
      materialsMarkupCents: markup,
      materialsTaxCents: tax,
      permitCents: permit,
      subtotalCents: subtotal,
      totalCents: subtotal + tax,
      depositCents: shareOf(subtotal + tax, terms.cardDepositBp),
      pooledMinutes: pool.toNumber(),
      billedExtraMinutes: billed.toNumber(),
    },
  };
}

// ---- properties ----------------------------------------------------------------------------------

describe('pricing engine against an independent decimal.js computation', () => {
  it('generates only valid rate books', () => {
    fc.assert(fc.property(bookArb, (book) => RateBookSchema.safeParse(book).success));
  });

  it('gives every visit total the reference gives', () => {
    fc.assert(
      fc.property(bookAndVisitArb, ({ book, visit }) => {
        const priced = priceVisit(book, visit);
        const reference = referenceVisit(book, visit);
        expect(priced).toMatchObject(reference.totals);
        expect(priced.lines.map((l) => l.labourMinutes)).toEqual(reference.lineMinutes);
        expect(priced.visitAdderMinutes).toBe(reference.visitMinutes);
      }),
      { numRuns: 300 },
    );
  });

  it('splits the labour charge over the lines exactly, each share within one cent of its exact proportion', () => {
    fc.assert(
      fc.property(bookAndVisitArb, ({ book, visit }) => {
        const priced = priceVisit(book, visit);
        const charge = priced.firstHourMinimumCents + priced.extraLabourCents;
        const shares = [...priced.lines.map((l) => l.labourCents), priced.visitAdderLabourCents];
        const weights = [...priced.lines.map((l) => l.labourMinutes), priced.visitAdderMinutes];
        const weightSum = weights.reduce((a, b) => a + b, 0);
        expect(shares.reduce((a, b) => a + b, 0)).toBe(charge);
        shares.forEach((share, i) => {
          const exact = weightSum === 0 ? new Decimal(0) : new Decimal(charge).times(weights[i]).div(weightSum);
          expect(exact.minus(share).abs().lt(1)).toBe(true);
        });
      }),
    );
  });

  it('adds visits into the quote and takes the deposit from the quote total; verifyTotals accepts it and rejects any other total', () => {
    const quoteArb = bookArb.chain((book) =>
      fc.record({
        book: fc.constant(book),
        visits: fc.array(fc.nat(), { minLength: 1, maxLength: 4 }).chain((keys) => fc.tuple(...keys.map((_, i) => visitArb(book, `v${i}`)))),
        delta: fc.integer({ min: 1, max: 1_000 }),
      }),
    );
    fc.assert(
      fc.property(quoteArb, ({ book, visits, delta }) => {
        const quote = {
          visits: visits.map((v) => ({ key: v.key, adderIds: v.adderIds, hasPermit: v.hasPermit })),
          lines: visits.flatMap((v) => v.lines.map((l) => ({ ...l, visitKey: v.key }))),
        };
        const priced = priceQuote(book, quote);
        const total = visits.reduce((sum, v) => sum.plus(referenceVisit(book, v).totals.totalCents), new Decimal(0)).toNumber();
        expect(priced.totalCents).toBe(total);
        expect(priced.depositCents).toBe(shareOf(total, book.terms.cardDepositBp));
        expect(verifyTotals({ rateBook: book, quote }, { totalCents: total, depositCents: priced.depositCents }).isMatch).toBe(true);
        expect(verifyTotals({ rateBook: book, quote }, { totalCents: total + delta }).isMatch).toBe(false);
      }),
      { numRuns: 100 },
    );
  });

  it('never charges less when a time-and-materials line is added to a visit', () => {
    fc.assert(
      fc.property(bookAndVisitArb, fc.integer({ min: 1, max: 20 }), ({ book, visit }, quantity) => {
        const timed = book.entries.find((e) => e.pricing.mode === 'time-and-materials');
        fc.pre(timed !== undefined);
        const more = { ...visit, lines: [...visit.lines, { key: 'extra', entryId: timed!.id, quantity }] };
        expect(priceVisit(book, more).totalCents).toBeGreaterThanOrEqual(priceVisit(book, visit).totalCents);
      }),
    );
  });
});

describe('rounding against decimal.js', () => {
  it('divideRoundHalfUp matches ROUND_HALF_UP for any safe numerator', () => {
    fc.assert(
      fc.property(fc.maxSafeNat(), fc.integer({ min: 1, max: 1_000_000 }), (n, d) => {
        expect(divideRoundHalfUp(n, d)).toBe(halfUp(new Decimal(n).div(d)));
      }),
      { numRuns: 2_000 },
    );
  });

  it('allocateByWeight gives the largest-remainder shares', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10_000_000 }), fc.array(fc.integer({ min: 0, max: 10_000 }), { minLength: 1, maxLength: 30 }), (total, weights) => {
        const sum = weights.reduce((a, b) => a + b, 0);
        fc.pre(sum > 0);
        // Whole shares and remainders in exact integers: total × w = floor × sum + remainder. (A
        // remainder read off a divided decimal keeps fewer fractional digits the larger its whole
        // part, so equal remainders of different shares compared unequal on some inputs.)
        const products = weights.map((w) => new Decimal(total).times(w));
        const floors = products.map((p) => p.divToInt(sum).toNumber());
        let left = total - floors.reduce((a, b) => a + b, 0);
        const order = products.map((p, i) => ({ i, r: p.mod(sum) })).sort((a, b) => b.r.comparedTo(a.r) || a.i - b.i);
        for (const { i } of order) if (left-- > 0) floors[i] += 1;
        expect(allocateByWeight(total, weights)).toEqual(floors);
      }),
      // Three equal remainders (33236/45106) on shares of different sizes, found by a random run.
      { examples: [[1_773_378, [2504, 2330, 1383, 5956, 8249, 9414, 5935, 7805, 1530]]] },
    );
  });
});
