import type { Range } from './clause-splitter';
import { requiredLiteralTest } from './phrase-literals';
import { scanAll } from './regex-scan';

/**
 * Computed overcurrent findings: a breaker or fuse larger than its conductor allows, or larger
 * than an appliance nameplate's maximum overcurrent rating. The rating, the conductor's size and
 * its material are read from the (normalised) sentence and checked against NFPA 70 (NEC) 240.4(D),
 * the small-conductor rule; the check is shown on the item ("40 A breaker on 10 AWG copper; NEC
 * 240.4(D) allows 30 A").
 */

/** NEC 240.4(D): largest overcurrent device for small conductors (amperes), by material and AWG size. */
export const SMALL_CONDUCTOR_LIMITS: Readonly<Record<'copper' | 'aluminum', Readonly<Record<number, number>>>> = {
  copper: { 14: 15, 12: 20, 10: 30 },
  aluminum: { 12: 15, 10: 25 },
};

export interface OvercurrentCheck extends Range {
  /** How the finding was computed, in the words shown on the item. */
  readonly computation: string;
}

/**
 * "30 A", "30A", "30-amp", "30 amps", "30 ampere" (a rating of 10 to 200 A); not "20/22 A/C" (air
 * conditioning), and not a nameplate's load current ("MCA 18A", "RLA 14 A", "FLA 22A"), which is no
 * device's rating.
 */
const RATING = /(?<![\w.])(?<!\b(?:mca|rla|fla|lra)\s?:?\s?)(\d{2,3})\s?-?(?:a|amps?|amperes?)\b(?!\s*(?:x|\/)\s*\d)(?!\/c\b)/gi;
/** "12 AWG" (shorthand such as "#12", "12 ga", "12-gauge" is normalised to this before). */
const SIZE = /(?<![\w.])(\d{1,2})[\s-]?awg\b/gi;
const MATERIAL = /\b(?:(aluminum|aluminium)|(copper))\b/gi;
const DEVICE = /\b(?:breakers?|fuses?|fused|ocpds?|overcurrent|double-pole|2-pole|single-pole|two-pole|circuit|[12]-?p)\b/i;
/** A rating said of the device put in ("Installed: 2P 35A", "existing 40 A"), after a nameplate sentence. */
const INSTALLED = /\b(?:installed|existing|actual|in place|present)\b/i;
/** The nameplate's limit: "nameplate max overcurrent device 30A", "MOCP 25 A", "max breaker 20A". */
const NAMEPLATE = /\b(?:(?:nameplate|name plate|label|data plate|rating plate)\b[^.;]{0,30}?\bmax(?:imum|\.)?|max(?:imum|\.)?\s+(?:(?:overcurrent|ocpd|breaker|fuse|circuit breaker|hacr|device|protection|size|rating|or|and)\b\s*\/?\s*)+|mocp|max\.?\s+ocp)[^.;\d]{0,40}?(\d{2,3})\s?-?(?:a|amps?|amperes?)\b|\b(?:nameplate|name plate|label|data plate|rating plate|plate)\b[^.;\d]{0,30}?(\d{2,3})\s?-?(?:a|amps?|amperes?)\s+(?:max(?:imum|\.)?|at most)\b/gi;
/** False for a text that lacks the words every nameplate wording needs ("max", "mocp", "label", "plate"). */
const mayStateNameplate = requiredLiteralTest(NAMEPLATE);
/** The nameplate maxima a text states (the search for the words first: most sentences have none). */
function nameplateMentions(text: string): Mention[] {
  return mayStateNameplate(text) ? mentions(NAMEPLATE, text) : [];
}
/** Text between a rating and a size that keeps them about the same circuit. */
const MAX_PAIR_GAP = 140;

interface Mention extends Range {
  readonly value: number;
}

function mentions(re: RegExp, text: string): Mention[] {
  return scanAll(re, text).map((m) => ({ start: m.index, end: m.index + m[0].length, value: Number(m[1] ?? m[2]) }));
}

/**
 * The nameplate maximum a sentence states with no device rating beside it, if any: a following
 * sentence of the block may give the device's rating ("The condenser is on a 25 A breaker and its
 * nameplate lists 25 A maximum" has both, so nothing carries).
 */
export function nameplateMaximum(text: string): number | null {
  const found = nameplateMentions(text);
  if (found.length === 0) return null;
  const paired = mentions(RATING, text).some((r) => !found.some((n) => r.start >= n.start && r.end <= n.end));
  return paired ? null : found[found.length - 1].value;
}

/** The material said nearest to a conductor size (after it first: "12 AWG copper"), copper when none. */
function materialOf(text: string, size: Mention, segment: Range): 'copper' | 'aluminum' {
  let best: { d: number; metal: 'copper' | 'aluminum' } | null = null;
  for (const m of scanAll(MATERIAL, text)) {
    if (m.index < segment.start || m.index >= segment.end) continue;
    const d = m.index >= size.end ? m.index - size.end : (size.start - (m.index + m[0].length)) * 1.5;
    if (d > 40) continue;
    if (!best || d < best.d) best = { d, metal: m[1] ? 'aluminum' : 'copper' };
  }
  return best?.metal ?? 'copper';
}

/** Comma- and semicolon-free stretches: a rating pairs with a size of its own stretch first. */
function stretchOf(text: string, pos: number): Range {
  let start = pos;
  while (start > 0 && !/[;,(]/.test(text[start - 1])) start--;
  let end = pos;
  while (end < text.length && !/[;,)]/.test(text[end])) end++;
  return { start, end };
}

function nearestSize(sizes: readonly Mention[], rating: Mention, text: string): Mention | null {
  const own = stretchOf(text, rating.start);
  const inStretch = sizes.filter((s) => s.start >= own.start && s.end <= own.end);
  const pool = inStretch.length > 0 ? inStretch : sizes;
  let best: Mention | null = null;
  let bestGap = Infinity;
  for (const s of pool) {
    const gap = s.start >= rating.end ? s.start - rating.end : rating.start - s.end;
    if (gap < bestGap && gap <= MAX_PAIR_GAP) {
      best = s;
      bestGap = gap;
    }
  }
  return best;
}

/** The oversized overcurrent devices stated in one sentence, each with its computation. */
/** What the sentence before in the same block said: a nameplate maximum, or a device rating. */
export interface CarriedRatings {
  readonly nameplate: number | null;
  readonly rating: number | null;
}

/** A rating of a main breaker or of the service is not a branch device's rating. */
const MAIN_OR_SERVICE = /\bmain\s+(?:breaker|disconnect|fuse|brkr)|\bservice\b|\b\d{3}\s?-?a(?:mps?)?\s+(?:main|panel|service)/i;

/** A branch device's rating stated by the sentence (for the next sentence's nameplate), or null. */
export function deviceRating(text: string): number | null {
  if (!DEVICE.test(text) || MAIN_OR_SERVICE.test(text) || nameplateMentions(text).length > 0) return null;
  return mentions(RATING, text)[0]?.value ?? null;
}

const nameplateCheck = (rating: number, limit: number, at: Range): OvercurrentCheck => ({
  ...at,
  computation: `${rating} A overcurrent device; the nameplate allows at most ${limit} A (NEC 110.3(B))`,
});

/** A rating written right before a conductor size ("20A #14 Cu", "30 A on 10 AWG"): a branch device on that conductor, as a panel schedule's row gives it. */
const RATING_ON_SIZE = /(?<![\w.])\d{2}\s?-?a(?:mps?)?\s+(?:(?:on|w\/|with)\s+)?\d{1,2}\s?awg\b/i;

export function checkOvercurrent(text: string, carried: CarriedRatings | null = null): OvercurrentCheck[] {
  if (!DEVICE.test(text) && !/\bfus|\bbreak|\bnameplate|\bmax|\binstalled/i.test(text) && !RATING_ON_SIZE.test(text) && !isScheduleRow(text)) return [];
  const nameplates = nameplateMentions(text);
  // "The data plate lists max breaker 30 A. The breaker at the disconnect is 45 A." (or the other
  // way round): the nameplate and the device's rating in two sentences of one block.
  if (nameplates.length === 0 && carried?.nameplate != null && (DEVICE.test(text) || INSTALLED.test(text)) && !MAIN_OR_SERVICE.test(text)) {
    const over = mentions(RATING, text).find((r) => r.value > (carried.nameplate ?? Infinity));
    if (over) return [nameplateCheck(over.value, carried.nameplate, over)];
  }
  const unpaired = nameplates.length > 0 && mentions(RATING, text).every((r) => nameplates.some((n) => r.start >= n.start && r.end <= n.end));
  if (unpaired && carried?.rating != null && carried.rating > nameplates[0].value) return [nameplateCheck(carried.rating, nameplates[0].value, nameplates[0])];
  const ratings = mentions(RATING, text).filter((r) => !nameplates.some((n) => r.start >= n.start && r.end <= n.end));
  if (ratings.length === 0) return carried?.rating != null && nameplates.length === 0 ? carriedRatingCheck(text, carried.rating) : [];
  const sizes = conductorSizes(text);
  const found: OvercurrentCheck[] = [];
  for (const rating of ratings) {
    const nameplate = nameplates.find((n) => Math.abs(n.start - rating.end) <= 120 || Math.abs(rating.start - n.end) <= 120);
    if (nameplate && rating.value > nameplate.value) {
      found.push({
        start: Math.min(rating.start, nameplate.start),
        end: Math.max(rating.end, nameplate.end),
        computation: `${rating.value} A overcurrent device; the nameplate allows at most ${nameplate.value} A (NEC 110.3(B))`,
      });
      continue;
    }
    if (nameplate) continue;
    // "Main panel (100A) | ... two 12 AWG conductors": a rating of 100 A or more beside small conductors
    // is the panel's or the service's, not the branch device's (240.4(D) stops at 30 A).
    if (rating.value >= 100) continue;
    const size = nearestSize(sizes, rating, text);
    if (!size) continue;
    const metal = materialOf(text, size, { start: 0, end: text.length });
    const limit = SMALL_CONDUCTOR_LIMITS[metal][size.value];
    if (limit === undefined || rating.value <= limit) continue;
    found.push({
      start: Math.min(rating.start, size.start),
      end: Math.max(rating.end, size.end),
      computation: `${rating.value} A ${/fuse/i.test(text) ? 'fuse' : 'breaker'} on ${size.value} AWG ${metal}; NEC 240.4(D) allows ${limit} A`,
    });
  }
  return found;
}

/**
 * Conductor sizes said other ways than "12 AWG": a cable's size and conductor count ("10/3 UF",
 * "12-2 NM", "14/2 w/g"; common practice: the first number is the AWG size) and a spoken or written
 * "number 12 copper" / "No. 10 wire".
 */
const CABLE_SIZE = /(?<![\w./-])(14|12|10|8|6)\s?[/-]\s?[234](?![\d/.])(?:\s?(?:w\/?\s?g(?:round|rd|nd)?|with ground))?(?=\s|,|;|\)|$)(?!\s*(?:a|amps?|v|volts?|ft|feet|inch|in\.|years?|yrs?)\b)/gi;
const NUMBER_SIZE = /\b(?:number|num\.?|no\.?)\s(14|12|10|8|6)\s(?=(?:(?:solid|stranded|thhn|thwn|aluminum|copper)\s)*(?:aluminum|copper|wires?|conductors?|cable|nm|uf)\b)/gi;

function conductorSizes(text: string): Mention[] {
  const sizes = mentions(SIZE, text);
  for (const re of [CABLE_SIZE, NUMBER_SIZE]) {
    for (const m of mentions(re, text)) if (!sizes.some((s) => s.start < m.end && m.start < s.end)) sizes.push(m);
  }
  return sizes.sort((a, b) => a.start - b.start);
}

/** A sentence that speaks of the device just named ("The conductors on that breaker are 12 AWG copper."). */
const BACK_TO_DEVICE = /\b(?:that|this|the same|its|those|these)\s+(?:\w+\s+)?(?:breaker|fuse|circuit|conductors?|wires?|wiring|cable)\b|^\s*(?:it|they|the (?:conductors?|wires?|wiring|cable))\b/i;

/**
 * The conductors of the device the sentence before rated: "The lift motor is on a 30 A breaker.
 * The conductors landed on that breaker are 12 AWG copper." (NEC 240.4(D) as above).
 */
function carriedRatingCheck(text: string, rating: number): OvercurrentCheck[] {
  if (rating >= 100 || !BACK_TO_DEVICE.test(text)) return [];
  const sizes = conductorSizes(text);
  if (sizes.length !== 1) return [];
  const [size] = sizes;
  const metal = materialOf(text, size, { start: 0, end: text.length });
  const limit = SMALL_CONDUCTOR_LIMITS[metal][size.value];
  if (limit === undefined || rating <= limit) return [];
  return [{ start: size.start, end: size.end, computation: `${rating} A ${/fuse/i.test(text) ? 'fuse' : 'breaker'} on ${size.value} AWG ${metal}; NEC 240.4(D) allows ${limit} A` }];
}

/**
 * A row of a panel schedule ("7   20 A   12 AWG aluminum   Bedrooms"): a short line that gives a
 * circuit's rating and its conductor and names no device, the columns having been named once above.
 */
const SCHEDULE_ROW_MAX = 90;
function isScheduleRow(text: string): boolean {
  if (text.length > SCHEDULE_ROW_MAX || /[.!?]\s+\S/.test(text)) return false;
  const ratings = mentions(RATING, text);
  return ratings.length === 1 && ratings[0].value < 100 && conductorSizes(text).length === 1;
}
