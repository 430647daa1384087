import { clauseIndexAt, clauseRanges, type Range } from './clause-splitter';
import { scanAll } from './regex-scan';
import { findRooms } from './room-lexicon';

/**
 * Decides which defect phrases in a sentence are denied rather than reported: "no reversed
 * polarity observed", "Double taps: none", "no loose or damaged receptacles noted", "if a GFCI
 * fails to trip...". A cue before a phrase denies it and the phrases listed after it ("no
 * reversed polarity or open grounds"); a cue after a phrase denies it and the phrases listed
 * before it ("reversed polarity or open grounds: none found"). Cues never cross a clause, and a
 * cue inside a phrase ("no GFCI", "did not trip") is part of the defect, not a denial.
 */
const CUE_BEFORE = /\b(?:no|not|never|none of|free of|no evidence of|no signs? of|no indication of|did not (?:observe|find|note|see|detect)|didn't (?:observe|find|note|see)|absence of|if|unless|whether|in the event (?:of|that)|should (?:any|there be)|previously|formerly|former|abandoned|once had|no longer|had been (?:replaced|removed|corrected|repaired)|has been (?:replaced|removed|corrected|repaired)|was (?:replaced|removed|corrected|repaired)|(?:previous|prior|earlier|(?:19|20)\d\d) (?:home )?inspection(?: report)?|(?:previous|prior|former) owners?|replaced (?:the|all|its|their)|(?:^|[.;]\s*)(?:where|wherever|whenever|should)(?=\s))\b/gi;
/**
 * After the phrase: not found ("not observed", "none"), positive ("as required", "tested OK") or
 * historical ("has been removed", "was replaced in 2015").
 */
const CUE_AFTER = /(?:\b(?:was|were|is|are)\s+)?\bnot\s+(?:observed|found|noted|detected|seen|evident|identified|present)\b|\bnone\b(?!\s+of\b)(?:\s+(?:observed|found|noted|detected|seen|evident))?|\bn\/a\b|\bnot an issue\b|\b(?:was|is|were|are)\s+not\s+(?:considered|reported as|listed as|counted as)\s+(?:a\s+)?(?:defect|deficiency|concern|problem)\b|\btypical (?:for|of) (?:the|its|a home of this) (?:age|era|period|vintage)\b|\b(?:listed|noted|included|reported) (?:here )?for information(?:al purposes)?(?: only)?\b|\bnot as a defect\b|\bas (?:required|expected|intended)\b|\b(?:was|were) previously (?:present|installed|used|in use)\b|\b(?:tested|test|tests) (?:ok|okay|good|correctly|properly|fine)\b|\b(?:has|have|had) (?:since )?been (?:removed|replaced|abandoned|decommissioned|disconnected and removed|corrected|repaired)\b|\b(?:was|were) (?:removed|replaced|corrected|repaired|upgraded) (?:in|during|when|before|by|prior to|previously|already|earlier)\b|\b(?:which|that|as) (?:was|were|is) (?:allowed|permitted|acceptable) (?:when|at the time)\b|\bgrandfathered\b|\b(?:did|do|does)\s+not\s+(?:find|see|observe|note|detect)\s+(?:any|them|these|those|either|it)\b|\bnone of (?:these|them|which|those) (?:was|were|is|are) (?:found|observed|present|noted)\b/gi;
/** Text between two listed phrases: commas, "and", "or", "nor", "/", "&". */
const LIST_JOIN = /^[\s,]*(?:(?:and|or|nor|&|\/|and\/or)[\s,]*)?$/i;
/** A participle right after "not" that the phrase does not start with: the "not" is about it. */
const OWN_VERB = /^\s+(?:\w+ly\s+)?(?!(?:grounded|protected|bonded|secured|supported|covered|connected|working|functioning|operating|installed|present|tripping|resetting)\b)\w+(?:ed|en)\s+\S/i;
/**
 * "Because we could not see inside, we recommend that an electrician evaluate the panel": a comma
 * and a new subject between a cue and the phrase start another clause, which the cue does not reach.
 */
const NEW_SUBJECT_AFTER_COMMA = /,\s+(?:so\s+|and\s+|but\s+|therefore\s+)?(?:we|i|they|you|the (?:buyer|buyers|seller|sellers|inspector|client)|(?:a|an) (?:licensed |qualified )?electrician)\s+(?:would\s+|do\s+|strongly\s+)?(?:recommend|suggest|advise|ask|urge|request)\w*\b/i;
/** Longest run of ordinary words allowed between a cue and the phrase it denies. */
const MAX_CUE_DISTANCE = 60;

function cuesOutside(text: string, re: RegExp, spans: readonly Range[]): Range[] {
  return scanAll(re, text)
    .map((m) => ({ start: m.index, end: m.index + m[0].length }))
    .filter((cue) => !spans.some((s) => cue.start < s.end && s.start < cue.end) && !removesProtection(text, cue));
}

/**
 * "Has been removed" is history for a hazard (old wiring that has been removed) but the defect
 * itself for a part that protects (a bond, jumper, cover or ground that has been removed).
 */
const PROTECTIVE_PART_BEFORE = /\b(?:bond(?:ing)?|jumpers?|clamps?|covers?|plates?|globes?|lens(?:es)?|screws?|fillers?|ground(?:ing)?\s+(?:wires?|conductors?|rods?))\s+(?:[\w'-]+\s+){0,4}$/i;
function removesProtection(text: string, cue: Range): boolean {
  return /removed/i.test(text.slice(cue.start, cue.end)) && PROTECTIVE_PART_BEFORE.test(text.slice(Math.max(0, cue.start - 60), cue.start));
}

/**
 * A sentence that only says what a future change would need: "If the basement is finished later,
 * the new circuits will need AFCI protection." Its condition is the whole sentence's.
 */
const FUTURE_CONDITION = /^\s*(?:if|when|once|should)\s[^.;]{0,120}?\b(?:in the future|later|someday|ever (?:remodel|renovate|finish|add|convert)\w*|is (?:ever )?(?:finished|remodel+ed|converted|renovated)|are (?:ever )?(?:added|remodel+ed))\b[^.;]{0,60}?,\s*[^.;]*\b(?:will|would)\s+(?:(?:likely|probably|usually|typically)\s+)?(?:need|require|have to|be required|install|add|put in)\b/i;

/**
 * Sentences that teach rather than report, read as a whole (common practice of inspection reports:
 * glossaries, question-and-answer pages and background paragraphs beside the findings):
 * - a glossary entry, a term then a dash and its definition ("Double tap - Two conductors under a
 *   terminal designed for one."), or "Also called a false ground.";
 * - a question ("Q: I heard old houses have knob-and-tube."), which asks rather than reports;
 * - a definition by what a kind of device does ("A breaker or receptacle that detects arcing and
 *   opens the circuit.");
 * - what houses of an era or of a kind usually have ("Houses of this era were commonly built with
 *   knob-and-tube.").
 */
/** "word" as a pattern that takes it capitalised or not ("[Ss]afety"). */
const eitherCase = (words: readonly string[]) => words.map((w) => `[${w[0].toUpperCase()}${w[0]}]${w.slice(1)}`).join('|');
const NOT_A_TERM = eitherCase(['safety', 'repair', 'maintenance', 'monitor', 'minor', 'major', 'urgent', 'defect', 'deficiency', 'note', 'fyi', 'priority', 'high', 'medium', 'low', 'recommend\\w*', 'observ\\w*', 'correct\\w*', 'open', 'closed', 'item', 'comment', 'location', 'condition', 'status']);
const DEFINITION_START = eitherCase(['an?', 'the', 'two', 'three', 'hot', 'wires?', 'any', 'when', 'where', 'conductors?', 'older', 'also']);
const GLOSSARY_ENTRY = new RegExp(`^\\s*(?:[-*•·]\\s*)?["“]?(?=[^-–—\\n]*[a-z])(?!(?:${NOT_A_TERM})["”]?\\s+[-–—])[A-Z][\\w'/-]*(?:[ -][\\w'/()-]+){0,4}["”]?\\s+[-–—]\\s+(?:${DEFINITION_START})\\b`);
const ALSO_CALLED = /^\s*(?:also|sometimes|often)\s+(?:called|known as|referred to as)\b/i;
const QUESTION_LINE = /^\s*(?:Q\s*\d*\s*[:.)]|Question\s*\d*\s*:)/;
const DEVICE_DEFINITION = /^\s*(?:an?|the)\s+(?:[\w-]+\s+){0,3}?(?:breaker|receptacle|outlet|device|gfci|afci|conductor|wire|clamp|jumper)s?(?:\s+or\s+(?:[\w-]+\s+){0,2}?(?:breaker|receptacle|outlet|device)s?)?\s+(?:that|which)\s+(?:detects?|de-?energi[sz]es?|opens?|trips?|protects?|listens?|monitors?|senses?|shuts?|cuts?|connects?|joins?|bonds?)\b/i;
const ERA_HABIT = /\b(?:houses|homes)\s+(?:of|from|built (?:in|before|during|around))\s+(?:this|that|the)\s+(?:era|age|period|vintage|time)\b[^.]*\b(?:commonly|typically|usually|often|generally|were built|had)\b|\b(?:many|most|some|older)\s+(?:houses|homes)\s+(?:of|from|built|in|have|had|were|still)\b/i;
/** Words of an observation of this house, which keep a teaching-shaped sentence a finding. */
const OBSERVED_HERE = /\b(?:this (?:house|home|property|unit|one)|observed|noted|found|we found|i found|tested|at the|in the (?:attic|basement|garage|kitchen|bath\w*|bedroom|hall\w*|panel|crawl)|here)\b/i;

/** Whether the sentence teaches rather than reports (see GLOSSARY_ENTRY and the others above). */
export function teachesOnly(text: string): boolean {
  if (ALSO_CALLED.test(text) || QUESTION_LINE.test(text)) return true;
  // A glossary entry names no place of this house: "Kitchen - A receptacle by the sink..." is a finding.
  if (GLOSSARY_ENTRY.test(text) && !OBSERVED_HERE.test(text) && findRooms(text).length === 0 && !/\b\d+\b/.test(text)) return true;
  return (DEVICE_DEFINITION.test(text) || ERA_HABIT.test(text)) && !OBSERVED_HERE.test(text);
}

/**
 * A clause about what a kind of wiring or device does in general ("connections at aluminum-wired
 * outlets and switches are known to loosen over time"): background for the reader, not a defect seen.
 */
const GENERAL_PROPERTY = /\b(?:is|are)\s+(?:(?:well|widely|commonly)\s+)?known\s+(?:to|for)\b/i;

/** For each span (sorted by start, not overlapping), whether the sentence denies it. */
/**
 * A past-tense repair verb that opens the sentence or a cell of a table row (capitalised after
 * other words: "Main panel, utility rm Removed double tap ..."). Case matters: "removed" inside a
 * sentence ("the cover was removed for inspection") is no report of a repair.
 */
const REPAIR_DONE_BEFORE = /(?:(?:^\s*|[.;:|]\s*)(?:[Rr]emoved|[Rr]eplaced|[Rr]epaired|[Cc]orrected|[Ff]ixed|[Ff]illed|[Rr]e-?hung|[Rr]e-?wired|[Ss]ecured|[Tt]ightened|[Pp]igtailed|[Ss]wapped)|(?<=[a-z0-9)]\s+)(?:Removed|Replaced|Repaired|Corrected|Fixed|Filled|Re-?hung|Re-?wired|Rewired|Secured|Tightened|Pigtailed|Swapped))\s+(?:(?:the|a|an|all|both|\d+)\s+)?$/;
/** "... corrected at 2 receps", "... repaired." — but not "should be corrected by", "needs to be repaired". */
const REPAIR_DONE_AFTER = /^\s+(?<!\b(?:be|been|get|got)\s)(?:corrected|repaired|fixed)\b(?:\s+(?:at|on|in|per|with|and tested|and verified)\b|\s*(?:[.;,]|$))/i;

export function negatedSpans(text: string, spans: readonly Range[], clauses: readonly Range[] = clauseRanges(text)): boolean[] {
  if (FUTURE_CONDITION.test(text) || teachesOnly(text)) return spans.map(() => true);
  if (spans.length === 0) return [];
  const clauseOf = (pos: number) => clauseIndexAt(clauses, pos);
  const negated = spans.map(() => false);
  const isListed = (a: Range, b: Range) => LIST_JOIN.test(text.slice(a.end, b.start));

  for (const cue of cuesOutside(text, CUE_BEFORE, spans)) {
    const first = spans.findIndex((s) => s.start >= cue.end);
    if (first === -1 || clauseOf(spans[first].start) !== clauseOf(cue.start)) continue;
    if (spans[first].start - cue.end > MAX_CUE_DISTANCE) continue;
    // "not rated to carry a fan, and the fan shakes": a "not" that negates a verb of its own before
    // the phrase ("not rated", "not labeled") denies that verb, not the phrase.
    if (/^(?:not|never)$/i.test(text.slice(cue.start, cue.end)) && OWN_VERB.test(text.slice(cue.end, spans[first].start))) continue;
    if (NEW_SUBJECT_AFTER_COMMA.test(text.slice(cue.end, spans[first].start))) continue;
    // Twelfth round: "Kitchen island   NO   2 receptacles, no GFCI protection": a capital "NO" in a
    // sentence in lower case is a column's answer, and says nothing of a phrase that states the lack itself.
    if (text.slice(cue.start, cue.end) === 'NO' && /^(?:no|not|without|missing)\b/i.test(text.slice(spans[first].start)) && /\p{Ll}/u.test(text)) continue;
    // "not one is labeled, no directory at all": "not one" counts none of them; it denies nothing after it.
    if (/^not$/i.test(text.slice(cue.start, cue.end)) && /^\s+(?:one|a single)\b/i.test(text.slice(cue.end))) continue;
    negated[first] = true;
    for (let i = first + 1; i < spans.length && isListed(spans[i - 1], spans[i]); i++) negated[i] = true;
  }
  if (GENERAL_PROPERTY.test(text)) {
    spans.forEach((s, i) => {
      const clause = clauses[clauseOf(s.start)];
      if (GENERAL_PROPERTY.test(text.slice(clause.start, clause.end))) negated[i] = true;
    });
  }
  // A repair told as done: "Removed double tap at bkr #11", "... rm   Replaced GFCI that would not reset",
  // "Reversed polarity corrected at 2 receps". The defect named is history (a completion letter, a
  // re-inspection), not a defect of the house now.
  spans.forEach((s, i) => {
    const clause = clauses[clauseOf(s.start)];
    const before = text.slice(clause.start, s.start);
    const done = REPAIR_DONE_BEFORE.exec(before);
    if (done && s.start - (clause.start + done.index + done[0].length) <= MAX_CUE_DISTANCE) negated[i] = true;
    else if (REPAIR_DONE_AFTER.test(text.slice(s.end, Math.min(clause.end, s.end + 24)))) negated[i] = true;
  });
  // "attic: knob-and-tube?": a phrase asked about, not reported.
  spans.forEach((s, i) => {
    if (/^\s?\?/.test(text.slice(s.end, s.end + 2))) negated[i] = true;
  });
  for (const cue of cuesOutside(text, CUE_AFTER, spans)) {
    let last = -1;
    spans.forEach((s, i) => {
      if (s.end <= cue.start) last = i;
    });
    if (last === -1 || clauseOf(spans[last].start) !== clauseOf(cue.start)) continue;
    negated[last] = true;
    for (let i = last - 1; i >= 0 && isListed(spans[i], spans[i + 1]); i--) negated[i] = true;
  }
  return negated;
}
