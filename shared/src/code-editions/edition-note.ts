import type { FindingCode } from '../findings/finding-code';
import type { Room } from '../findings/room';
import type { NecEdition } from '../requests/nec-edition';
import { AFCI_RULES, findRule, GFCI_RULES, WEATHER_RULES, type EditionRule } from './protection-history';

/** Information about when the NEC first asks for a protection a finding says is missing. */
export interface EditionNote {
  /** First edition in the history that requires it there, or null when no edition lists the room. */
  readonly requiredSince: number | null;
  /** Whether the adopted edition includes the requirement. */
  readonly requiredByAdoptedEdition: boolean;
  /** NEC section(s) the note rests on. */
  readonly reference: string;
  readonly text: string;
}

interface CodeTopic {
  readonly rules: readonly EditionRule[];
  readonly protection: string;
  /** The 406.4(D) replacement rule that applies when the device is replaced. */
  readonly replacementRule: string;
  /** Location key per room: the main rule, then rules that widen it in later editions. */
  readonly byRoom: Partial<Record<Room, readonly string[]>>;
  /** Rooms the section does not list (the note says so); other rooms give no note. */
  readonly unlisted: readonly Room[];
}

const TOPICS: Partial<Record<FindingCode, CodeTopic>> = {
  'gfci-missing': {
    rules: GFCI_RULES,
    protection: 'GFCI protection',
    replacementRule: '406.4(D)(3)',
    byRoom: {
      bathroom: ['bathrooms'],
      kitchen: ['kitchen-countertop', 'kitchen-all-receptacles'],
      garage: ['garages'],
      exterior: ['outdoors'],
      basement: ['basements-unfinished', 'basements-all'],
      'crawl-space': ['crawl-spaces'],
      laundry: ['laundry-areas'],
    },
    unlisted: ['bedroom', 'living-area', 'hallway', 'dining', 'office', 'attic'],
  },
  'afci-missing': {
    rules: AFCI_RULES,
    protection: 'AFCI protection',
    replacementRule: '406.4(D)(4)',
    byRoom: {
      bedroom: ['bedrooms'],
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
    protection: 'an in-use cover and a weather-resistant receptacle',
    replacementRule: '406.4(D)(6)',
    byRoom: { exterior: ['wet-location-in-use-cover', 'weather-resistant-receptacles'] },
    unlisted: [],
  },
};

const SALE_CAVEAT =
  'A house being sold is generally not required to be brought up to the current edition, so this is a safety recommendation unless the contract or the authority having jurisdiction requires it.';

function sincePhrase(r: EditionRule): string {
  const edition = r.isAtOrBefore ? `the ${r.sinceEdition} edition or earlier` : `the ${r.sinceEdition} edition`;
  return r.isFromMemory ? `${edition} (from memory, to be confirmed)` : edition;
}

function ruleSentence(r: EditionRule, adopted: NecEdition): string {
  const included = r.sinceEdition <= adopted ? 'includes' : 'does not include';
  return `NFPA 70 ${r.section} asks for it for ${r.label} since ${sincePhrase(r)}; the adopted ${adopted} edition ${included} this.`;
}

/** The note for one location key of a code's topic, or null when the key is not in its history. */
export function editionNoteForLocation(code: FindingCode, key: string, adopted: NecEdition): EditionNote | null {
  const topic = TOPICS[code];
  const r = topic && findRule(topic.rules, key);
  if (!topic || !r) return null;
  return buildNote(topic, [r], adopted);
}

/**
 * Information for a missing-protection finding (GFCI, AFCI, weather cover) in a room, against the
 * adopted NEC edition. Null for other codes and for places the history says nothing about.
 */
export function editionNote(code: FindingCode, room: Room, adopted: NecEdition): EditionNote | null {
  const topic = TOPICS[code];
  if (!topic) return null;
  const keys = topic.byRoom[room];
  if (keys) {
    const rules = keys.map((k) => findRule(topic.rules, k)).filter((r): r is EditionRule => r !== undefined);
    return buildNote(topic, rules, adopted);
  }
  if (!topic.unlisted.includes(room)) return null;
  const section = topic.rules[0].section;
  return {
    requiredSince: null,
    requiredByAdoptedEdition: false,
    reference: section,
    text: `Information only: NFPA 70 ${section} does not list this room for ${topic.protection} in the editions covered here (2005-2023). ${SALE_CAVEAT}`,
  };
}

function buildNote(topic: CodeTopic, rules: readonly EditionRule[], adopted: NecEdition): EditionNote {
  const main = rules[0];
  const sections = [...new Set(rules.map((r) => r.section))];
  return {
    requiredSince: main.sinceEdition,
    requiredByAdoptedEdition: main.sinceEdition <= adopted,
    reference: [...sections, topic.replacementRule].join(', '),
    text: [
      `Information only (${topic.protection}).`,
      ...rules.map((r) => ruleSentence(r, adopted)),
      SALE_CAVEAT,
      `Replacing the device brings in the current replacement rules (${topic.replacementRule}), so a replacement is made with the protection the adopted edition asks for.`,
    ].join(' '),
  };
}
