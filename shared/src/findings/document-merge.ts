import { CONFIDENCES, type Finding } from './finding.schema';
import { lineItemMarker } from './line-items';

/**
 * Document-level merge: one finding per defect across the whole report.
 *
 * Reports tell the same defect more than once: a summary list that repeats the body, a follow-up
 * sentence ("Extension cords are not permanent wiring."), a recap at the end, a photo caption and
 * its paragraph. A later finding with the same code and a compatible room (the same room, or one of
 * the two `unknown`) is the earlier one told again, unless something in the two sentences separates
 * them (`separates`, each reason with an example in document-merge.spec.ts):
 *  - a count on either ("two receptacles", "(3)"), unless both give the same count;
 *  - a plural after a count (one gives a single device, the other speaks of devices in the plural);
 *  - another device word (a receptacle and a cover plate, a switch and a light);
 *  - another place qualifier (left and right, upstairs and downstairs, front and rear, the second
 *    bathroom, unit 1 and unit 2, circuit 5 and circuit 11);
 *  - another part of the equipment (service mast and meter base, dead front and directory), or
 *    another breaker rating (a 20 A and a 30 A breaker are two breakers);
 *  - both being separate items of one list (two bullets, rows or numbered items of one section).
 * The earlier finding is kept (its evidence and offsets stay exact substrings of the report); the
 * later one only fills its quantity, recommendation and location where the earlier has none, and the
 * stronger confidence of the two is kept.
 */

/** Where a finding was read: its block, the block's section, and whether the block is a list item. */
export interface FindingPlace {
  readonly block: number;
  readonly section: number;
  readonly listItem: boolean;
  /** The kind of list the item belongs to: a summary table's rows and the numbered items after it are two lists. */
  readonly listKind?: ListKind | null;
}

export type ListKind = 'table' | 'numbered' | 'lettered' | 'bullet' | 'line';

const TABLE_ROW = /^\s*\||\S\s*\|\s*\S|[^\n]\t|\S {3,}\S/;
const NUMBERED = /^\s*\(?\d{1,3}(?:\.\d{1,3}){0,3}[.):]\s/;
const LETTERED = /^\s*(?:\(?[a-zA-Z][.)]\s|\([ivx]{1,4}\)\s|[A-Z]{1,2}-?\d{1,3}[.:)]?\s)/;

/** The kind of list a block's first line starts an item of, or null when it starts none. */
export function listKindOf(blockText: string): ListKind | null {
  if (!isListItem(blockText)) return null;
  const firstLine = blockText.split('\n', 1)[0];
  if (NUMBERED.test(firstLine)) return 'numbered';
  if (LETTERED.test(firstLine)) return 'lettered';
  if (TABLE_ROW.test(firstLine)) return 'table';
  return /^\s*[-•*▪►▲△●○◦·■□✓✔>]\s/.test(firstLine) ? 'bullet' : 'line';
}

/**
 * The start of a list item: a bullet, a number or letter ("3.", "(b)", "E-4"), or a table row (cells
 * split by pipes, tabs or wide gaps), or an item line of its own (line-items.ts).
 */
const LIST_ITEM = /^\s*(?:[-•*▪►▲△●○◦·■□✓✔>]\s|\(?\d{1,3}(?:\.\d{1,3}){0,3}[.):]\s|\(?[a-zA-Z][.)]\s|\([ivx]{1,4}\)\s|[A-Z]{1,2}-?\d{1,3}[.:)]?\s|\|)|[^\n]\t|\S {3,}\S|\S\s*\|\s*\S/;

/** Whether a block's text (from its first character in the report) starts a list item. */
export function isListItem(blockText: string): boolean {
  const firstLine = blockText.split('\n', 1)[0];
  return LIST_ITEM.test(firstLine) || lineItemMarker(firstLine) !== null;
}

/**
 * Devices a sentence can name, by kind. Two findings of one code that name devices of different
 * kinds only (a receptacle and a cover plate) are two defects.
 */
const DEVICES: ReadonlyArray<readonly [string, RegExp]> = [
  ['plate', /\b(?:cover\s*plates?|wall\s*plates?|switch\s*plates?|face\s*plates?|plates?)\b/i],
  ['receptacle', /\b(?:receptacles?|recepticles?|outlets?|recepts?\.?|rcpts?\.?|plugs?-?ins?)\b/i],
  ['switch', /\b(?:switch(?:es)?|dimmers?|toggles?)\b/i],
  ['light', /\b(?:lights?|light fixtures?|fixtures?|luminaires?|lamps?|lampholders?|sconces?|can lights?)\b/i],
  ['fan', /\b(?:fans?)\b/i],
  ['alarm-smoke', /\bsmoke\b/i],
  ['alarm-co', /\b(?:carbon monoxide|co)\s+(?:alarms?|detectors?)\b/i],
];

/**
 * Parts of the service, the panel and the grounding system (common practice: an inspection report
 * names each part it finds fault with, e.g. "service mast" and "meter base" are two repairs).
 */
const PARTS: ReadonlyArray<readonly [string, RegExp]> = [
  ['mast', /\b(?:mast|weather\s*head|service\s*head|riser)\b/i],
  ['meter', /\bmeter(?:\s*(?:base|socket|can|enclosure))?\b/i],
  ['drop', /\b(?:service\s+drop|drop\s+conductors?|overhead\s+(?:conductors|service)|clearance)\b/i],
  ['drip-loop', /\bdrip\s+loops?\b/i],
  ['service-entrance', /\b(?:se\s+cable|service\s+entrance\s+(?:cable|conductors?))\b/i],
  ['dead-front', /\b(?:dead\s*-?\s*front|inner\s+cover|panel\s+cover)\b/i],
  ['filler', /\b(?:filler|knock-?outs?|kos?|open\s+(?:slots?|spaces?))\b/i],
  ['directory', /\b(?:directory|labell?(?:ed|ing)|unlabell?ed|legend)\b/i],
  ['working-space', /\b(?:working\s+(?:space|clearance)|blocked|obstructed|shelv\w*)\b/i],
  ['screws', /\bscrews?\b/i],
  ['rod', /\b(?:ground(?:ing)?\s+rods?|rods?)\b/i],
  ['clamp', /\b(?:clamps?|acorns?)\b/i],
  ['water-bond', /\b(?:water\s+(?:pipe|line|main)|gas\s+(?:pipe|line)|bonding\s+jumper)\b/i],
];

/** Place qualifiers, each in its dimension: two findings with different values in one dimension are two places. */
const QUALIFIERS: ReadonlyArray<readonly [string, RegExp, (m: RegExpExecArray) => string]> = [
  ['side', /\b(left|right)\b/gi, (m) => m[1].toLowerCase()],
  ['level', /\b(upstairs|downstairs|upper|lower|first[- ]floor|second[- ]floor|third[- ]floor|1st[- ]floor|2nd[- ]floor|3rd[- ]floor|main[- ](?:floor|level))\b/gi, (m) => levelOf(m[1])],
  ['facing', /\b(front|rear|back|north|south|east|west)\b(?!\s+(?:of|to)\b)/gi, (m) => (m[1].toLowerCase() === 'back' ? 'rear' : m[1].toLowerCase())],
  ['unit', /\b(?:unit|apt\.?|apartment)\s*#?\s*([a-z]\b|\d{1,4}[a-z]?)/gi, (m) => m[1].toLowerCase()],
  ['which', /\b(hall|primary|master|guest|main|second|third|fourth|2nd|3rd|4th|en[- ]?suite|jack[- ]and[- ]jill)\s+(?:bath(?:room)?|bed(?:room)?|br)\b/gi, (m) => whichOf(m[1])],
  ['room-number', /\b(?:bed(?:room)?|br|bdrm|bath(?:room)?)\s*#?\s*(\d)\b/gi, (m) => m[1]],
  ['position', /\b(?:circuit|ckt|cir|slot|position|pos\.?|space|sp|breaker)\s*#?\s*(\d{1,2}(?:\s*\/\s*\d{1,2})?)\b/gi, (m) => m[1].replace(/\s+/g, '')],
];

function levelOf(word: string): string {
  const w = word.toLowerCase().replace(/[- ]/g, '');
  if (/^(?:upstairs|upper|secondfloor|2ndfloor|thirdfloor|3rdfloor)$/.test(w)) return w.startsWith('th') || w.startsWith('3') ? 'third' : 'upper';
  if (/^(?:downstairs|lower)$/.test(w)) return 'lower';
  return 'main';
}

function whichOf(word: string): string {
  const w = word.toLowerCase();
  if (w === 'master' || w === 'primary' || w.startsWith('en')) return 'primary';
  if (w === '2nd') return 'second';
  if (w === '3rd') return 'third';
  if (w === '4th') return 'fourth';
  return w;
}

/** Words by which a report tells another device of the same kind ("is also not GFCI protected", "another receptacle"). */
const ANOTHER = /\b(?:also|another|too|as well|other|additional)\b/i;

/** Breaker and fuse ratings ("20 A", "30 amp", "40A 2P"): two ratings are two devices. */
const RATING = /\b(\d{2,3})\s*-?\s*(?:a|amps?|ampere)\b/gi;

/** A device noun in the plural without a number ("receptacles", "the outlets"). */
const PLURAL_DEVICE = /\b(?:receptacles|recepticles|outlets|recepts|rcpts|switches|lights|fixtures|fans|plates|breakers|fuses|overcurrent devices|alarms|detectors|boxes)\b/i;
/** A single device named with its article ("the receptacle", "a light"). */
const SINGLE_DEVICE = /\b(?:a|an|the|one|this|that|single)\s+(?:[\w-]+\s+){0,3}?(?:receptacle|recepticle|outlet|recept|switch|light|fixture|fan|plate|breaker|alarm|detector|box)\b(?!s)/i;

function kinds(text: string, table: ReadonlyArray<readonly [string, RegExp]>): Set<string> {
  return new Set(table.filter(([, re]) => re.test(text)).map(([k]) => k));
}

function qualifiers(text: string): Map<string, Set<string>> {
  const out = new Map<string, Set<string>>();
  for (const [dim, re, value] of QUALIFIERS) {
    re.lastIndex = 0;
    for (let m = re.exec(text); m !== null; m = re.exec(text)) {
      if (!out.has(dim)) out.set(dim, new Set());
      out.get(dim)!.add(value(m));
    }
  }
  return out;
}

function ratings(text: string): Set<string> {
  const out = new Set<string>();
  RATING.lastIndex = 0;
  for (let m = RATING.exec(text); m !== null; m = RATING.exec(text)) out.add(m[1]);
  return out;
}

const disjoint = (a: ReadonlySet<string>, b: ReadonlySet<string>) => a.size > 0 && b.size > 0 && ![...a].some((x) => b.has(x));

/** What the merge reads of a finding's sentence, worked out once per finding. */
interface Reading {
  readonly text: string;
  readonly devices: Set<string>;
  readonly parts: Set<string>;
  readonly qualifiers: Map<string, Set<string>>;
  readonly ratings: Set<string>;
  readonly plural: boolean;
  readonly single: boolean;
}

function read(f: Finding): Reading {
  const text = `${f.evidence} ${f.location}`.replace(/\s+/g, ' ');
  return {
    text,
    devices: kinds(text, DEVICES),
    parts: kinds(text, PARTS),
    qualifiers: qualifiers(text),
    ratings: ratings(f.evidence),
    plural: PLURAL_DEVICE.test(f.evidence) && (f.quantity === null || f.quantity > 1),
    single: SINGLE_DEVICE.test(f.evidence) || f.quantity === 1,
  };
}

/** Why two findings of one code and a compatible room are two defects, or null when nothing separates them. */
export function separates(a: Finding, b: Finding, ra: Reading = read(a), rb: Reading = read(b), pa?: FindingPlace, pb?: FindingPlace): string | null {
  const count = (f: Finding) => f.quantity !== null && f.quantity > 1;
  if ((count(a) || count(b)) && a.quantity !== b.quantity) return 'count';
  if ((count(a) && rb.plural && b.quantity === null) || (count(b) && ra.plural && a.quantity === null)) return 'plural after a count';
  if ((a.quantity === 1 && rb.plural && !rb.single) || (b.quantity === 1 && ra.plural && !ra.single)) return 'plural after a count';
  if (disjoint(ra.devices, rb.devices)) return 'device';
  if (ANOTHER.test(b.evidence) && a.evidence !== b.evidence) return 'another';
  for (const [dim, values] of ra.qualifiers) {
    const other = rb.qualifiers.get(dim);
    if (other && disjoint(values, other)) return 'place';
  }
  if (disjoint(ra.parts, rb.parts)) return 'part';
  if (disjoint(ra.ratings, rb.ratings)) return 'part';
  if (a.computation !== null && b.computation !== null && a.computation !== b.computation) return 'part';
  if (pa && pb && pa.listItem && pb.listItem && pa.section === pb.section && pa.block !== pb.block && (pa.listKind ?? null) === (pb.listKind ?? null)) return 'list';
  return null;
}

const rank = (f: Finding) => CONFIDENCES.indexOf(f.confidence);

/** The findings with every later telling of a defect merged into its first (see the top of this file). */
export function mergeDocument(findings: readonly Finding[], placeOf?: (f: Finding) => FindingPlace | undefined): Finding[] {
  const readings = findings.map(read);
  const places = findings.map((f) => placeOf?.(f));
  const kept: number[] = [];
  const merged: Finding[] = [];
  findings.forEach((f, j) => {
    const into = kept.findIndex((i) => {
      const g = findings[i];
      if (g.code !== f.code) return false;
      if (!(g.room === f.room || g.room === 'unknown' || f.room === 'unknown')) return false;
      return separates(g, f, readings[i], readings[j], places[i], places[j]) === null;
    });
    if (into === -1) {
      kept.push(j);
      merged.push(f);
      return;
    }
    const g = merged[into];
    // A room the earlier finding lacks ("unknown") is filled like its other empty fields.
    const room = g.room === 'unknown' ? f.room : g.room;
    merged[into] = {
      ...g,
      room,
      quantity: g.quantity ?? f.quantity,
      recommendation: g.recommendation ?? f.recommendation,
      location: g.location !== '' && !(g.room === 'unknown' && f.room !== 'unknown') ? g.location : f.location,
      confidence: rank(f) < rank(g) ? f.confidence : g.confidence,
    };
  });
  return merged;
}
