import type { SectionKind } from './finding.schema';
import { findRooms } from './room-lexicon';
import { correctSpelling } from './text-normaliser';
import type { Room } from './room';

/**
 * Recognises section headings ("5.0 ELECTRICAL", "Section 7 - Electrical", "PLUMBING SYSTEM",
 * "Sub-Panel (Garage)", "HALL BATHROOM") and classifies them. A heading is a short line made only
 * of heading words, numbering and filler, with at least one heading word. Electrical words win
 * over room words, room words over non-electrical words ("Attic and Insulation" is parsed, since
 * attic findings are often electrical), and a line of filler alone ("Observations:") is a label
 * that leaves the current section unchanged.
 */
const ELECTRICAL = new Set([
  'electrical', 'electric', 'elec', 'electricity', 'wiring', 'panel', 'panels', 'panelboard', 'subpanel',
  'sub-panel', 'subpanels', 'receptacles', 'receptacle', 'outlets', 'switches', 'lighting', 'lights',
  'gfci', 'gfcis', 'afci', 'afcis', 'grounding', 'bonding', 'smoke', 'alarms', 'alarm', 'detectors',
  'monoxide', 'carbon', 'co', 'detector', 'circuits', 'breakers', 'distribution', 'disconnect', 'fixtures', 'fuse', 'fuses', 'meter',
]);
const NON_ELECTRICAL = new Set([
  'roof', 'roofing', 'roofs', 'gutters', 'gutter', 'chimney', 'chimneys', 'flashing', 'plumbing',
  'water', 'heater', 'heaters', 'heating', 'hvac', 'cooling', 'air', 'conditioning', 'conditioner',
  'furnace', 'boiler', 'ductwork', 'ducts', 'ventilation', 'structure', 'structural', 'foundation',
  'foundations', 'framing', 'insulation', 'appliances', 'appliance', 'windows', 'doors', 'siding',
  'grading', 'drainage', 'grounds', 'landscaping', 'driveway', 'driveways', 'walkways', 'fireplace',
  'fireplaces', 'finishes', 'walls', 'ceilings', 'floors', 'flooring', 'cabinets', 'countertops',
  'septic', 'well', 'sewer', 'irrigation', 'sprinklers', 'pest', 'radon', 'mold', 'heat', 'pump',
  'supply', 'drains', 'waste', 'vents', 'fuel', 'gas', 'site', 'lot', 'fences', 'plumb',
]);
const ROOM_WORDS = new Set([
  'kitchen', 'kitchens', 'bathroom', 'bathrooms', 'bath', 'baths', 'garage', 'garages', 'carport',
  'exterior', 'basement', 'basements', 'crawl', 'crawlspace', 'laundry', 'bedroom', 'bedrooms',
  'living', 'hallway', 'hallways', 'hall', 'halls', 'attic', 'attics', 'dining', 'office', 'den',
  'family', 'powder', 'primary', 'master', 'guest', 'porch', 'deck', 'patio', 'stairs', 'entry',
  // A pool or spa section holds its pump, light, bonding and GFCI items: it is a place outside (common practice).
  'pool', 'spa',
]);
const GENERAL = new Set(['summary', 'general', 'detailed', 'detail', 'interior', 'interiors', 'introduction', 'overview', 'body', 'discussion', 'narrative']);

/**
 * A summary at the top of a report ("SUMMARY OF ELECTRICAL CONCERNS", "KEY ELECTRICAL ITEMS",
 * "Overview"): its items are repeated by the body, and merge with the body's findings.
 */
export const SUMMARY_HEADING = /summary|overview|at a glance|quick list|\b(?:items?|things)\s+(?:needing|requiring|that need)\s+attention\b|\b(?:key|significant|major|priority|principal|notable)\s+(?:[\w-]+\s+){0,3}?(?:findings|items|concerns|issues|defects|deficiencies)\b|highlights|action items/i;
/** A summary heading with words of its own after it ("SUMMARY (electrical items requiring attention)"). */
const SUMMARY_START = /^(?:summary|overview|quick list|key|significant|major|priority|(?:report|inspection|deficiency|deficiencies|defect|repair|findings|executive)\s+summary)\b/i;
/** A label that starts the report's body after its summary ("COMMENTS", "DETAILED FINDINGS", "Observations"). */
const BODY_PART = /^(?:(?:detailed|full|report)\s+)?(?:comments|findings|observations|details|discussion|body|narrative)$/i;
const FILLER = new Set([
  'system', 'systems', 'components', 'component', 'and', '&', 'the', 'of', 'section', 'area', 'areas',
  'room', 'rooms', 'main', 'secondary', 'observations', 'observation', 'findings', 'comments', 'notes',
  'recommendations', 'deficiencies', 'concerns', 'conditions', 'items', 'details', 'checklist',
  'testing', 'test', 'tests', 'review', 'evaluation', 'inspection', 'other', 'upper', 'lower', 'level',
  'first', 'second', 'floor', 'cont', 'continued', "cont'd", 'or', 'with', 'at', 'to', 'for', 'in',
  'on', 'safety', 'major', 'minor', 'entrance', 'equipment', 'service', 'space', 'report', 'and/or',
  'limitations', 'defects', 'repairs', 'issues', 'info', 'information', 'description', 'descriptions', 'full',
]);

export interface Heading {
  readonly kind: Exclude<SectionKind, 'none'>;
  /** The heading as written, without numbering and trailing colon. */
  readonly title: string;
  /** The room the heading names, if any ("HALL BATHROOM", "Sub-Panel (Garage)"). */
  readonly room: Room | null;
}

/** What a line is when it is not report content. */
export type HeadingLine =
  | { readonly type: 'heading'; readonly heading: Heading }
  /** `startsBody`: the label opens the report's body ("COMMENTS"), which ends a summary. */
  | { readonly type: 'label'; readonly startsBody?: boolean };

const NUMBERING = /^\s*(?:section\s+)?(?:\d{1,2}(?:\.\d{1,2})*\.?|[ivx]{1,4}\.|[a-z]\)|[A-Z]\.(?=\s))?\s*[-–—:.]?\s*/i;

function isHeadingWord(w: string): boolean {
  return ELECTRICAL.has(w) || NON_ELECTRICAL.has(w) || ROOM_WORDS.has(w) || GENERAL.has(w) || FILLER.has(w) || /^\d+$/.test(w);
}

const ENDS_IN_RULE_CHAR = /[-=*#~]$/;

export function classifyHeadingLine(line: string): HeadingLine | null {
  // "--- QUICK LIST ---", "=== ELECTRICAL ===": rules drawn around a heading are decoration.
  const opened = line.trim().replace(/^[-=*#~]{2,}\s*(?=\S)/, '');
  // (A closing rule ends the line with one of its characters: only then is the expression tried.)
  const trimmed = ENDS_IN_RULE_CHAR.test(opened) ? opened.replace(/(?<=\S)\s*[-=*#~]{2,}$/, '') : opened;
  if (trimmed.length > 70) {
    // "SUMMARY OF ELECTRICAL CONCERNS (details follow in the body of the report)": a long note in brackets.
    // (trimmed has no trailing space, so only a text ending in ')' can lose a bracketed note.)
    const bare = trimmed.endsWith(')') ? trimmed.replace(/\s*\([^()]*\)\s*$/, '') : trimmed;
    return bare !== trimmed && bare.length <= 70 && SUMMARY_HEADING.test(bare) ? classifyHeadingLine(bare) : null;
  }
  const title = trimmed.replace(NUMBERING, '').replace(/\s*[:\-–—]+\s*$/, '').trim();
  if (title.length === 0) return null;
  // "DET. GARAGE / SHOP": the full stop of a short abbreviation inside a heading is no sentence end.
  if (/^[A-Z][A-Z]{1,4}\.\s+[A-Z]/.test(title) && !/[!?;]|\.\s*$/.test(title) && (title.match(/\./g) ?? []).length === 1) {
    return classifyHeadingLine(title.replace(/^([A-Z]{2,5})\.\s+/, '$1 '));
  }
  // "ELECTRICAL SUMMARY (see 7.1 - 7.6 for detail)": a summary heading with a note in brackets.
  if (/[.!?;]/.test(title)) {
    const bare = title.replace(/\s*\([^()]*\)\s*$/, '');
    return bare !== title && SUMMARY_HEADING.test(bare) && !/[.!?;]/.test(bare) ? classifyHeadingLine(bare) : null;
  }
  // Separators ("SMOKE / CO", "PANEL - MAIN") are not words; a misspelt heading word is read as
  // the trade word it stands for ("SMOKE DETECTERS").
  const written = (title.toLowerCase().match(/[a-z&'/-]+|\d+/g) ?? []).filter((w) => /[a-z&\d]/.test(w));
  // A line of more than eight words is no heading (unless it ends in a bracketed note): counted
  // before any word is looked up for its spelling.
  if (written.length > 8 && !/\)\s*$/.test(title)) return null;
  const words = written.map((w) => (isHeadingWord(w) ? w : (correctSpelling(w)?.toLowerCase() ?? w)));
  if (words.length > 8 && /\)\s*$/.test(title)) {
    // "SUMMARY - ELECTRICAL ITEMS (details follow in body of report)": a summary heading and its note.
    const bare = title.replace(/\s*\([^()]*\)\s*$/, '');
    return bare !== title && SUMMARY_HEADING.test(bare) ? classifyHeadingLine(bare) : null;
  }
  if (words.length === 0 || words.length > 8) return null;
  if (!words.every(isHeadingWord)) {
    return summaryHeading(title, words) ?? roomLabel(trimmed, title, words) ?? ruledHeading(line, opened, trimmed, title, words);
  }
  const kind = headingKind(words);
  if (kind === null) return BODY_PART.test(title) ? { type: 'label', startsBody: true } : { type: 'label' };
  const room = kind === 'non-electrical' || kind === 'general' ? null : (findRooms(title)[0]?.room ?? null);
  return { type: 'heading', heading: { kind, title, room } };
}

/**
 * A line with rules drawn on both sides ("-- ELECTRICAL: SERVICE / FEEDER ------") is a heading
 * whatever its other words: form and checklist exports set every section off that way. It takes the
 * kind of the heading words it has (electrical first); with none it is a label.
 */
function ruledHeading(line: string, opened: string, trimmed: string, title: string, words: readonly string[]): HeadingLine | null {
  if (opened === line.trim() || trimmed === opened) return null;
  const kind = headingKind(words.filter(isHeadingWord));
  if (kind === null) return { type: 'label' };
  const room = kind === 'non-electrical' || kind === 'general' ? null : (findRooms(title)[0]?.room ?? null);
  return { type: 'heading', heading: { kind, title, room } };
}

/** A summary heading followed by words the heading lists do not know, with no verb or defect. */
function summaryHeading(title: string, words: readonly string[]): HeadingLine | null {
  // A colon inside an upper-case heading joins two names of it ("QUICK LIST: ITEMS NEEDING ATTENTION").
  if (!SUMMARY_START.test(title) || !SUMMARY_HEADING.test(title) || LABEL_VERB.test(title) || (/:\s*\S/.test(title) && /\p{Ll}/u.test(title))) return null;
  return { type: 'heading', heading: { kind: words.some((w) => ELECTRICAL.has(w)) ? 'electrical' : 'general', title, room: null } };
}

/**
 * A short label that names a place, with words the heading lists do not know ("Prim BR:",
 * "Knee-Wall Storage (Attic)", "Laundry closet:", "Bedroom 2"): a room heading when it ends in a
 * colon or every word is capitalised, and it reads as a label (no verb, no defect).
 */
const LABEL_VERB = /\b(?:is|are|was|were|has|have|had|not|no|missing|loose|damaged|broken|open|inoperative|ok|tested|needs?)\b/i;
/** A device or defect named in a label: then it is an item, not a place heading. */
const DEVICE_WORD = /\b(?:receptacles?|outlets?|breakers?|switch(?:es)?|lights?|fans?|covers?|plates?|wiring|gfcis?|afcis?|alarms?|smoke|panels?|box(?:es)?|cords?|cables?|scorched|cracked|double|tapped|aluminum)\b/i;
/**
 * Twelfth round: an item line that names only a place and its priority ("E-6  Finished basement (rec
 * room) - SAFETY", "4. Laundry - REPAIR") heads the lettered items under it, capitals or not.
 */
const ITEM_CODE = /^\s*(?:[A-Z]{1,3}-?\d{1,3}|\d{1,2}(?:\.\d{1,2})*)[.):]?\s+/;
const PRIORITY_TAIL = /\s+[-–—]\s+(?:safety|repair|maintenance|monitor|defect|deficien\w*|recommend(?:ed)?(?:\s+evaluation)?|evaluate|upgrade|information|info|minor|major|urgent)(?:\s*\([^()]*\))?\s*$/i;
function placeItemLabel(line: string): HeadingLine | null {
  const code = ITEM_CODE.exec(line);
  const tail = code ? PRIORITY_TAIL.exec(line) : null;
  if (!code || !tail) return null;
  const core = line.slice(code[0].length, tail.index).trim();
  const bare = core.replace(/\s*\([^()]*\)$/, '');
  const wordCount = (bare.match(/[A-Za-z&'/-]+/g) ?? []).length;
  if (wordCount === 0 || wordCount > 3 || LABEL_VERB.test(bare) || DEVICE_WORD.test(bare)) return null;
  const room = findRooms(bare).find((r) => r.room !== 'panel')?.room ?? null;
  return room === null ? null : { type: 'heading', heading: { kind: 'room', title: core, room } };
}

function roomLabel(line: string, title: string, words: readonly string[]): HeadingLine | null {
  const item = placeItemLabel(line);
  if (item) return item;
  // A bracketed note ("In attic (looked from hatch + walked planks):") is no part of the label.
  const bare = title.replace(/\s*\([^()]*\)$/, '');
  const labelWords = bare === title ? words.length : (bare.match(/[A-Za-z&'/-]+|\d+/g) ?? []).length;
  if (labelWords === 0 || labelWords > 5 || LABEL_VERB.test(bare) || (bare !== title && (labelWords > 3 || DEVICE_WORD.test(bare)))) return null;
  // A bracketed note ("Office (converted sun porch)") is no part of the label's capitals.
  const isCapitalised = title.replace(/\s*\([^()]*\)/g, '').split(/\s+/).every((w) => /^[\p{Lu}\d(]/u.test(w) || w.length <= 2);
  // A numbered item that only names a place ("3. Office", "4. Hall bath") heads the lettered items under it.
  const isNumberedPlace = /^\s*(?:\d{1,2}|[A-Za-z])[.)]\s+\S/.test(line) && words.length <= 4 && !DEVICE_WORD.test(title);
  if (!/:\s*$/.test(line) && !isCapitalised && !isNumberedPlace) return null;
  const room = findRooms(title).find((r) => r.room !== 'panel')?.room ?? null;
  if (room === null) return null;
  return { type: 'heading', heading: { kind: 'room', title, room } };
}

function headingKind(words: readonly string[]): Heading['kind'] | null {
  // "SERVICE ENTRANCE", "SERVICE EQUIPMENT": the electrical service.
  if (words.some((w) => ELECTRICAL.has(w)) || (words.includes('service') && words.some((w) => w === 'entrance' || w === 'equipment'))) return 'electrical';
  if (words.some((w) => ROOM_WORDS.has(w))) return 'room';
  if (words.some((w) => NON_ELECTRICAL.has(w))) return 'non-electrical';
  if (words.some((w) => GENERAL.has(w))) return 'general';
  return null;
}

/**
 * A line that starts with a non-electrical label ("Siding: vinyl, serviceable", "Plumbing: leak at
 * trap"): its text belongs to that non-electrical topic, whatever section it sits in.
 */
export function inlineNonElectricalLabel(line: string): string | null {
  const m = /^\s*([A-Za-z][A-Za-z &/,'-]{1,40}?)\s*:\s+\S/.exec(line);
  if (!m) return null;
  const heading = classifyHeadingLine(m[1]);
  return heading?.type === 'heading' && heading.heading.kind === 'non-electrical' ? heading.heading.title : null;
}
