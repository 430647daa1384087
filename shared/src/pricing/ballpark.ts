import { BALLPARK_LABEL, type Ballpark, type BallparkRequest } from './ballpark.schema';
import { priceQuote, type QuoteToPrice } from './price-quote';
import { priceVisit } from './price-visit';
import type { RateBook, RateBookEntry } from './rate-book.schema';
import { applyBasisPoints, roundDownToStep, roundUpToStep } from './rounding';

/** The range is shown in whole $10 steps: low rounded down, high rounded up (R6). */
export const BALLPARK_STEP_CENTS = 1_000;
/** Units assumed when the report gives no number ("several outlets"). */
export const UNKNOWN_QUANTITY = { low: 2, high: 4 } as const;

type Side = 'low' | 'high';

const sideBooks = new WeakMap<RateBook, Record<Side, RateBook>>();

/**
 * The rate book as an easy site (low) or a hard site (high) would price it: time-and-materials
 * entries take their minutesLow / minutesHigh as labour per unit; flat entries keep their price on
 * the low side and are multiplied by their hard-site multiplier (R1) on the high side.
 */
function bookForSide(book: RateBook, side: Side): RateBook {
  let books = sideBooks.get(book);
  if (!books) {
    const withEntries = (map: (entry: RateBookEntry) => RateBookEntry): RateBook => ({ ...book, entries: book.entries.map(map) });
    books = {
      low: withEntries((entry) =>
        entry.pricing.mode === 'time-and-materials'
          ? { ...entry, pricing: { ...entry.pricing, labourMinutesPerUnit: entry.pricing.minutesLow } }
          : entry,
      ),
      high: withEntries((entry) =>
        entry.pricing.mode === 'time-and-materials'
          ? { ...entry, pricing: { ...entry.pricing, labourMinutesPerUnit: entry.pricing.minutesHigh } }
          : {
              ...entry,
              pricing: {
                ...entry.pricing,
                firstUnitCents: applyBasisPoints(entry.pricing.firstUnitCents, entry.pricing.hardSiteMultiplierBp),
                additionalUnitCents: applyBasisPoints(entry.pricing.additionalUnitCents, entry.pricing.hardSiteMultiplierBp),
              },
            },
      ),
    };
    sideBooks.set(book, books);
  }
  return books[side];
}

/**
 * Site conditions a side assumes: the ones flagged, plus those the rate book ties to the age of
 * the house. With the year unknown, age-tied conditions count on the high side only.
 */
function addersForSide(book: RateBook, request: Pick<BallparkRequest, 'yearBuilt'> & { siteAdderIds?: readonly string[] }, side: Side): string[] {
  const ids = [...new Set(request.siteAdderIds ?? [])];
  for (const adder of book.adders) {
    const before = adder.appliesWhenBuiltBefore;
    if (before === null || ids.includes(adder.id)) continue;
    const isOlder = request.yearBuilt === null ? side === 'high' : request.yearBuilt < before;
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

/** The entry for a code that makes the item cheapest (low side) or dearest (high side) on its own. */
function chooseEntry(book: RateBook, candidates: RateBookEntry[], quantity: number, adderIds: string[], side: Side, key: string): ChosenLine {
  let chosen: (ChosenLine & { totalCents: number }) | null = null;
  for (const entry of candidates) {
    const alone = priceVisit(book, { key, adderIds, lines: [{ key, entryId: entry.id, quantity }] });
    const isBetter = chosen === null || (side === 'low' ? alone.totalCents < chosen.totalCents : alone.totalCents > chosen.totalCents);
    if (isBetter) chosen = { key, entryId: entry.id, quantity, minutes: alone.lines[0].labourMinutes, totalCents: alone.totalCents };
  }
  if (!chosen) throw new RangeError('no candidate entries');
  return chosen;
}

/**
 * Splits lines into visits of at most `visitCapacityMinutes` of labour, first fit in the order
 * given; a line longer than a visit gets a visit of its own.
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
    const lines: ChosenLine[] = [];
    request.items.forEach((item, i) => {
      const candidates = byCode.get(item.code);
      if (!candidates) return;
      const quantity = item.quantity ?? UNKNOWN_QUANTITY[side];
      lines.push(chooseEntry(sideBook, candidates, quantity, adderIds, side, `item-${i + 1}`));
    });
    if (lines.length === 0) return { exactCents: 0, visits: 0, labourMinutes: 0, adderIds };
    const priced = priceQuote(sideBook, packIntoVisits(lines, book.terms.visitCapacityMinutes, adderIds));
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
