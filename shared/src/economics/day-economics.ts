import { centsPerHour, divideRoundHalfUp, allocateByWeight } from '../pricing/rounding';
import type { EconomicsTotals, MinutesVsBookRow, ReturnCause, SingleVisitRate } from './economics.schema';

/** One site visit's figures before the rates: money in cents, minutes whole. */
export interface VisitFigures {
  billedCents: number;
  materialsCostCents: number;
  onSiteMinutes: number | null;
  driveMinutes: number | null;
}

/** Earnings (billed − materials cost) and the rates per on-site hour and per paid hour (on site + drive), by R7. */
export function visitRates(v: VisitFigures): { earningsCents: number; perOnSiteHourCents: number | null; perPaidHourCents: number | null } {
  const earningsCents = v.billedCents - v.materialsCostCents;
  const rate = (minutes: number | null) => (minutes === null || earningsCents < 0 ? null : centsPerHour(earningsCents, minutes));
  return {
    earningsCents,
    perOnSiteHourCents: rate(v.onSiteMinutes),
    perPaidHourCents: v.onSiteMinutes === null || v.driveMinutes === null ? null : rate(v.onSiteMinutes + v.driveMinutes),
  };
}

/**
 * A day's (or a period's) totals. The driving is every visit's planned drive (the day plan's, finished or
 * not). The rates use only the visits whose minutes are known (finished, and for the paid hour with a
 * day plan), over the earnings of those same visits.
 */
export function totalsOf(visits: readonly (VisitFigures & { correctedCount: number })[]): EconomicsTotals {
  const sum = (f: (v: VisitFigures & { correctedCount: number }) => number) => visits.reduce((s, v) => s + f(v), 0);
  const timed = visits.filter((v) => v.onSiteMinutes !== null);
  const paid = timed.filter((v) => v.driveMinutes !== null);
  const earnings = (list: readonly VisitFigures[]) => list.reduce((s, v) => s + v.billedCents - v.materialsCostCents, 0);
  const onSite = timed.reduce((s, v) => s + (v.onSiteMinutes ?? 0), 0);
  const drive = sum((v) => v.driveMinutes ?? 0);
  const paidMinutes = paid.reduce((s, v) => s + (v.onSiteMinutes ?? 0) + (v.driveMinutes ?? 0), 0);
  const timedEarnings = earnings(timed);
  const paidEarnings = earnings(paid);
  return {
    visitCount: visits.length,
    correctedCount: sum((v) => v.correctedCount),
    billedCents: sum((v) => v.billedCents),
    materialsCostCents: sum((v) => v.materialsCostCents),
    earningsCents: earnings(visits),
    onSiteMinutes: onSite,
    driveMinutes: drive,
    perOnSiteHourCents: timedEarnings < 0 ? null : centsPerHour(timedEarnings, onSite),
    perPaidHourCents: paidEarnings < 0 || paid.length === 0 ? null : centsPerHour(paidEarnings, paidMinutes),
    visitsWithoutMinutes: visits.length - paid.length,
  };
}

/** Median of whole numbers; for an even count the mean of the two middle values, half up (R1). */
export function medianOf(values: readonly number[]): number {
  if (!values.length) throw new RangeError('median of nothing');
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid] : divideRoundHalfUp(sorted[mid - 1] + sorted[mid], 2);
}

/** One corrected item on a finished visit, for the minutes-per-unit comparison. */
export interface TimedItem {
  key: string;
  code: string;
  entryKey: string;
  entryName: string;
  quantity: number;
  /** Labour minutes the quote priced for the line (0 for flat-rate lines). */
  pricedMinutes: number;
  bookMinutesPerUnit: number | null;
}

/**
 * Splits a finished visit's on-site minutes over its corrected items (R5): by the minutes each was
 * priced with, or evenly by quantity when any of them was priced with none (flat-rate lines).
 * Answers the minutes per unit of each item, half up (R1).
 */
export function minutesPerUnitOnVisit(onSiteMinutes: number, items: readonly TimedItem[]): Map<string, number> {
  if (!items.length) return new Map();
  const weights = items.every((i) => i.pricedMinutes > 0) ? items.map((i) => i.pricedMinutes) : items.map((i) => i.quantity);
  const shares = allocateByWeight(onSiteMinutes, weights);
  return new Map(items.map((item, i) => [item.key, divideRoundHalfUp(shares[i], item.quantity)]));
}

/** How far the median may stray from the book before the entry is called priced low or high: 25 %, at least 5 minutes. */
export function minutesVerdict(book: number | null, median: number): MinutesVsBookRow['verdict'] {
  if (book === null) return 'no-book-minutes';
  const slack = Math.max(5, divideRoundHalfUp(book, 4));
  if (median > book + slack) return 'priced-low';
  if (median < book - slack) return 'priced-high';
  return 'about-right';
}

/** Median minutes per unit for each code and entry, against the rate book's labour minutes. */
export function minutesVsBook(samples: readonly { item: TimedItem; minutesPerUnit: number }[]): MinutesVsBookRow[] {
  const groups = new Map<string, { item: TimedItem; values: number[] }>();
  for (const s of samples) {
    const key = `${s.item.code}|${s.item.entryKey}`;
    const g = groups.get(key) ?? { item: s.item, values: [] };
    g.values.push(s.minutesPerUnit);
    groups.set(key, g);
  }
  return [...groups.values()]
    .map(({ item, values }) => {
      const median = medianOf(values);
      return {
        code: item.code,
        entryKey: item.entryKey,
        entryName: item.entryName,
        bookMinutesPerUnit: item.bookMinutesPerUnit,
        samples: values.length,
        medianMinutesPerUnit: median,
        differenceMinutes: item.bookMinutesPerUnit === null ? null : median - item.bookMinutesPerUnit,
        verdict: minutesVerdict(item.bookMinutesPerUnit, median),
      };
    })
    .sort((a, b) => a.code.localeCompare(b.code) || a.entryKey.localeCompare(b.entryKey));
}

/** One item with an outcome, for the single-visit completion rate. */
export interface OutcomeRecord {
  code: string;
  electricianName: string;
  /** YYYY-MM of the visit. */
  month: string;
  isFirstVisit: boolean;
  returnCause: ReturnCause | null;
}

function rateOf(group: string, records: readonly OutcomeRecord[]): SingleVisitRate {
  const firstVisit = records.filter((r) => r.isFirstVisit).length;
  return { group, items: records.length, firstVisit, rateBp: records.length ? divideRoundHalfUp(firstVisit * 10_000, records.length) : 0 };
}

function groupedRates(records: readonly OutcomeRecord[], by: (r: OutcomeRecord) => string): SingleVisitRate[] {
  const groups = new Map<string, OutcomeRecord[]>();
  for (const r of records) groups.set(by(r), [...(groups.get(by(r)) ?? []), r]);
  return [...groups.entries()].sort(([a], [b]) => a.localeCompare(b)).map(([group, list]) => rateOf(group, list));
}

/** The single-visit completion rate overall, per code, per electrician and per month, and the return causes counted. */
export function singleVisitRates(records: readonly OutcomeRecord[]) {
  const causes = new Map<ReturnCause, number>();
  for (const r of records) if (!r.isFirstVisit && r.returnCause) causes.set(r.returnCause, (causes.get(r.returnCause) ?? 0) + 1);
  return {
    overall: rateOf('All items', records),
    byCode: groupedRates(records, (r) => r.code),
    byElectrician: groupedRates(records, (r) => r.electricianName),
    byMonth: groupedRates(records, (r) => r.month),
    causes: [...causes.entries()].sort((a, b) => b[1] - a[1] || a[0].localeCompare(b[0])).map(([cause, count]) => ({ cause, count })),
  };
}
