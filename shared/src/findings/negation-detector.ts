import { clauseIndexAt, clauseRanges, type Range } from './clause-splitter';
import { scanAll } from './regex-scan';

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
const CUE_AFTER = /(?:\b(?:was|were|is|are)\s+)?\bnot\s+(?:observed|found|noted|detected|seen|evident|identified|present)\b|\bnone\b(?!\s+of\b)(?:\s+(?:observed|found|noted|detected|seen|evident))?|\bn\/a\b|\bnot an issue\b|\b(?:was|is|were|are)\s+not\s+(?:considered|reported as|listed as|counted as)\s+(?:a\s+)?(?:defect|deficiency|concern|problem)\b|\btypical (?:for|of) (?:the|its|a home of this) (?:age|era|period|vintage)\b|\b(?:listed|noted|included|reported) (?:here )?for information(?:al purposes)?(?: only)?\b|\bnot as a defect\b|\bas (?:required|expected|intended)\b|\b(?:was|were) previously (?:present|installed|used|in use)\b|\b(?:tested|test|tests) (?:ok|okay|good|correctly|properly|fine)\b|\b(?:has|have|had) (?:since )?been (?:removed|replaced|abandoned|decommissioned|disconnected and removed|corrected|repaired)\b|\b(?:was|were) (?:removed|replaced|corrected|repaired|upgraded) (?:in|during|when|before|by|prior to|previously|already|earlier)\b|\b(?:which|that|as) (?:was|were|is) (?:allowed|permitted|acceptable) (?:when|at the time)\b|\bgrandfathered\b/gi;
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
const FUTURE_CONDITION = /^\s*(?:if|when|once|should)\s[^.;]{0,120}?\b(?:in the future|later|someday|is (?:ever )?(?:finished|remodel+ed|converted|renovated)|are (?:ever )?(?:added|remodel+ed))\b[^.;]{0,40}?,\s*[^.;]*\b(?:will|would)\s+(?:need|require|have to|be required)\b/i;

/**
 * A clause about what a kind of wiring or device does in general ("connections at aluminum-wired
 * outlets and switches are known to loosen over time"): background for the reader, not a defect seen.
 */
const GENERAL_PROPERTY = /\b(?:is|are)\s+(?:(?:well|widely|commonly)\s+)?known\s+(?:to|for)\b/i;

/** For each span (sorted by start, not overlapping), whether the sentence denies it. */
export function negatedSpans(text: string, spans: readonly Range[], clauses: readonly Range[] = clauseRanges(text)): boolean[] {
  if (FUTURE_CONDITION.test(text)) return spans.map(() => true);
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
