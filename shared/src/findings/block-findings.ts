import { clauseRanges } from './clause-splitter';
import { matchCodes, type CodeMatch } from './code-matcher';
import { isComposed, markComposedFinding, withComposed } from './device-condition';
import { CODE_RULES, WHOLE_SYSTEM, type CodeRule } from './code-patterns';
import { readLocation } from './location-reader';
import type { FindingCode } from './finding-code';
import { sourceRange, type MappedText } from './mapped-text';
import { negatedSpans } from './negation-detector';
import { deviceRating, nameplateMaximum, type CarriedRatings } from './overcurrent-check';
import { evaluationTarget } from './evaluation-target';
import { findingQuantity, isCounted, readCount } from './quantity-reader';
import { findRooms, type RoomMention } from './room-lexicon';
import type { Room } from './room';
import { applyRoomConventions, houseWideAlarmCount } from './room-conventions';
import { lastPlaceMention, placeMatches, POINTS_TO_PLACE } from './room-resolver';
import type { RowCount, Section } from './block-splitter';
import { splitSentences } from './sentence-splitter';
import { readSpokenPunctuation } from './spoken-punctuation';
import { normaliseText } from './text-normaliser';
import type { Confidence } from './finding.schema';

/** A finding of one block before offsets are attached: which sentence it came from and what it says. */
export interface BlockFinding {
  readonly code: FindingCode;
  readonly room: Room;
  readonly location: string;
  readonly quantity: number | null;
  readonly sentence: MappedText;
  readonly isRecommendation: boolean;
  readonly isFallbackOnly: boolean;
  readonly confidence: Confidence;
  /** Follow-up sentences of the block that recommend the correction of this finding. */
  readonly recommendations: MappedText[];
  readonly computation: string | null;
}

export interface BlockResult {
  readonly findings: BlockFinding[];
  /** Whether some defect phrase was found but denied ("no reversed polarity observed"). */
  readonly hasNegated: boolean;
}

/** What the section and the document around a block say about place. */
export interface BlockContext {
  readonly section: Section;
}

/** A sentence that only recommends or asks for follow-up ("This should be corrected by a licensed electrician."). */
const FOLLOW_UP = /\b(?:recommend\w*|install (?:the|a|an|new|proper|listed)\b|suggest\w*|advise\w*|should be|should have|needs? to be|must be|have (?:it|this|these|them|the\s+\w+) (?:\w+ed|repaired|corrected|checked|evaluated)|correct(?:ion|ed)?|repair(?:ed|s)?|replace(?:d|ment)?|evaluat\w*|further (?:evaluation|review)|by a (?:licensed|qualified)|licensed electrician|qualified electrician|electrical contractor|requir(?:e|es|ed)\b|for safety|safety (?:hazard|concern|issue)|fire (?:hazard|risk)|shock (?:hazard|risk)|hazard)|^\s*(?:add|provide|install)\b|\brestore\b|\bfix\b|no equipment ground|\b(?:is|are)\s+not\s+(?:(?:permitted|allowed|approved|intended|meant)\s+(?:as|to be used as|for use as)\s+)?(?:an?\s+)?(?:substitute|replacement)s?\s+for\b/i;

/** A sentence about the device just named ("The fan ...", "It ..."). */
/**
 * An alarm named only as the topic of a label ("Smoke alarms: missing in hallway", "Hall smoke -
 * none", "hall: smoke missing"): like a device implied by its section, one at one named place.
 */
/** Places in the plural as inspectors abbreviate them ("BR's", "bdrms"). */
const PLURAL_PLACE_WORD = /\b(?:bed ?rooms|bdrms|brs|br's|rooms|levels|floors|baths|bathrooms|halls|hallways)\b/i;
const ALARM_TOPIC_LABEL = /^\W*(?:[\w.]+\s+){0,3}?(?:smoke|co)\b(?:\s*(?:\/|&)\s*co)?(?:\s+(?:alarms?|detectors?))?\s*(?::|\||\s-\s|\s\.{3,})|^\W*[\w ]{1,20}:\s*(?:smoke|co)\s+(?:missing|none|removed)\b/i;

/**
 * A sentence about the device before it: "The/This/That/It ...", or a terse one with no subject at
 * all that starts with its verb ("Trips but wont reset.").
 */
const SAME_SUBJECT = /^(?:the|this|that|it)\b(?!\s+(?:other|second|third|next|remaining)\b)|^(?:my\s+|our\s+)?(?:plug-in\s+)?tester\s+(?:shows|showed|reads|read|indicates|indicated|says|said|registers|registered)\b|^(?:trips|tripped|tests|tested|will|wont|won't|does|doesn't|did|didn't|is|was|has|had|shows|showed|moves|wobbles)\b/i;
/** "That breaker is oversized ...": a demonstrative points back to the device just named, even at a fixed place. */
const POINTS_BACK = /^(?:this|that|these|those|it)\b/i;
/** Words that make it another device ("also", "another", "too"). */
const ANOTHER = /\b(?:also|another|too|as well|second|other|additional|each|(?<!\bat\s)all|both)\b/i;

/** A sentence that points back to a place named before it ("It is not GFCI protected"). */
const REFERS_BACK = /^(?:it|they|this|these|those|each|both|one|the same|also|and|there (?:is|are|was|were) also)\b/i;
/** A short line naming a place with no verb ("Basement bar area", "Primary bath:"). */
const MAX_LABEL_WORDS = 5;
/**
 * A form's field that gives the place of the item ("Location: Hall bath, left of the sink",
 * "Area - crawl space"): the observation under it is there, however long the field is (common
 * practice in reports built from Location/Observation/Recommendation fields).
 */
const LOCATION_FIELD = /^\W*(?:location|area|room|where|place)\s*(?::|\s-\s)/i;
/** Counting whitespace runs gives the word count of `split(/\s+/)` without its copy of the expression. */
const WHITESPACE_RUN = /\s+/g;
const VERB = /\b(?:is|are|was|were|has|have|had|be|been)\b/i;

/** Whether the text has at most `max` words (whitespace runs + 1), counting no further than needed. */
function hasAtMostWords(text: string, max: number): boolean {
  WHITESPACE_RUN.lastIndex = 0;
  let runs = 0;
  while (WHITESPACE_RUN.exec(text) !== null) {
    if (++runs + 1 > max) {
      WHITESPACE_RUN.lastIndex = 0;
      return false;
    }
  }
  return true; // a failed exec leaves lastIndex at 0
}

/**
 * Reads the findings of one block (item, bullet or paragraph): per sentence, the defect phrases,
 * which of them are denied, their places and counts. Within the block a recommendation-only
 * finding is dropped when the block already has the same code for the same room, and a general
 * "have an electrician evaluate" finding is dropped when the block has any specific finding.
 */
export function readBlock(text: MappedText, section: Section, rowCounts: readonly RowCount[] = []): BlockResult {
  const found: BlockFinding[] = [];
  let hasNegated = false;
  // The last place named so far; its location is read only when a later sentence refers back to it.
  let previous: { text: string; mention: RoomMention; isLabel: boolean } | null = null;
  // The place named by the block's opening sentence: it carries to the block's findings that name none.
  let opening: { room: Room; location: string; hadFindings: boolean } | null = null;
  // The findings of the last sentence that had any: a follow-up sentence belongs to them.
  let lastFound: BlockFinding[] = [];

  // A nameplate maximum stated without a rating beside it: the next sentence may give the rating.
  let ratings: CarriedRatings | null = null;
  // First the phrases of every sentence (each depends only on the sentences before it), so that
  // places are read only as far as a sentence with phrases can use them: the places a sentence
  // names serve its own phrases and those of later sentences (as the place referred back to or
  // the block's opening place), never earlier ones.
  const sources = splitSentences(readSpokenPunctuation(text));
  const sentences = sources.map((source) => {
    const written = rowCounts.length > 0 ? blankItemNumbers(source, rowCounts) : source;
    const sentence = normaliseText(written);
    // Phrases first, then a device and its condition where no phrase reads them (device-condition.ts).
    const matches = withComposed(sentence.text, matchCodes(sentence.text, { carried: ratings }));
    ratings = matches.some((m) => m.computation !== undefined) ? null : { nameplate: nameplateMaximum(sentence.text), rating: deviceRating(sentence.text) };
    const implied = matches.length === 0 ? subjectMatch(section, sentence.text) : null;
    if (implied) matches.push(implied);
    return { written, sentence, matches, implied };
  });
  let lastWithPhrases = -1;
  sentences.forEach(({ matches }, i) => {
    if (matches.length > 0) lastWithPhrases = i;
  });
  sentences.forEach(({ written, sentence, matches, implied }, sentenceIndex) => {
    // Clauses are cut once per sentence with phrases, for negation and for places alike.
    const clauses = matches.length > 0 ? clauseRanges(sentence.text) : [];
    const negated = matches.length > 0 ? negatedSpans(sentence.text, matches, clauses) : [];
    const live = matches.filter((_, i) => !negated[i]);
    hasNegated ||= live.length < matches.length;
    const carried =
      live.length > 0 && previous && (previous.isLabel || REFERS_BACK.test(sentence.text) || POINTS_TO_PLACE.test(sentence.text))
        ? { room: previous.mention.room, location: readLocation(previous.text, previous.mention) }
        : null;
    const rooms = sentenceIndex <= lastWithPhrases ? findRooms(sentence.text) : [];
    const placements = applyRoomConventions(
      sentence.text,
      live,
      placeMatches(sentence.text, live, { carried, opening, sectionRoom: section.room, sectionTitle: section.title }, rooms, clauses),
      clauses,
      { sectionRoom: section.room, previousText: sentenceIndex > 0 ? sources[sentenceIndex - 1].text : '' },
    );
    const inSentence: BlockFinding[] = [];
    // A table row's quantity column gives the count of the row's findings.
    const rowCount = live.length > 0 && rowCounts.length > 0 ? rowCountOf(written, rowCounts) : null;
    live.forEach((match, i) => {
      const isNormalised = sentence.changed.some((c) => c.start < match.end && match.start < c.end);
      for (const place of placements[i]) {
        const own = findingQuantity(match.rule.code, place.countText, place.articleLimit, live.length === 1 && place.laterText ? place.laterText : null, place.subjectText ?? '');
        // A bootleg ground is counted in receptacles: "two receptacles tested correct, but ... a jumper at each".
        const counted =
          match.rule.code === 'false-ground' && (own === null || own === 1)
            ? (receptacleCount(sentence.text) ?? own)
            : // "No carbon monoxide alarm anywhere in the home": an alarm missing house-wide names no number to install.
              match.rule.code === 'smoke-co-alarm' && place.room === 'whole-house' && (own === 1 || own === null)
              ? houseWideAlarmCount(`${sentence.text.slice(match.end)} ${sources[sentenceIndex + 1]?.text ?? ''}`)
              : // "The three-prong outlets ... show an open ground": the article is the defect's, the receptacles are plural and uncounted.
              match.rule.code === 'open-ground' && own === 1 && !/^\d+ devices$/.test(place.countText) && PLURAL_RCPT_ONLY.test(sentence.text) && readCount(sentence.text, 0, RECEPTACLE_NOUN) === null
              ? null
              : own;
        // A device implied by its section at one named place ("BR2: none") is one device.
        const implied1 = counted === null && (match === implied || (match.rule.code === 'smoke-co-alarm' && ALARM_TOPIC_LABEL.test(sentence.text) && !PLURAL_PLACE_WORD.test(sentence.text))) && place.room !== 'whole-house' && !isPluralPlace(sentence.text, rooms.find((r) => r.room === place.room)?.text ?? '') ? 1 : counted;
        // The lead's decision on evaluation counts: one named device evaluated is one.
        const quantity = match.rule.code === 'evaluate-general' ? (evaluationTarget(sentence.text, match.start)?.quantity ?? null) : rowCount !== null && isCounted(match.rule.code) ? rowCount : implied1;
        // The grounding of a service is one system: a sentence naming its parts in two places is one defect.
        const same = inSentence.find((f) => f.code === outdoorCode(match.rule.code, place.room, sentence.text) && (f.room === place.room || match.rule.panelIsPlace === true));
        if (same) continue;
        inSentence.push({
          code: outdoorCode(match.rule.code, place.room, sentence.text),
          room: place.room,
          location: place.location,
          quantity,
          sentence,
          isRecommendation: match.isRecommendation,
          isFallbackOnly: match.rule.isFallbackOnly === true,
          confidence: match === implied || match.computation !== undefined || place.isInferred ? 'inferred' : isComposed(match) ? 'composed' : isNormalised ? 'normalised' : 'exact',
          recommendations: [],
          computation: match.computation ?? null,
        });
        if (isComposed(match)) markComposedFinding(inSentence[inSentence.length - 1]);
      }
    });
    for (let k = inSentence.length - 1; k >= 0; k--) {
      const f = inSentence[k];
      const over = ruleOf(f.code)?.yieldsInSentenceTo;
      if (over && inSentence.some((g) => !g.isRecommendation && g.room === f.room && over.includes(g.code))) inSentence.splice(k, 1);
    }
    // "CO: none in the house; gas heater in the den - install a CO alarm": the remedy in the sentence
    // that states the defect is that defect's, wherever the sentence mentions other places.
    for (let k = inSentence.length - 1; k >= 0; k--) {
      const f = inSentence[k];
      if (f.isRecommendation && inSentence.some((g) => !g.isRecommendation && g.code === f.code)) inSentence.splice(k, 1);
    }
    // A follow-up sentence only recommends, or speaks again of a defect the block already has
    // ("Three-prong receptacles should be grounded or GFCI protected.").
    // A recommendation of another kind of defect ("have the kitchen counter receptacles upgraded to
    // GFCI protection" after a double tap) is a finding of its own, unless it is the usual remedy
    // of the defect before it (GFCI protection for an ungrounded receptacle).
    const onlyFollowUp = inSentence.every(
      (f) =>
        (f.isFallbackOnly && !WHOLE_SYSTEM.test(f.sentence.text)) ||
        (f.isRecommendation && (f.confidence === 'inferred' || lastFound.some((g) => g.code === f.code || ruleOf(f.code)?.yieldsTo?.includes(g.code)))) ||
        // A defect at a fixed place (the panel, the service) named again in the block is the same defect.
        ((f.confidence === 'inferred' || ruleOf(f.code)?.fixedRoom !== undefined) && found.some((g) => g.code === f.code)),
    );
    // "The fan rocks noticeably at speed." after "The ceiling fan in the den is hung from a pancake
    // box": the same device told again, with no place and nothing that makes it another one.
    const isRepeat =
      inSentence.length > 0 &&
      SAME_SUBJECT.test(sentence.text) &&
      !ANOTHER.test(sentence.text) &&
      inSentence.every(
        (f) =>
          (f.confidence === 'inferred' || (ruleOf(f.code)?.fixedRoom !== undefined && POINTS_BACK.test(sentence.text))) &&
          !f.isRecommendation &&
          f.computation === null &&
          // A sentence that names no place at all ("That is often called a bootleg ground") is about the device before it.
          [...lastFound, ...found].some((g) => g.code === f.code && (g.room === f.room || f.room === 'unknown')),
      );
    if (lastFound.length > 0 && ((onlyFollowUp && FOLLOW_UP.test(sentence.text)) || isRepeat)) {
      // "This should be corrected by a licensed electrician.": part of the finding(s) before it.
      for (const f of lastFound) f.recommendations.push(written);
    } else {
      found.push(...inSentence);
      if (inSentence.some((f) => !f.isRecommendation && !f.isFallbackOnly)) lastFound = inSentence;
    }
    // A location field names the item's place first and reference points after it ("Crawl space, below the hall").
    const fieldPlace = matches.length === 0 && LOCATION_FIELD.test(sentence.text) ? rooms.find((r) => !r.isReferencePoint && r.room !== 'panel') : undefined;
    const mention = fieldPlace ?? lastPlaceMention(rooms);
    if (mention) previous = { text: sentence.text, mention, isLabel: matches.length === 0 && ((hasAtMostWords(sentence.text, MAX_LABEL_WORDS) && !VERB.test(sentence.text)) || LOCATION_FIELD.test(sentence.text)) };
    if (sentenceIndex === 0 && mention) opening = { room: mention.room, location: readLocation(sentence.text, mention), hadFindings: live.length > 0 };
  });
  return { findings: keepDistinct(found), hasNegated };
}

/** The quantity column's count for the table row a sentence starts in, or null. */
/** A number of two or more receptacles the sentence gives ("Two receptacles ...", "both receptacles", "two of the receptacles"). */
function receptacleCount(text: string): number | null {
  const count = readCount(text, 0, RECEPTACLE_NOUN);
  return typeof count === 'number' && count >= 2 ? count : null;
}
/** A sentence that names receptacles only in the plural. */
const PLURAL_RCPT_ONLY = /^(?![\s\S]*\b(?:receptacle|outlet|rcpt|recept|device)\b)[\s\S]*\b(?:receptacles|outlets|rcpts|recepts)\b/i;
const RECEPTACLE_NOUN = /^(?:rec[ei]pt?[aeiu]?c(?:le|al|el)s?|recepts?|rcpts?|outlets?|devices?)$/i;

/** The sentence with a table row's leading item number blanked (same length and offsets): it is no count. */
function blankItemNumbers(sentence: MappedText, rowCounts: readonly RowCount[]): MappedText {
  const numbered = rowCounts.filter((r) => r.itemNumberEnd !== undefined);
  if (numbered.length === 0) return sentence;
  let text = '';
  for (let k = 0; k < sentence.text.length; k++) {
    const at = sentence.offsets[k];
    text += numbered.some((r) => r.start <= at && at < (r.itemNumberEnd ?? 0)) && /\d/.test(sentence.text[k]) ? ' ' : sentence.text[k];
  }
  return { text, offsets: sentence.offsets };
}

function rowCountOf(sentence: MappedText, rowCounts: readonly RowCount[]): number | null {
  const { start } = sourceRange(sentence);
  return rowCounts.find((r) => r.start <= start && start < r.end)?.count ?? null;
}

/**
 * A receptacle outdoors with no cover, or a broken one, lacks the weatherproof cover a wet location
 * needs (NFPA 70 (NEC) 2023, 406.9(B)(1)), not just a cover plate.
 */
function outdoorCode(code: FindingCode, room: Room, sentence = ''): FindingCode {
  // A switch plate outdoors is still a cover plate: weather covers are for receptacles (NFPA 70 (NEC) 2023, 406.9).
  return code === 'cover-plate-missing' && room === 'exterior' && !SWITCH_PLATE.test(sentence) ? 'weather-cover-missing' : code;
}
const SWITCH_PLATE = /\bswitch\s+(?:cover\s+)?plates?\b/i;

const RULE_BY_CODE = new Map(CODE_RULES.map((r) => [r.code, r]));
function ruleOf(code: FindingCode): CodeRule | undefined {
  return RULE_BY_CODE.get(code);
}

/**
 * Sections whose heading names one kind of device ("SMOKE / CO", "Smoke Detectors"): in shorthand
 * their lines leave the device unnamed ("BR2: none", "hall: mfr 2012 - expired").
 */
const SECTION_SUBJECTS: ReadonlyArray<{ readonly heading: RegExp; readonly code: FindingCode; readonly defect: RegExp; readonly denial: RegExp }> = [
  {
    heading: /smoke|carbon monoxide|\bco\b|detect/i,
    code: 'smoke-co-alarm',
    // Common practice: a missing, expired (ten years from manufacture) or silent alarm is the defect.
    defect: /^(?:[\w\s/&'-]{0,30}:\s*)?(?:none|missing|absent|no (?:alarms?|detectors?|units?)|not (?:present|installed|found|observed|provided)|expired|end[- ]of[- ]life|chirp\w*|inoperative|did not (?:sound|respond|activate)|failed)\b|\b(?:expired|end[- ]of[- ]life|chirp(?:s|ed|ing)|(?:past|beyond) (?:their|its|the)? ?(?:\d+|ten)[- ]?year|did not (?:sound|respond|activate))\b/i,
    denial: /\b(?:tested (?:ok|fine|good|properly|correctly)|ok\b|satisfactory|functional|operat(?:ed|ional) (?:properly|correctly|normally))/i,
  },
];
/** Several places or devices ("all", "BRs:", "in the bedrms"): no count of one. */
const ALL_WORDS = /\b(?:all|every|each|several|both)\b/i;
function isPluralPlace(sentence: string, placeWords: string): boolean {
  return ALL_WORDS.test(sentence) || /(?:rms|rooms|[^s]s)$/i.test(placeWords.trim());
}
const ADD_WORDS = /\b(?:need(?:s|ed)? to (?:add|install)|add|install|recommend\w*|should (?:be|have)|replace)\b/i;

/** A finding a sentence gives only through its section's subject, as a phrase spanning the sentence. */
function subjectMatch(section: Section, text: string): CodeMatch | null {
  if (section.title === null || section.kind === 'non-electrical') return null;
  for (const subject of SECTION_SUBJECTS) {
    if (!subject.heading.test(section.title) || !subject.defect.test(text) || subject.denial.test(text)) continue;
    const rule = CODE_RULES.find((r): r is CodeRule => r.code === subject.code);
    if (!rule) return null;
    const isRecommendation = ADD_WORDS.test(text) && !/^(?:[\w\s/&'-]{0,30}:\s*)?(?:none|missing|absent|no\b)/i.test(text);
    return { rule, start: 0, end: text.length, isRecommendation, computation: undefined };
  }
  return null;
}

const WIRING_METHODS: ReadonlySet<string> = new Set(['knob-and-tube', 'aluminum-branch-wiring']);


function keepDistinct(all: readonly BlockFinding[]): BlockFinding[] {
  // A wiring method named again in the block without a place of its own is the same wiring.
  const found = all.filter(
    (f, i) => !(WIRING_METHODS.has(f.code) && f.confidence === 'inferred' && all.some((g, j) => j < i && g.code === f.code)),
  );
  const specific = found.filter(
    (f) =>
      (!f.isFallbackOnly || WHOLE_SYSTEM.test(f.sentence.text)) &&
      !found.some((g) => g !== f && !g.isRecommendation && g.room === f.room && ruleOf(f.code)?.yieldsInBlockTo?.includes(g.code)),
  );
  const pool = specific.length > 0 ? specific : found.filter((f, i) => found.findIndex((g) => g.code === f.code) === i);
  return pool.filter((f, i) => {
    if (!f.isRecommendation) return true;
    const kept = pool.find((g, j) => j !== i && g.code === f.code && g.room === f.room && (!g.isRecommendation || j < i));
    // A recommendation that repeats a finding of the block is that finding's recommendation.
    if (kept && kept.sentence !== f.sentence) kept.recommendations.push(f.sentence);
    return kept === undefined;
  });
}
