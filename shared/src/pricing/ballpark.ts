import { BALLPARK_LABEL, type Ballpark, type BallparkRequest } from './ballpark.schema';
import type { QuoteBreakdown } from './pricing-breakdown.schema';
import { priceQuote, type QuoteToPrice } from './price-quote';
import { priceVisit } from './price-visit';
import type { RateBook, RateBookEntry } from './rate-book.schema';
import { applyBasisPoints, roundDownToStep, roundUpToStep } from './rounding';

/** The range is shown in whole $10 steps: low rounded down, high rounded up (R6). */
export const BALLPARK_STEP_CENTS = 1_000;
/**
 * Units assumed when the report gives no number ("several outlets"). The low side assumes what a
 * quote assumes for such an item (1, flagged to check on site), so the range holds the quote.
 */
export const UNKNOWN_QUANTITY = { low: 1, high: 4 } as const;

type Side = 'low' | 'high';

const sideBooks = new WeakMap<RateBook, Record<Side, RateBook>>();

/**
 * The rate book as an easy site (low) or a hard site (high) would price it: time-and-materials
 * entries take their minutesLow / minutesHigh as labour per unit (never above / below the minutes a
 * quote prices, so the range holds the quote); flat entries keep their price on the low side and are
 * multiplied by their hard-site multiplier (R1) on the high side.
 */
function bookForSide(book: RateBook, side: Side): RateBook {
  let books = sideBooks.get(book);
  if (!books) {
    const withEntries = (map: (entry: RateBookEntry) => RateBookEntry): RateBook => ({ ...book, entries: book.entries.map(map) });
    books = {
      low: withEntries((entry) =>
        entry.pricing.mode === 'time-and-materials'
          ? { ...entry, pricing: { ...entry.pricing, labourMinutesPerUnit: Math.min(entry.pricing.minutesLow, entry.pricing.labourMinutesPerUnit) } }
          : entry,
      ),
      high: withEntries((entry) =>
        entry.pricing.mode === 'time-and-materials'
          ? { ...entry, pricing: { ...entry.pricing, labourMinutesPerUnit: Math.max(entry.pricing.minutesHigh, entry.pricing.labourMinutesPerUnit) } }
          : {
              ...entry,
              pricing: {
                ...entry.pricing,
                firstUnitCents: Math.max(entry.pricing.firstUnitCents, applyBasisPoints(entry.pricing.firstUnitCents, entry.pricing.hardSiteMultiplierBp)),
                additionalUnitCents: Math.max(entry.pricing.additionalUnitCents, applyBasisPoints(entry.pricing.additionalUnitCents, entry.pricing.hardSiteMultiplierBp)),
              },
            },
      ),
    };
    sideBooks.set(book, books);
  }
  return books[side];
}

/**
 * Site conditions a side assumes. The low side is the easy site: none, since a quote need not use
 * them. The high side: the ones flagged, plus those the rate book ties to the age of the house (with
 * the year unknown, all of them).
 */
function addersForSide(book: RateBook, request: Pick<BallparkRequest, 'yearBuilt'> & { siteAdderIds?: readonly string[] }, side: Side): string[] {
  if (side === 'low') return [];
  const ids = [...new Set(request.siteAdderIds ?? [])];
  for (const adder of book.adders) {
    const before = adder.appliesWhenBuiltBefore;
    if (before === null || ids.includes(adder.id)) continue;
    const isOlder = request.yearBuilt === null || request.yearBuilt < before;
    if (isOlder) ids.push(adder.id);
  }
  return ids;
}

interface ChosenLine {
  key: string;
  entryId: string;
  quantity: number;
  minutes: number;
}

/** One item priced with one entry on a visit of its own (its labour minutes decide the packing). */
function lineAlone(book: RateBook, entry: RateBookEntry, quantity: number, adderIds: string[], key: string): ChosenLine & { totalCents: number } {
  const alone = priceVisit(book, { key, adderIds, lines: [{ key, entryId: entry.id, quantity }] });
  return { key, entryId: entry.id, quantity, minutes: alone.lines[0].labourMinutes, totalCents: alone.totalCents };
}

/** Beyond this many ways to pick one entry per finding, each item takes its cheapest / dearest entry alone. */
export const MAX_ENTRY_CHOICES = 1_024;

/**
 * The ways a quote can price the items: one entry per finding code for all its items (as auto-pricing
 * and the group change do). Every way is priced, so the low side is the cheapest quote and the high
 * side the dearest, not the sum of each item's cheapest or dearest alone (which misses what sharing
 * a visit's first hour does). With too many ways, the items' entries alone decide.
 */
function* entryChoices(items: { code: string; options: (ChosenLine & { totalCents: number })[] }[], side: Side): Generator<ChosenLine[]> {
  const codes = [...new Set(items.map((item) => item.code))];
  const counts = codes.map((code) => items.find((item) => item.code === code)!.options.length);
  const ways = counts.reduce((product, n) => product * n, 1);
  if (ways > MAX_ENTRY_CHOICES) {
    const pick = (options: (ChosenLine & { totalCents: number })[]) =>
      options.reduce((a, b) => ((side === 'low' ? b.totalCents < a.totalCents : b.totalCents > a.totalCents) ? b : a));
    yield items.map((item) => pick(item.options));
    return;
  }
  for (let n = 0; n < ways; n++) {
    const choice = new Map<string, number>();
    let rest = n;
    codes.forEach((code, i) => {
      choice.set(code, rest % counts[i]);
      rest = Math.floor(rest / counts[i]);
    });
    yield items.map((item) => item.options[choice.get(item.code)!]);
  }
}

/**
 * Splits lines into visits of at most `capacity` minutes of labour, first fit in the order given; a
 * line longer than a visit gets a visit of its own. The low side passes no limit: one visit, the
 * fewest service calls and first-hour minimums a quote can have.
 */
function packIntoVisits(lines: ChosenLine[], capacity: number, adderIds: string[]): QuoteToPrice {
  const used: number[] = [];
  const quote: { visits: { key: string; adderIds: string[] }[]; lines: (ChosenLine & { visitKey: string })[] } = { visits: [], lines: [] };
  for (const line of lines) {
    let at = used.findIndex((minutes) => minutes + line.minutes <= capacity);
    if (at < 0) {
      at = used.length;
      used.push(0);
      quote.visits.push({ key: `visit-${at + 1}`, adderIds });
    }
    used[at] += line.minutes;
    quote.lines.push({ ...line, visitKey: `visit-${at + 1}` });
  }
  return quote;
}

/**
 * A low–high range for a whole request from finding codes, before any quote. Each side prices the
 * request with the same engine as a quote, using the easy-site or hard-site book and the site
 * conditions that side assumes. An estimate, not a quote.
 */
export function ballpark(
  book: RateBook,
  request: Pick<BallparkRequest, 'items' | 'yearBuilt'> & { siteAdderIds?: readonly string[] },
): Ballpark {
  const byCode = new Map<string, RateBookEntry[]>();
  for (const entry of book.entries) {
    if (entry.code === null) continue;
    const list = byCode.get(entry.code);
    if (list) list.push(entry);
    else byCode.set(entry.code, [entry]);
  }
  const unpricedCodes = [...new Set(request.items.filter((item) => !byCode.has(item.code)).map((item) => item.code))];

  const priceSide = (side: Side) => {
    const sideBook = bookForSide(book, side);
    const adderIds = addersForSide(book, request, side);
    const capacity = side === 'low' ? Number.POSITIVE_INFINITY : book.terms.visitCapacityMinutes;
    const items = request.items.flatMap((item, i) => {
      const candidates = byCode.get(item.code);
      if (!candidates) return [];
      const quantity = item.quantity ?? UNKNOWN_QUANTITY[side];
      const key = `item-${i + 1}`;
      return [{ code: item.code, options: candidates.map((entry) => lineAlone(sideBook, entry, quantity, adderIds, key)) }];
    });
    if (items.length === 0) return { exactCents: 0, visits: 0, labourMinutes: 0, adderIds };
    const isBetter = (a: number, b: number) => (side === 'low' ? a < b : a > b);
    let best: QuoteBreakdown | null = null;
    for (const lines of entryChoices(items, side)) {
      const priced = priceQuote(sideBook, packIntoVisits(lines, capacity, adderIds));
      if (best === null || isBetter(priced.totalCents, best.totalCents)) best = priced;
    }
    const priced = best!;
    const labourMinutes = priced.visits.reduce((sum, v) => sum + v.pooledMinutes, 0);
    return { exactCents: priced.totalCents, visits: priced.visits.length, labourMinutes, adderIds };
  };

  const { adderIds: lowAdderIds, ...low } = priceSide('low');
  const { adderIds: highAdderIds, ...high } = priceSide('high');
  return {
    kind: 'estimate',
    label: BALLPARK_LABEL,
    lowCents: roundDownToStep(low.exactCents, BALLPARK_STEP_CENTS),
    highCents: roundUpToStep(Math.max(high.exactCents, low.exactCents), BALLPARK_STEP_CENTS),
    low,
    high,
    unpricedCodes,
    lowAdderIds,
    highAdderIds,
  };
}
