import { listWords } from '../text/list-words';
import type { FindingCode } from '../findings/finding-code';
import type { Room } from '../findings/room';
import type { NecEdition } from '../requests/nec-edition';
import {
  AFCI_RULES,
  builtUnder,
  findRule,
  GFCI_RULES,
  TAMPER_RESISTANT_RULES,
  WEATHER_RULES,
  type BuiltUnder,
  type EditionRule,
} from './protection-history';

/** The house a note is about: when it was built and the edition adopted where it is. */
export interface HouseCode {
  readonly yearBuilt: number;
  readonly necEdition: NecEdition;
}

/**
 * Information about when the NEC first asked for a protection a finding says is missing, against
 * the year the house was built and the locally adopted edition. Never a ruling.
 */
export interface EditionNote {
  /** First edition in the 2005-2023 history that requires it, or null when no edition lists the room. */
  readonly requiredSince: number | null;
  /** Whether the adopted edition includes the requirement (new work and any replacement today). */
  readonly requiredByAdoptedEdition: boolean;
  /** Year the NEC first asked for it at the item's place (earliest of its rules, as it took effect), null when not recorded. */
  readonly firstRequired: number | null;
  /** The house against the first rule of the place; null when no edition lists the room. */
  readonly builtUnder: BuiltUnder | null;
  /** NEC section(s) the note rests on. */
  readonly reference: string;
  /** One line in plain words ("GFCI: required when this 1978 house was built; …"). */
  readonly summary: string;
  /** The whole note in plain words, with the deference to the authority having jurisdiction. */
  readonly text: string;
}

interface CodeTopic {
  readonly rules: readonly EditionRule[];
  /** Short name for the summary line. */
  readonly short: string;
  /** Sentence subject: "<protection> for <rule label> was first required in …". */
  readonly protection: string;
  /** The 406.4(D) replacement rule that applies when the device is replaced. */
  readonly replacementRule: string;
  /** Location keys per room: the main rule first, then rules that widen or narrow it. */
  readonly byRoom: Partial<Record<Room, readonly string[]>>;
  /** Rooms the section does not list (the note says so); other rooms give no note. */
  readonly unlisted: readonly Room[];
}

const TR_ROOMS = ['bathroom', 'kitchen', 'garage', 'exterior', 'basement', 'laundry', 'bedroom', 'living-area', 'hallway', 'dining', 'office'] as const;

const TOPICS: Partial<Record<FindingCode, CodeTopic>> = {
  'gfci-missing': {
    rules: GFCI_RULES,
    short: 'GFCI',
    protection: 'GFCI protection',
    replacementRule: '406.4(D)(3)',
    byRoom: {
      bathroom: ['bathrooms'],
      kitchen: ['kitchen-countertop-near-sink', 'kitchen-countertop', 'kitchen-all-receptacles'],
      garage: ['garages'],
      exterior: ['outdoors'],
      basement: ['basements-unfinished', 'basements-all'],
      'crawl-space': ['crawl-spaces'],
      laundry: ['laundry-areas', 'sinks-laundry-utility-wet-bar'],
    },
    unlisted: ['bedroom', 'living-area', 'hallway', 'dining', 'office', 'attic'],
  },
  'afci-missing': {
    rules: AFCI_RULES,
    short: 'AFCI',
    protection: 'AFCI protection',
    replacementRule: '406.4(D)(4)',
    byRoom: {
      bedroom: ['bedrooms', 'bedrooms-all-outlets'],
      'living-area': ['living-areas'],
      dining: ['dining-rooms'],
      hallway: ['hallways'],
      office: ['libraries-dens-similar'],
      kitchen: ['kitchens'],
      laundry: ['laundry-areas'],
    },
    unlisted: ['bathroom', 'garage', 'exterior', 'crawl-space', 'attic'],
  },
  'weather-cover-missing': {
    rules: WEATHER_RULES,
    short: 'Weather cover',
    protection: 'Weather protection',
    replacementRule: '406.4(D)(6)',
    byRoom: { exterior: ['wet-location-in-use-cover', 'weather-resistant-receptacles'] },
    unlisted: [],
  },
  'receptacle-damaged': {
    rules: TAMPER_RESISTANT_RULES,
    short: 'Tamper-resistant',
    protection: 'Tamper-resistant (TR) listing',
    replacementRule: '406.4(D)(5)',
    byRoom: Object.fromEntries(TR_ROOMS.map((room) => [room, ['tamper-resistant']])),
    unlisted: [],
  },
};

const DEFERENCE =
  'This is for information: the authority having jurisdiction decides what applies to this house, and a house being sold is generally not required to be brought up to the current code unless the contract or that authority requires it.';

// A year recalled from code history rather than read in the edition itself (from memory) says so in words
// a customer can read.
const FROM_MEMORY = ' (the year as commonly cited; check it in that edition)';

/** "was first required in 1975", "was first required in the 1999 edition, in force from 2002", … */
function cameIn(r: EditionRule): string {
  const memo = r.isFirstYearFromMemory ? FROM_MEMORY : '';
  if (r.firstYear === null) return `was required by the ${r.sinceEdition} edition at the latest${r.isFromMemory ? FROM_MEMORY : ''}`;
  if (r.firstInForce !== null) return `was first required in the ${r.firstYear} edition, in force from ${r.firstInForce}${memo}`;
  return `was first required in ${r.firstYear}${memo}`;
}

const AGAINST_THE_HOUSE: Record<BuiltUnder, string> = {
  'required-when-built': ', so this house was built under a code that asked for it',
  'added-later': ', after this house was built',
  'came-in-that-year': ', the year this house was built, so whether its code asked for it depends on when the local code took it up',
  'not-recorded': '; when it first came in is not recorded here, so whether the code this house was built under asked for it is not known',
  'not-in-local-edition': ', but the locally adopted edition does not include it yet, so the code this house was built under did not ask for it',
};

function historySentence(topic: CodeTopic, r: EditionRule, status: BuiltUnder): string {
  return `${topic.protection} for ${r.label} ${cameIn(r)}${AGAINST_THE_HOUSE[status]}.`;
}

/** "Weather protection" → "weather protection"; an acronym ("GFCI protection") stays. */
const lowerFirst = (s: string) => (/^[A-Z][a-z]/.test(s) ? s.charAt(0).toLowerCase() + s.slice(1) : s);

function todaySentence(topic: CodeTopic, rules: readonly EditionRule[], adopted: NecEdition): string {
  const inForce = rules.filter((r) => r.sinceEdition <= adopted);
  const notYet = rules.filter((r) => r.sinceEdition > adopted);
  const what = lowerFirst(topic.protection);
  const parts: string[] = [];
  if (inForce.length === rules.length) {
    parts.push(`Under the locally adopted ${adopted} edition, ${what} is required here for new work and for any replacement today (NEC ${topic.replacementRule}).`);
  } else if (inForce.length) {
    parts.push(
      `Under the locally adopted ${adopted} edition, ${what} is required for new work and for any replacement today (NEC ${topic.replacementRule}) for ${listWords(inForce.map((r) => r.label))}.`,
    );
  } else {
    parts.push(`The locally adopted ${adopted} edition does not ask for ${what} here, so it stays a recommendation, also for a replacement.`);
  }
  if (inForce.length && notYet.length) {
    parts.push(`The ${adopted} edition does not yet ask for it for ${listWords(notYet.map((r) => `${r.label} (from the ${r.sinceEdition} edition)`))}.`);
  }
  return parts.join(' ');
}

function summaryLine(topic: CodeTopic, statuses: readonly BuiltUnder[], main: EditionRule, house: HouseCode, first: number | null): string {
  const y = house.yearBuilt;
  let built: string;
  if (statuses.every((s) => s === 'required-when-built')) built = `required when this ${y} house was built`;
  else if (statuses.every((s) => s === 'added-later')) built = `came in ${first} (after this ${y} house was built): a recommended upgrade`;
  else if (statuses.includes('required-when-built')) built = `partly required when this ${y} house was built`;
  else if (statuses.includes('came-in-that-year')) built = `came in ${first}, the year this house was built`;
  // The short line claims no more than the long text: where one part's first edition is not recorded, it says so.
  else if (statuses.some((s) => s === 'added-later' || s === 'not-in-local-edition'))
    built = statuses.includes('not-recorded')
      ? `partly not asked for when this ${y} house was built, the rest not recorded: a recommended upgrade`
      : `not asked for when this ${y} house was built: a recommended upgrade`;
  else built = `not recorded for a house built in ${y}`;
  const today = main.sinceEdition <= house.necEdition ? 'required for any replacement today' : `not in the adopted ${house.necEdition} edition`;
  return `${topic.short}: ${built}; ${today}`;
}

function buildNote(topic: CodeTopic, rules: readonly EditionRule[], house: HouseCode): EditionNote {
  const main = rules[0];
  const statuses = rules.map((r) => builtUnder(r, house.yearBuilt, house.necEdition));
  const chronological = rules.map((r, i) => ({ r, status: statuses[i] })).sort((a, b) => (a.r.firstYear ?? a.r.sinceEdition) - (b.r.firstYear ?? b.r.sinceEdition));
  const firstYears = rules.map((r) => r.firstInForce ?? r.firstYear).filter((y): y is number => y !== null);
  const first = firstYears.length === rules.length ? Math.min(...firstYears) : null;
  const sections = [...new Set(rules.map((r) => r.section))];
  const text = [
    `This house was built in ${house.yearBuilt}.`,
    ...chronological.map(({ r, status }) => historySentence(topic, r, status)),
    statuses.some((s) => s === 'added-later' || s === 'not-in-local-edition')
      ? 'Where the code this house was built under did not ask for it, adding it is recommended for safety, not a code violation of the original work.'
      : null,
    todaySentence(topic, rules, house.necEdition),
    DEFERENCE,
  ].filter((s): s is string => s !== null);
  return {
    requiredSince: main.sinceEdition,
    requiredByAdoptedEdition: main.sinceEdition <= house.necEdition,
    firstRequired: first,
    builtUnder: statuses[0],
    reference: [...sections, topic.replacementRule].join(', '),
    summary: summaryLine(topic, statuses, main, house, first),
    text: text.join(' '),
  };
}

/** The note for one location key of a code's topic, or null when the key is not in its history. */
export function editionNoteForLocation(code: FindingCode, key: string, house: HouseCode): EditionNote | null {
  const topic = TOPICS[code];
  const r = topic && findRule(topic.rules, key);
  if (!topic || !r) return null;
  return buildNote(topic, [r], house);
}

/**
 * Information for a missing-protection finding (GFCI, AFCI, weather cover) or a receptacle to
 * replace (tamper-resistant) in a room, against the year the house was built and the adopted NEC
 * edition. Null for other codes and for places the history says nothing about.
 */
export function editionNote(code: FindingCode | string, room: Room | string, house: HouseCode): EditionNote | null {
  const topic = TOPICS[code as FindingCode];
  if (!topic) return null;
  const keys = topic.byRoom[room as Room];
  if (keys) {
    const rules = keys.map((k) => findRule(topic.rules, k)).filter((r): r is EditionRule => r !== undefined);
    return buildNote(topic, rules, house);
  }
  if (!topic.unlisted.includes(room as Room)) return null;
  const section = topic.rules[0].section;
  return {
    requiredSince: null,
    requiredByAdoptedEdition: false,
    firstRequired: null,
    builtUnder: null,
    reference: section,
    summary: `${topic.short}: not a listed place in the NEC`,
    text: `NFPA 70 ${section} does not list this room for ${lowerFirst(topic.protection)} in any edition covered here (from ${topic.rules[0].firstYear ?? topic.rules[0].sinceEdition} to 2023), so adding it is a safety recommendation. ${DEFERENCE}`,
  };
}
