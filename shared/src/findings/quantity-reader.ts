import { scanAll } from './regex-scan';
import { currentVocabulary, isDigit as isDigitCode, isSpace as isSpaceCode } from './word-tokens';

/**
 * Reads how many items a finding covers: digits and number words before a countable noun
 * ("three receptacles", "2 breakers"), "(3)", "2x"/"x2", "both"/"neither" (2), "a"/"an"/"one" + noun
 * (1), a bare count after a colon ("Open grounds: 2"). Vague words ("several", "multiple",
 * "various", "all" without a number) give null, as does text with no count.
 */
const NUMBER_WORDS: Readonly<Record<string, number>> = {
  a: 1, an: 1, one: 1, single: 1, two: 2, three: 3, four: 4, five: 5, six: 6, seven: 7, eight: 8,
  nine: 9, ten: 10, eleven: 11, twelve: 12, both: 2, neither: 2, pair: 2,
};
const VAGUE = new Set(['several', 'multiple', 'various', 'numerous', 'some', 'many', 'few', 'all', 'each', 'every', 'any']);
/** Nouns a count can apply to (devices, defects and places). */
const COUNTABLE = /^(?:rec[ei]pt?[aeiu]?c(?:le|al|el)s?|recepts?|recep|rcpts?|outlett?s?|devices?|duplex(?:es)?|gfc?is?|afcis?|breakers?|brkrs?|fuses?|circuits?|wires?|conductors?|cables?|cords?|lights?|fixtures?|lamps?|bulbs?|switch(?:es)?|dimmers?|box(?:es)?|j-?box(?:es)?|splices?|covers?|plates?|alarms?|detectors?|smokes?|fans?|knockouts?|fillers?|blanks?|openings?|slots?|screws?|taps?|grounds?|locations?|places?|spots?|areas?|rooms?|bathrooms?|baths?|bedrooms?|units?|terminals?|neutrals?)$/i;
/** Words that make the number a measure, not a count ("20 amp", "6 feet", "3-prong"). */
const UNIT = /^(?:a|amps?|amperes?|v|volts?|awg|gauge|ga|ft|feet|foot|inch(?:es)?|in|years?|yrs?|prong|slot|wire|pole|way|mm|%|percent|degrees?|minutes?|hours?|days?)$/i;
/** Words before a number that make it a name or an index ("bedroom 2", "slot 14", "#3"). */
const INDEX_BEFORE = /^(?:bed|bed\s?rooms?|bath(?:room)?s?|br|bdrms?|rooms?|rms?|circuits?|breakers?|no|nos|item|items|page|section|unit|level|floor|space|position|slot|photo|fig|figure|step|zone|#|spaces|about|approximately|approx)$/i;
const ALLOWED_BETWEEN = 3;
/** Service and branch voltages (NEC 220.5(A): 120, 120/240, 208Y/120, 240, 480Y/277 ...): never a count of devices. */
const VOLTAGES: ReadonlySet<string> = new Set(['110', '115', '120', '125', '208', '220', '230', '240', '250', '277']);
/** Places a vague word spreads a defect over ("on any level", "in every bedroom"): still no count of one. */
const SPREAD_NOUN = /^(?:levels?|floors?|stor(?:y|ies)|rooms?|bedrooms?|areas?|locations?)$/;
/** A plural countable noun: after an index word a number word counts it ("bedroom two receptacles"). */
const PLURAL_COUNTABLE = /^(?:receptacles|outlets|devices|breakers|fuses|lights|fixtures|switches|boxes|covers|plates|alarms|detectors|fans|cords|splices)$/i;
/** A singular device noun ("switch", "receptacle"): "the left switch of the two" is one. */
const SINGULAR_DEVICE = /^(?:receptacle|outlet|rcpt|recept|switch|dimmer|light|fixture|fan|breaker|fuse|box|cover|plate|alarm|detector|gfci|device)$/i;
/** "Of the five receptacles, three are ...": the whole first, then the part the defect is in. */
const PART_OF_WHOLE = /^\s*of\s+(?:the|these|those|its|their)\s+(\w+)\s+(?:[\w-]+\s+){0,3}?[\w-]+,\s*(\w+)\s+(?:are|were|have|had|show|showed|read|tested)\b/i;
/** What makes the digits after it a page, a price or the minutes of a time (see readCount). */
const NOT_A_COUNT_BEFORE = /(?:(?<![\w.])(?:p|pg|pp)\.\s?|\$\s?|\d:)$/i;
/** Vague words that quantify only a noun that follows ("all receptacles"), not a manner ("at all speeds"). */
const VAGUE_BEFORE_NOUN_ONLY = new Set(['all', 'every']);
/** A word, a bracketed count ("(3)", "(x2)") or a punctuation mark. */
export const TOKEN = /\(\s*x?\d{1,3}\s*\)|\d+\/\d+|[#]?[\w'%-]+|[:;,.]/g;

export interface Token {
  readonly word: string;
  readonly index: number;
}

/**
 * The matches of TOKEN in order, each word in lower case. Read character by character (as TOKEN
 * matches, its alternatives in order) and looked up in the shared vocabulary of lower-case words,
 * so a word seen before costs no expression call and no new string.
 */
export function tokenize(text: string): Token[] {
  const vocabulary = currentVocabulary();
  const tokens: Token[] = [];
  let i = 0;
  while (i < text.length) {
    const end = tokenEndAt(text, i);
    if (end < 0) {
      i++;
      continue;
    }
    tokens.push({ word: vocabulary.words[vocabulary.intern(text, i, end)], index: i });
    i = end;
  }
  return tokens;
}

/** The end of the TOKEN match at position i, or -1 when none begins there. */
function tokenEndAt(text: string, i: number): number {
  const c = text.charCodeAt(i);
  if (c === 40 /* ( */) {
    // \(\s*x?\d{1,3}\s*\)
    let k = i + 1;
    while (isSpaceCode(text.charCodeAt(k))) k++;
    if (text.charCodeAt(k) === 120 /* x */) k++;
    const digits = k;
    while (isDigitCode(text.charCodeAt(k))) k++;
    if (k === digits || k - digits > 3) return -1;
    while (isSpaceCode(text.charCodeAt(k))) k++;
    return text.charCodeAt(k) === 41 /* ) */ ? k + 1 : -1;
  }
  if (isDigitCode(c)) {
    // \d+\/\d+, else the word alternative
    let k = i + 1;
    while (isDigitCode(text.charCodeAt(k))) k++;
    if (text.charCodeAt(k) === 47 /* / */ && isDigitCode(text.charCodeAt(k + 1))) {
      k += 2;
      while (isDigitCode(text.charCodeAt(k))) k++;
      return k;
    }
  }
  // [#]?[\w'%-]+
  const from = c === 35 /* # */ ? i + 1 : i;
  if (isTokenWordCode(text.charCodeAt(from))) {
    let k = from + 1;
    while (isTokenWordCode(text.charCodeAt(k))) k++;
    return k;
  }
  // [:;,.]
  return c === 58 || c === 59 || c === 44 || c === 46 ? i + 1 : -1;
}

/** [\w'%-] */
function isTokenWordCode(c: number): boolean {
  return (c >= 97 && c <= 122) || (c >= 65 && c <= 90) || isDigitCode(c) || c === 95 || c === 39 || c === 37 || c === 45;
}

/**
 * Every key a word can reach in NUMBER_WORDS, its own and those it inherits from Object: a Set
 * lookup first is much cheaper than an object lookup with an arbitrary word, and gives the same.
 */
const NUMBER_WORD_KEYS = new Set([...Object.keys(NUMBER_WORDS), ...Object.getOwnPropertyNames(Object.prototype)]);

/** Whether the word is one to three ASCII digits (/^\d{1,3}$/ without a regular expression call). */
function isShortNumber(word: string): boolean {
  if (word.length === 0 || word.length > 3) return false;
  for (let i = 0; i < word.length; i++) {
    const code = word.charCodeAt(i);
    if (code < 48 || code > 57) return false;
  }
  return true;
}

function countOf(word: string): number | null {
  if (isShortNumber(word)) return Number(word);
  return NUMBER_WORD_KEYS.has(word) ? (NUMBER_WORDS[word] ?? null) : null;
}

/**
 * The count given in `text`, or null when there is none or it is vague. "a"/"an" count as one only
 * before `articleLimit` (the start of the defect phrase): "an open junction box" is one box, but
 * "mounted to a standard light box" says nothing about how many fans.
 */
export function readQuantity(text: string, articleLimit = Infinity): number | null {
  const count = readCount(text, articleLimit);
  return typeof count === 'number' ? count : null;
}

/** Like readQuantity, but tells a vague count ("several", "all") apart from none given. */
export function readCount(text: string, articleLimit = Infinity, countable: RegExp = COUNTABLE): number | 'vague' | null {
  // "an open ground on all four": a number after "all" that ends the clause counts the devices left unsaid.
  const allOf = ALL_N.exec(text);
  if (allOf) return NUMBER_WORDS[allOf[1].toLowerCase()] ?? Number(allOf[1]);
  // Twelfth round: "Of the five countertop receptacles, three are loose": the part, not the whole.
  const part = PART_OF_WHOLE.exec(text);
  if (part) {
    const [whole, some] = [countOf(part[1].toLowerCase()), countOf(part[2].toLowerCase())];
    if (whole !== null && some !== null && some > 0 && some < whole) return some;
  }
  const tokens = tokenize(text);
  for (let i = 0; i < tokens.length; i++) {
    const { word } = tokens[i];
    // "none of the three has a weather cover": all three are meant.
    if (word === 'none' && tokens[i + 1]?.word === 'of' && tokens[i + 2]?.word === 'the') {
      const all = countOf(tokens[i + 3]?.word ?? '');
      if (all !== null && all > 1) return all;
    }
    // (The two expressions are tried only on a word that can begin their match: "(", a digit, "x".)
    const first = word.charCodeAt(0);
    const parenthesised = first === 40 /* ( */ ? /^\(\s*x?(\d{1,3})\s*\)$/.exec(word) : null;
    if (parenthesised) return Number(parenthesised[1]);
    const times = (first >= 48 && first <= 57) || first === 120 /* x */ ? /^(?:(\d{1,2})x|x(\d{1,2}))$/.exec(word) : null;
    if (times) return Number(times[1] ?? times[2]);
    // "several receptacles" is vague; "wobbles at all speeds" says nothing about how many; a vague
    // word after the defect phrase speaks of something else ("... not GFCI protected, pushed test on every GFI").
    if (VAGUE.has(word) && tokens[i].index >= articleLimit && !SPREAD_NOUN.test(spreadWord(tokens, i))) continue;
    if (VAGUE.has(word) && !isNumberAhead(tokens, i) && (isNounAhead(tokens, i, countable) || !VAGUE_BEFORE_NOUN_ONLY.has(word))) return 'vague';
    const count = countOf(word);
    if (count === null || count === 0) continue;
    // "the left switch of the two at the door": one device picked out of a number of them.
    if (count > 1 && tokens[i - 1]?.word === 'the' && tokens[i - 2]?.word === 'of' && SINGULAR_DEVICE.test(tokens[i - 3]?.word ?? '')) return 1;
    if ((word === 'a' || word === 'an') && tokens[i].index >= articleLimit) continue;
    // "bedroom 2" is an index, but "bedroom two receptacles" is a count.
    if (i > 0 && INDEX_BEFORE.test(tokens[i - 1].word) && !(/^[a-z]/.test(word) && count > 1 && PLURAL_COUNTABLE.test(tokens[i + 1]?.word ?? ''))) continue;
    // "circuits 3 and 5 have 20 amp fuses": a number listed after an index is an index too.
    if (isListedIndex(tokens, i)) continue;
    // "the 240 receptacle", "a 120 circuit": a voltage said without its unit is no count.
    if (VOLTAGES.has(word)) continue;
    const next = tokens[i + 1]?.word;
    if (next !== undefined && UNIT.test(next) && word !== 'a' && word !== 'an') continue;
    // "throughout both units", "across all three floors": the places a defect spreads over, not a count.
    if (i > 0 && /^(?:throughout|across)$/.test(tokens[i - 1].word)) continue;
    // "ELEC 4.5 - Master bath", "item 7.6": the digits after a dot are part of a section number.
    if (first >= 48 && first <= 57 && /\d\.$/.test(text.slice(Math.max(0, tokens[i].index - 2), tokens[i].index))) continue;
    // Twelfth round: a page ("p.32", "pg. 14"), a price ("$135.00", "$ 85") and a time of day
    // ("9:21 AM") are no counts.
    if (first >= 48 && first <= 57 && NOT_A_COUNT_BEFORE.test(text.slice(Math.max(0, tokens[i].index - 5), tokens[i].index))) continue;
    if (first >= 48 && first <= 57 && /^:\d\d\b/.test(text.slice(tokens[i].index + word.length, tokens[i].index + word.length + 4))) continue;
    // "100 ELEC KITCHEN NO GFCI", "7 Unit A sunroom - ceiling fan": a number that opens a row before a
    // capitalised label is the row's item number unless the counted thing follows it at once
    // ("2 GFCI receptacles", "3 open grounds", "Two of the receptacles" are counts).
    if (first >= 48 && first <= 57 && opensRow(text, tokens[i].index) && /^\p{Lu}/u.test(text.charAt(tokens[i + 1]?.index ?? -1)) && !isNounAhead(tokens, i, countable, 1)) continue;
    // 'a 4" square box', "a 6' cord": inch and foot marks make a measure.
    if (first >= 48 && first <= 57 && /^["'″′]/.test(text.slice(tokens[i].index + word.length))) continue;
    if (/^\d/.test(word) && tokens[i - 1]?.word === ':') return count;
    // "open grnd, N & E walls, 3 total": a number given as the total.
    if (/^\d/.test(word) && next === 'total') return count;
    if (word === 'pair' && next !== 'of') continue;
    // "(4 of them)", "1 of 3 inop": the number before "of" is the count.
    // "two of the breakers", "three of those": any number word before "of" counts ("neither of them" is two).
    if ((/^\d/.test(word) || word === 'one') && next === 'of' && /^(?:them|\d+|the)$/.test(tokens[i + 2]?.word ?? '')) return count;
    if (word !== 'a' && word !== 'an' && word !== 'pair' && next === 'of' && (tokens[i + 2]?.word === 'them' || (/^(?:the|these|those|its|their)$/.test(tokens[i + 2]?.word ?? '') && isNounAhead(tokens, i + 2, countable)))) return count;
    // "neither one is protected": both are meant.
    if (word === 'neither' && next === 'one') return count;

    if (isNounAhead(tokens, i, countable)) return count;
  }
  return null;
}

/** Whether the number at `i` ends a list of numbers that follows an index word ("slots 4, 6 and 9"). */
function isListedIndex(tokens: Token[], i: number): boolean {
  let j = i;
  while (j >= 2 && /^(?:and|or|&|,)$/.test(tokens[j - 1].word) && isShortNumber(tokens[j - 2].word.replace(/^#/, ''))) {
    j -= 2;
    if (j > 0 && INDEX_BEFORE.test(tokens[j - 1].word)) return true;
  }
  return false;
}

const ALL_N = /\b(?:on|at|in|of)\s+all\s+(\d{1,2}|two|three|four|five|six|seven|eight|nine|ten|twelve)\s*(?:[.;,:)]|$)/i;

/** The word a vague word spreads over: the next one, or the noun after "of the" ("any of the bedrooms"). */
function spreadWord(tokens: Token[], i: number): string {
  return tokens[i + 1]?.word === 'of' && tokens[i + 2]?.word === 'the' ? (tokens[i + 3]?.word ?? '') : (tokens[i + 1]?.word ?? '');
}

/** Whether only spaces or a list mark stand between the line's start and `index`. */
function opensRow(text: string, index: number): boolean {
  const lineStart = text.lastIndexOf('\n', index - 1) + 1;
  return /^[\s>*\u2022-]*$/.test(text.slice(lineStart, index));
}

function isNounAhead(tokens: Token[], i: number, countable: RegExp = COUNTABLE, between: number = ALLOWED_BETWEEN): boolean {
  for (let j = i + 1; j <= i + 1 + between && j < tokens.length; j++) {
    const word = tokens[j].word;
    const isMeasure = /^\d/.test(word) && UNIT.test(tokens[j + 1]?.word ?? '');
    if (isMeasure) {
      j++;
      continue;
    }
    if (/^[:;.]$/.test(word) || UNIT.test(word) || countOf(word) !== null) return false;
    // "7 Unit A sunroom": a unit named by a letter or number is a name, not the thing counted.
    if (word === 'unit' && /^(?:[a-z]|\d{1,3})$/i.test(tokens[j + 1]?.word ?? '')) return false;
    if (countable.test(word)) return true;
  }
  return false;
}

/** "all three receptacles", "any of the three bedrooms": a vague word followed by a number gives way to it. */
function isNumberAhead(tokens: Token[], i: number): boolean {
  let j = i + 1;
  if (tokens[j]?.word === 'of') j++;
  if (j > i + 1 && /^(?:the|these|those|its|their)$/.test(tokens[j]?.word ?? '')) j++;
  const next = tokens[j]?.word;
  return next !== undefined && countOf(next) !== null && next !== 'a' && next !== 'an';
}

/**
 * Codes whose defect is a house-wide condition rather than a number of devices (a wiring method, a
 * missing protection, a general evaluation): they carry no count even when the text gives one.
 */
const UNCOUNTED = new Set(['knob-and-tube', 'afci-missing', 'aluminum-branch-wiring', 'evaluate-general']);
/**
 * Codes about one piece of equipment of the house (its service drop, mast, meter base or entrance
 * cable; its grounding electrode or a bond; a subpanel's neutral bar): each finding is one, as a
 * singular device is ("the meter base has pulled away", "GEC clamp at rod loose").
 */
const ONE_EQUIPMENT = new Set(['service-equipment', 'grounding-electrode', 'subpanel-bonding']);
/** Whether findings of the code carry a count at all. */
export function isCounted(code: string): boolean {
  return !UNCOUNTED.has(code);
}
/** Codes about one device each: with no noun in the finding's words, the report speaks of one. */
const ONE_DEVICE = new Set(['receptacle-damaged', 'gfci-inoperative', 'fan-support', 'switch-issue', 'reversed-polarity', 'false-ground', 'light-fixture', 'double-tap', 'overcurrent-mismatch', 'weather-cover-missing', 'cover-plate-missing', 'open-junction-box']);
/**
 * Device nouns, singular or plural: the finding's first one decides one (singular) or no count
 * (plural). Compounds come first so that "cover plates" is plural. Cable and wire are left out: an
 * inspector's "NM cable is exposed" speaks of wiring, not of one cable.
 */
const DEVICE_NOUN = /\b(?:((?:cover|face|wall|switch|outlet|receptacle|filler)[- ]?plate|(?:recessed |can )?light housing|light fixture|smoke (?:alarm|detector)|co (?:alarm|detector)|carbon monoxide (?:alarm|detector)|ceiling fan|junction box|j-box|gfci (?:receptacle|outlet|breaker|device)|rec[ei]pt?[aeiu]?c(?:le|al|el)|rcpt|outlet|device|duplex|gfci|breaker|fuse|fixture|light|luminaire|lamp|bulb|globe|fan|switch|dimmer|box|splice|cover|plate|alarm|detector|cord|knockout|screw|terminal|tap|pendant|sconce|chandelier|housing)(s|es)?)\b/gi;
/** Nouns that name the protection itself when the defect is its absence ("no GFCI protection"). */
const PROTECTION_NOUN = /^(?:gfci|afci)$/i;
const DEAD_AFTER_GFCI = /\b(?:rcpts?|receptacles?|outlets?)\b[^.;]{0,40}\b(?:dead|without power|no power|not powered)\b[^.;]*/gi;
const CONDUCTORS_UNDER_ONE = /\b(?:two|2|three|3|both|multiple)\s+(?:\d{1,2}\s+awg\s+)?(?:\w+\s+)?(?:wires?|conductors?|cond|neutrals|circuits|feeds)\b|\b[23]x\s+\d{1,2}\s+awg(?:\s+(?:copper|aluminum))?\s+(?=under\b)/gi;
/** The cables one splice joins: "two cables spliced", "3 wires were spliced together". */
const CABLES_SPLICED = /\b(?:two|2|three|3|four|4|both|several|multiple)\s+(?:[\w-]+\s+)?(?:cables|wires|conductors)\s+(?:were\s+|are\s+|have been\s+)?spliced\b/gi;
/** What exposed wiring is counted in: cords, cables, runs, places; not the lights a cord feeds. */
const WIRING_COUNTABLE = /^(?:cords?|cables?|wires?|wiring|conductors?|splices?|places?|locations?|spots?|areas?|circuits?)$/i;
/** Codes counted only when the text gives a number (exposed wiring). */
const EXPLICIT_ONLY = new Set(['exposed-wiring']);
/**
 * The small parts of a panel a defect can be counted in: its screws, knockouts, open spaces and
 * their fillers. A panel defect that names none of them is about the panel itself (its directory,
 * dead front, enclosure, working space) and is one; one that names them in the plural without a
 * number ("pointed screws", "open knockouts") has no count.
 */
const PANEL_PART = /\b(?:screws?|knockouts?|kos|ko|fillers?|blanks?|(?:breaker |open )?(?:spaces|slots|openings|positions))\b/i;
const PANEL_PART_COUNTABLE = /^(?:screws?|knockouts?|kos?|fillers?|blanks?|plates?|covers?|spaces?|slots?|openings?|positions?|plugs?)$/i;

/**
 * The count of a finding: the number the text gives; null for a vague or plural count without a
 * number ("several", "the receptacles"); 1 for a singular device ("a loose receptacle", "the cover
 * plate by the back door"); null for codes that are conditions, not devices.
 */
export function findingQuantity(code: string, countText: string, articleLimit: number, laterText: string | null, subjectText = ''): number | null {
  if (UNCOUNTED.has(code)) return null;
  if (ONE_EQUIPMENT.has(code)) return 1;
  // A double tap is counted in breakers (terminals), not in the conductors under one terminal.
  if (code === 'double-tap') countText = countText.replace(CONDUCTORS_UNDER_ONE, (m) => ' '.repeat(m.length));
  // A failed GFCI is counted in GFCIs, not in the receptacles left dead after it ("rcpts on that ckt dead (x3)").
  if (code === 'gfci-inoperative') countText = countText.replace(DEAD_AFTER_GFCI, (m) => ' '.repeat(m.length));
  // An open splice is counted in splices, not in the cables it joins ("two cables spliced with tape").
  if (code === 'open-junction-box') countText = countText.replace(CABLES_SPLICED, (m) => ' '.repeat(m.length));
  // A table row's leading item number ("7 | Basement | Junction box ...") is an index, not a count.
  countText = countText.replace(ROW_NUMBER, (m) => ' '.repeat(m.length));
  subjectText = subjectText.replace(ROW_NUMBER, (m) => ' '.repeat(m.length));
  if (code === 'panel-deficiency') return panelCount(countText, articleLimit);
  const count = readCount(countText, articleLimit, code === 'exposed-wiring' ? WIRING_COUNTABLE : COUNTABLE);
  if (typeof count === 'number') return count;
  if (count === 'vague') return null;
  // "the front and rear receptacles", "front+rear": two sides named, two devices.
  if (SIDE_PAIR.test(countText)) return 2;
  // "Counter receptacles (four, plus one at the island)", "the exterior receptacles (front entry and patio)".
  const listedInBrackets = bracketedCount(countText);
  if (listedInBrackets !== null) return listedInBrackets;
  // "breakers at positions 4 and 9", "slots 12, 14 and 16": one device per number listed.
  const listed = INDEX_LIST.exec(countText);
  if (listed) return (listed[0].match(/\d{1,3}/g) ?? []).length;
  if (laterText !== null) {
    const later = readCount(laterText, 0);
    if (typeof later === 'number') return later;
  }
  // A label before the text ("Switches: the dimmer for the den light is hot") names the topic, not the device.
  const unlabelled = countText.replace(LEADING_LABEL, '');
  const nouns = deviceNouns(code, unlabelled).length > 0 ? deviceNouns(code, unlabelled) : deviceNouns(code, countText);
  if (nouns.length > 0) return singularCount(code, nouns[0]);
  // The part names no device: the clause's subject before it does ("The receptacle by the deck has
  // no cover and is not GFCI protected"), or "it" stands for one device.
  if (subjectText !== '' && !EXPLICIT_ONLY.has(code)) {
    const subject = readCount(subjectText, Infinity);
    if (typeof subject === 'number') return subject;
    const named = subject === null ? deviceNouns(code, subjectText) : [];
    if (named.length > 0) return singularCount(code, named[0]);
  }
  if (/^\s*it\b/i.test(countText) && code === 'gfci-missing') return 1;
  return ONE_DEVICE.has(code) ? 1 : null;
}

/** A panel defect's count: the number of parts given, none for parts in the plural, else the one panel. */
function panelCount(text: string, articleLimit: number): number | null {
  const count = readCount(text, articleLimit, PANEL_PART_COUNTABLE);
  if (typeof count === 'number') return count;
  const part = PANEL_PART.exec(text);
  if (part === null) return 1;
  return /(?:s|kos)$/i.test(part[0]) && !/^ko$/i.test(part[0]) ? null : 1;
}

/** A plural device noun followed by a bracketed list of its parts. */
const BRACKETED_LIST = /\b(?:receptacles|outlets|rcpts|covers|lights|fixtures|switches|plates|boxes|alarms|detectors|fans|devices)\s*\(([^()]{3,80})\)/i;
const LIST_NUMBER = /\b(\d{1,2}|one|two|three|four|five|six|seven|eight|nine|ten)\b(?!\s*(?:a|amps?|v|volts?|awg|ft|feet|in|inch(?:es)?|years?)\b|-)/gi;
/** The count a bracketed list gives: its numbers added up, or one per listed place when it has none. */
function bracketedCount(text: string): number | null {
  const m = BRACKETED_LIST.exec(text);
  if (!m) return null;
  const inside = m[1];
  if (!/,|\band\b|&|\+|\bplus\b/i.test(inside)) return null;
  const numbers = scanAll(LIST_NUMBER, inside).map((n) => (/^\d/.test(n[1]) ? Number(n[1]) : NUMBER_WORDS[n[1].toLowerCase()]));
  if (numbers.length > 0) return numbers.length > 1 ? numbers.reduce((a, b) => a + b, 0) : null;
  const items = inside.split(/,|\band\b|&|\+/i).map((x) => x.trim()).filter((x) => x.length > 0);
  return items.length >= 2 && items.length <= 6 && items.every((x) => x.split(/\s+/).length <= 4) ? items.length : null;
}

const SIDE = String.raw`(?:front|rear|back|side|left|right|north|south|east|west|upper|lower)`;
/** Two sides named together before a plural device noun. */
const SIDE_PAIR = new RegExp(String.raw`\b${SIDE}\s*(?:and|&|\+|\/)\s*${SIDE}\b(?:\s+[\w-]+){0,2}?\s+(?:receptacles|outlets|rcpts|covers|lights|fixtures|switches|plates|boxes|alarms|fans)\b`, 'i');
/** Numbered positions listed after an index word. */
const INDEX_WORD = String.raw`(?:positions?|slots?|spaces?|circuits?|breakers?|fuses?)`;
const INDEX_LIST = new RegExp(String.raw`\b${INDEX_WORD}\s+#?\d{1,3}(?:\s*,\s*(?:${INDEX_WORD}\s+)?#?\d{1,3})*\s*,?\s*(?:and|&)\s*(?:${INDEX_WORD}\s+)?#?\d{1,3}\b(?!\s*(?:a|amps?|amperes?|v|volts?|awg|ga)\b|-)`, 'i');
/** A table row's leading item number: "7 | ...", "12\t...". */
const ROW_NUMBER = /(?:^|\n)\s*\d{1,3}[.)]?\s*(?=\||\t)/g;
const LEADING_LABEL = /^\s*[A-Za-z][\w /&-]{0,30}:\s+(?=\S)/;

function deviceNouns(code: string, text: string): RegExpExecArray[] {
  return scanAll(DEVICE_NOUN, text).filter((m) => !(code === 'gfci-missing' && PROTECTION_NOUN.test(m[1])));
}

/** One for a singular device noun, null for a plural (or for wiring, which is counted only by a number). */
function singularCount(code: string, noun: RegExpExecArray): number | null {
  if (noun[2]) return null;
  return EXPLICIT_ONLY.has(code) && !/^cord$/i.test(noun[1]) ? null : 1;
}
