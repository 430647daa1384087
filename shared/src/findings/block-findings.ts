import { clauseRanges } from './clause-splitter';
import { matchCodes } from './code-matcher';
import { readLocation } from './location-reader';
import type { FindingCode } from './finding-code';
import type { MappedText } from './mapped-text';
import { negatedSpans } from './negation-detector';
import { readQuantity } from './quantity-reader';
import { scanAll } from './regex-scan';
import { findRooms, type RoomMention } from './room-lexicon';
import type { Room } from './room';
import { lastPlaceMention, placeMatches } from './room-resolver';
import type { Section } from './block-splitter';
import { splitSentences } from './sentence-splitter';

/** A finding of one block before offsets are attached: which sentence it came from and what it says. */
export interface BlockFinding {
  readonly code: FindingCode;
  readonly room: Room;
  readonly location: string;
  readonly quantity: number | null;
  readonly sentence: MappedText;
  readonly isRecommendation: boolean;
  readonly isFallbackOnly: boolean;
}

export interface BlockResult {
  readonly findings: BlockFinding[];
  /** Whether some defect phrase was found but denied ("no reversed polarity observed"). */
  readonly hasNegated: boolean;
}

/** A sentence that points back to a place named before it ("It is not GFCI protected"). */
const REFERS_BACK = /^(?:it|they|this|these|those|each|both|one|the same|also|and)\b/i;
/** A short line naming a place with no verb ("Basement bar area", "Primary bath:"). */
const MAX_LABEL_WORDS = 5;
/** Counting whitespace runs gives the word count of `split(/\s+/)` without its copy of the expression. */
const WHITESPACE_RUN = /\s+/g;
const VERB = /\b(?:is|are|was|were|has|have|had|be|been)\b/i;

/**
 * Reads the findings of one block (item, bullet or paragraph): per sentence, the defect phrases,
 * which of them are denied, their places and counts. Within the block a recommendation-only
 * finding is dropped when the block already has the same code for the same room, and a general
 * "have an electrician evaluate" finding is dropped when the block has any specific finding.
 */
export function readBlock(text: MappedText, section: Section): BlockResult {
  const found: BlockFinding[] = [];
  let hasNegated = false;
  // The last place named so far; its location is read only when a later sentence refers back to it.
  let previous: { text: string; mention: RoomMention; isLabel: boolean } | null = null;

  for (const sentence of splitSentences(text)) {
    const matches = matchCodes(sentence.text);
    // Clauses are cut once per sentence with phrases, for negation and for places alike.
    const clauses = matches.length > 0 ? clauseRanges(sentence.text) : [];
    const negated = negatedSpans(sentence.text, matches, clauses);
    const live = matches.filter((_, i) => !negated[i]);
    hasNegated ||= live.length < matches.length;
    const carried =
      previous && (previous.isLabel || REFERS_BACK.test(sentence.text))
        ? { room: previous.mention.room, location: readLocation(previous.text, previous.mention) }
        : null;
    const rooms = findRooms(sentence.text);
    const placements = placeMatches(sentence.text, live, { carried, sectionRoom: section.room, sectionTitle: section.title }, rooms, clauses);
    const inSentence: BlockFinding[] = [];
    live.forEach((match, i) => {
      for (const place of placements[i]) {
        const quantity =
          readQuantity(place.countText, place.articleLimit) ??
          (live.length === 1 && place.laterText ? readQuantity(place.laterText, 0) : null);
        const same = inSentence.find((f) => f.code === match.rule.code && f.room === place.room);
        if (same) continue;
        inSentence.push({
          code: match.rule.code,
          room: place.room,
          location: place.location,
          quantity,
          sentence,
          isRecommendation: match.isRecommendation,
          isFallbackOnly: match.rule.isFallbackOnly === true,
        });
      }
    });
    found.push(...inSentence);
    const mention = lastPlaceMention(rooms);
    const isLabel = matches.length === 0 && scanAll(WHITESPACE_RUN, sentence.text).length + 1 <= MAX_LABEL_WORDS && !VERB.test(sentence.text);
    if (mention) previous = { text: sentence.text, mention, isLabel };
  }
  return { findings: keepDistinct(found), hasNegated };
}

function keepDistinct(found: readonly BlockFinding[]): BlockFinding[] {
  const specific = found.filter((f) => !f.isFallbackOnly);
  const pool = specific.length > 0 ? specific : found.filter((f, i) => found.findIndex((g) => g.code === f.code) === i);
  return pool.filter(
    (f, i) =>
      !f.isRecommendation ||
      !pool.some((g, j) => j !== i && g.code === f.code && g.room === f.room && (!g.isRecommendation || j < i)),
  );
}
