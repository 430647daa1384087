import { readBlock } from './block-findings';
import { splitBlocks } from './block-splitter';
import { CODE_RULES } from './code-patterns';
import { findingCodeInfo, type FindingCode } from './finding-code';
import { answeredNoLines, withoutAnsweredNo } from './hazard-answer';
import { formMarks } from './form-marks';
import { closedItemLines } from './status-lines';
import { isComposedFinding } from './device-condition';
import { dropCaptionRepeats } from './caption-repeats';
import { isListItem, listKindOf, mergeDocument, type FindingPlace } from './document-merge';
import { withoutClosedItems } from './item-status';
import { findRooms } from './room-lexicon';
import type { Room } from './room';
import type { Finding, ParseResult, SkippedText } from './finding.schema';
import { sourceRange, type MappedText } from './mapped-text';
import { SUMMARY_HEADING } from './section-heading';

/** The character that joins pages into one text; offsets in a ParseResult refer to that text. */
export const PAGE_SEPARATOR = '\f';

/** Joins report pages the way all offsets of a ParseResult count them. */
export function joinPages(pages: readonly string[]): string {
  return pages.join(PAGE_SEPARATOR);
}

function pageLocator(joined: string): (offset: number) => number {
  const breaks: number[] = [];
  for (let i = joined.indexOf(PAGE_SEPARATOR); i !== -1; i = joined.indexOf(PAGE_SEPARATOR, i + 1)) breaks.push(i);
  // 1 + the number of breaks before the offset, by binary search (breaks are in increasing order).
  return (offset) => {
    let lo = 0;
    let hi = breaks.length;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (breaks[mid] < offset) lo = mid + 1;
      else hi = mid;
    }
    return 1 + lo;
  };
}

/**
 * Reads the electrical findings of an inspection report given as page texts. Every finding's
 * evidence is `joinPages(pages).slice(start, end)`: the sentence it was read from, exactly as
 * written, even across a page break; `page` is the 1-based page where that sentence starts.
 * Blocks that give no finding come back in `skipped` with their section and the reason.
 */
/** Words of the findings read even in a non-electrical section (see crossSectionOnly). */
const CROSS_SECTION_HINT = /nameplate|data plate|max(?:imum|\.)?\s+(?:fuse|breaker|overcurrent)|mocp|carbon monoxide|\bco\s+(?:alarm|detector)/i;

/** Of a block in a non-electrical section, only the computed nameplate findings and the CO/smoke alarm findings. */
function crossSectionOnly(result: ReturnType<typeof readBlock>): ReturnType<typeof readBlock> {
  return { ...result, findings: result.findings.filter((f) => (f.code === 'overcurrent-mismatch' && f.computation !== null) || f.code === 'smoke-co-alarm') };
}

export function parseReport(pages: readonly string[]): ParseResult {
  const joined = joinPages(pages);
  const pageOf = pageLocator(joined);
  const findings: Finding[] = [];
  const inSummary: boolean[] = [];
  // Per finding: a follow-up with no place of its own (a recommendation, or the defect named again as "This is ...").
  const isFollowUp: boolean[] = [];
  const sectionOf: Array<string | null> = [];
  // Per finding: a list item that points to where the report describes it ("... (see 4.3)").
  const crossRef: boolean[] = [];
  const skipped: SkippedText[] = [];
  // Lines of an insurance checklist that answer a hazard "no" ("Double taps ...... N").
  const answeredNo = answeredNoLines(joined);
  // Empty check boxes and legend lines of forms report nothing; checked boxes are the form's summary.
  const marks = formMarks(joined);
  // Items a re-inspection marks as put right, with their status in a column or on the line below.
  const closedLines = closedItemLines(joined);
  // Findings read from a device and its condition (by index in `findings`).
  const composedHere = new Set<number>();
  // Per finding: its block, section and whether the block is a list item (for the document-level merge).
  const placeOf = new Map<Finding, FindingPlace>();
  let blockIndex = -1;
  let sectionIndex = -1;
  let lastSection: unknown = null;

  for (const block of splitBlocks(joined)) {
    const { start, end } = sourceRange(block.text);
    blockIndex++;
    if (block.section !== lastSection) sectionIndex++;
    lastSection = block.section;
    const fromLineStart = joined.slice(Math.max(joined.lastIndexOf('\n', start - 1), joined.lastIndexOf('\f', start - 1)) + 1, end);
    const place: FindingPlace = { block: blockIndex, section: sectionIndex, listItem: isListItem(fromLineStart), listKind: listKindOf(fromLineStart) };
    const skip = (reason: SkippedText['reason']) =>
      skipped.push({
        section: block.section.title,
        sectionKind: block.section.kind,
        reason,
        text: joined.slice(start, end),
        page: pageOf(start),
        start,
        end,
      });
    const outside = block.section.kind === 'non-electrical';
    // Under a heating or cooling heading, a nameplate compared with its breaker and a missing CO
    // alarm are still electrical findings; nothing else there is read.
    // An earlier report's item that a re-inspection marks as put right ("... corrected", "CLOSED") reports nothing.
    const read = (): ReturnType<typeof readBlock> => {
      const closed = withoutClosedItems(block.text);
      const answered = closed === null ? null : withoutAnsweredNo(closed, answeredNo);
      const unmarked = answered === null ? null : withoutAnsweredNo(answered, marks.denied);
      const open = unmarked === null ? null : withoutAnsweredNo(unmarked, closedLines);
      return open === null ? { findings: [], hasNegated: true } : readBlock(open, block.section, block.rowCounts);
    };
    const result = outside && CROSS_SECTION_HINT.test(block.text.text) ? crossSectionOnly(read()) : outside ? null : read();
    if (result === null || (outside && result.findings.length === 0)) {
      skip('non-electrical-section');
      continue;
    }
    if (result.findings.length === 0) {
      const suggestion = result.hasNegated ? null : suggestItem(block.text.text, block.section.room);
      if (suggestion) {
        skip('not-itemised');
        skipped[skipped.length - 1] = { ...skipped[skipped.length - 1], suggestion };
      } else {
        skip(result.hasNegated ? 'negated' : 'no-electrical-finding');
      }
      continue;
    }
    const followUp = (f: (typeof result.findings)[number]) => f.confidence === 'inferred' && f.computation === null && (f.isRecommendation || FOLLOW_UP_OPENING.test(f.sentence.text));
    const allFollowUps = result.findings.every(followUp);
    for (const f of result.findings) {
      // The same computation told twice (a summary line and the body's HVAC paragraph) is one defect.
      if (f.computation !== null && findings.some((g) => g.code === f.code && g.computation === f.computation)) continue;
      // A defect read from a device and its condition, whose code the report has already given, is that defect told again.
      if (isComposedFinding(f) && findings.some((g) => g.code === f.code)) continue;
      if (isComposedFinding(f)) composedHere.add(findings.length);
      const range = sourceRange(f.sentence);
      const info = findingCodeInfo(f.code);
      inSummary.push((block.section.title !== null && SUMMARY_HEADING.test(block.section.title)) || marks.checked.some((r) => r.start < range.end && range.start < r.end));
      crossRef.push(isCrossReference(joined.slice(range.start, range.end)));
      isFollowUp.push(allFollowUps);
      sectionOf.push(block.section.title);
      const finding: Finding = {
        code: f.code,
        room: f.room,
        location: f.location,
        quantity: f.quantity,
        evidence: joined.slice(range.start, range.end),
        page: pageOf(range.start),
        start: range.start,
        end: range.end,
        severity: info.severity,
        necRefs: [...info.necRefs],
        confidence: f.confidence,
        recommendation: f.recommendations.length > 0 ? f.recommendations.map((r) => sourceText(joined, r)).join(' ') : null,
        computation: f.computation,
      };
      placeOf.set(finding, place);
      findings.push(finding);
    }
  }
  const kept = dropFollowUps(findings, isFollowUp, sectionOf);
  const summaryFlags = withCrossReferences(inSummary, crossRef, sectionOf);
  const read = dropCaptionRepeats(mergeWiringMentions(mergeSummary(dropTitles(kept.findings, joined), kept.inSummary(summaryFlags))), joined);
  // ... or gives later for the same place (a title before its body).
  const composed = new Set([...composedHere].map((i) => findings[i]));
  const single = read.filter((f) => !(composed.has(f) && read.some((g) => !composed.has(g) && g.code === f.code && g.room === f.room)));
  // One finding per defect across the whole report (document-merge.ts).
  return { findings: mergeDocument(single, (f) => placeOf.get(f)), skipped };
}

/**
 * A list item that points to where the report describes it ("Open grounds, dining room (E.4)",
 * "Garage GFCI does not trip (see 4.6)") is a summary line; when a report's summary items carry such
 * references, the items after the last such one are the body the references point to, even under the
 * summary heading (the body's items were never given a heading of their own).
 */
const CROSS_REFERENCE = /\((?:(?:see|ref\.?|refer to|item|section|sec\.?|§)\s*(?:[a-z]{1,3}[-.]?)?\d{1,2}(?:\.\d{1,2}){0,2}|[a-z]{1,3}[-.]\d{1,2}(?:\.\d{1,2})?|\d{1,2}\.\d{1,2}(?:\.\d{1,2})?)\)\s*[.;]?\s*$/i;
function isCrossReference(evidence: string): boolean {
  return evidence.length <= 160 && CROSS_REFERENCE.test(evidence);
}
function withCrossReferences(inSummary: readonly boolean[], crossRef: readonly boolean[], sectionOf: ReadonlyArray<string | null>): boolean[] {
  if (crossRef.filter(Boolean).length < 2) return [...inSummary];
  return inSummary.map((summary, i) => {
    if (!summary) return false;
    // Under a summary heading: the items after the last one with a reference are the body.
    const lastRef = crossRef.reduce((last, c, j) => (c && sectionOf[j] === sectionOf[i] ? j : last), -1);
    return crossRef[i] || lastRef < 0 || i < lastRef;
  });
}

/** A sentence that names the defect just described again ("This is a false ground.", "False ground.") or only says what to do. */
const FOLLOW_UP_OPENING = /^\s*(?:[Tt]his|[Tt]hat|[Ii]t)\s+(?:is|was)\b|^\s*(?:[Pp]rovide|[Ii]nstall|[Aa]dd|[Rr]eplace|[Rr]epair|[Cc]orrect|[Rr]emove|[Rr]e-?test|[Ll]abel|[Hh]ave)\b|^\s*(?:[A-Z][\w'-]*)(?:\s+[a-z(][\w'"()-]*){0,2}\.?\s*$/;

/**
 * An item with no place of its own that only recommends ("Install a GFCI receptacle or breaker.") or
 * names again the defect of the item before it ("This is a false ground."), in the same section, is
 * part of that finding, not another one; so is the usual remedy of that defect (an open-ground
 * remedy after a false ground: NFPA 70 (NEC) 2023, 250.130(C) and 406.4(D)(2)).
 */
function dropFollowUps(findings: Finding[], isFollowUp: readonly boolean[], sectionOf: ReadonlyArray<string | null>) {
  let lastKept = -1;
  const keep = findings.map((f, i) => {
    const prev = lastKept >= 0 && sectionOf[lastKept] === sectionOf[i] ? findings[lastKept] : null;
    const rule = CODE_RULES.find((r) => r.code === f.code);
    const isPart = isFollowUp[i] && prev !== null && (prev.code === f.code || rule?.yieldsTo?.includes(prev.code) === true || rule?.yieldsInBlockTo?.includes(prev.code) === true);
    if (!isPart) lastKept = i;
    return !isPart;
  });
  return {
    findings: findings.filter((_, i) => keep[i]),
    inSummary: (flags: readonly boolean[]) => flags.filter((_, i) => keep[i]),
  };
}

/** A bare title ("8.2 Double Tap", "Open Grounds"): a few capitalised words with no verb. */
const TITLE = /^(?:[A-Z][\w'-]*|&|\/|and|of|at|in)(?:\s+(?:[A-Z][\w'-]*|&|\/|and|of|at|in)){0,4}$/;
const TITLE_VERB = /\b(?:is|are|was|were|has|have|had|not|no|did|does)\b/i;

/**
 * A finding read from a sub-heading that only names the defect ("8.2 Double Tap") is the heading of
 * the finding the next paragraph gives for the same code and room: one finding per defect.
 */
function dropTitles(findings: Finding[], joined: string): Finding[] {
  return findings.filter((f, i) => {
    const next = findings[i + 1];
    const text = f.evidence.trim();
    if (!TITLE.test(text) || TITLE_VERB.test(text)) return true;
    // A title answered by a denial on the next line ("KNOB-AND-TUBE" / "None found in use.") reports nothing.
    if (TITLE_DENIED.test(joined.slice(f.end, f.end + 40))) return false;
    return !(next && next.code === f.code && next.room === f.room && next.start > f.end);
  });
}
/** A denial opening the text right after a title: "None found", "No", "Not present", "N/A". */
const TITLE_DENIED = /^[\s:.-]*(?:none\b|no(?:ne)?\s+(?:found|observed|noted|seen|present)\b|not\s+(?:found|observed|present|applicable)\b|n\/a\b)/i;

/** Wiring methods: a house has its aluminum or knob-and-tube wiring once, however often it is mentioned. */
const WIRING_METHODS: ReadonlySet<string> = new Set(['knob-and-tube', 'aluminum-branch-wiring']);

/**
 * A wiring method mentioned again later in the report is the same condition when the mention names
 * no place of its own, names a place already given, or sits in a sentence about another defect
 * ("AFCI protection is recommended, especially with aluminum wiring").
 */
function mergeWiringMentions(findings: Finding[]): Finding[] {
  return findings.filter((f, i) => {
    if (!WIRING_METHODS.has(f.code)) return true;
    // A house-wide mention of a wiring method the report also places in a room is that same condition.
    if (f.room === 'whole-house' && findings.some((g) => g.code === f.code && g.room !== 'whole-house' && g.room !== 'unknown')) return false;
    const earlier = findings.slice(0, i).filter((g) => g.code === f.code);
    if (earlier.length === 0) return true;
    const aboutOther = findings.some((g) => g !== f && g.start === f.start && g.code !== f.code);
    return !(f.confidence === 'inferred' || aboutOther || earlier.some((g) => g.room === f.room));
  });
}


/**
 * One finding per defect: a summary item whose defect the body describes again (same code, and the
 * same room or a summary room that rests on no place of its own) gives way to the body's finding.
 */
function mergeSummary(findings: Finding[], inSummary: readonly boolean[]): Finding[] {
  if (!inSummary.some(Boolean)) return findings;
  const body = findings.filter((_, i) => !inSummary[i]);
  return findings.filter((f, i) => {
    if (!inSummary[i]) return true;
    return !body.some((b) => b.code === f.code && (b.room === f.room || f.confidence === 'inferred' || f.room === 'unknown' || f.room === 'whole-house'));
  });
}

/**
 * Electrical things a passage can name, with the code an item about each would most likely get:
 * the first one named decides the suggestion for a passage that gave no finding.
 */
const SUGGESTIONS: ReadonlyArray<readonly [RegExp, FindingCode]> = [
  [/\b(?:gfc?is?|gfi|ground[- ]fault)\b/i, 'gfci-missing'],
  [/\b(?:afcis?|arc[- ]fault)\b/i, 'afci-missing'],
  [/\b(?:smoke|carbon monoxide|co)\s+(?:alarms?|detectors?)\b/i, 'smoke-co-alarm'],
  [/\b(?:ceiling\s+)?fans?\b/i, 'fan-support'],
  [/\b(?:junction box(?:es)?|j-?box(?:es)?|splices?|wire nuts?)\b/i, 'open-junction-box'],
  [/\b(?:receptacles?|outlets?|recep\w*|rcpts?)\b/i, 'receptacle-damaged'],
  [/\b(?:switch(?:es)?)\b/i, 'switch-issue'],
  [/\b(?:light(?:s|ing)?|fixtures?|luminaires?)\b/i, 'light-fixture'],
  [/\b(?:breakers?|fuses?|ocpd)\b/i, 'overcurrent-mismatch'],
  [/\b(?:sub-?panel|panel(?:board)?|load cent(?:er|re)|dead[- ]?front)\b/i, 'panel-deficiency'],
  [/\b(?:service (?:drop|mast|entrance|conductors?)|meter|weather ?head|drip loop)\b/i, 'service-equipment'],
  [/\b(?:grounding electrode|ground rod|bond(?:ing)?)\b/i, 'grounding-electrode'],
  [/\b(?:wir(?:e|es|ing)|cables?|conductors?|extension cords?)\b/i, 'exposed-wiring'],
  [/\b(?:electrical|electrician)\b/i, 'evaluate-general'],
];

/**
 * SUGGESTIONS as one expression, each in a group of its own: its match is the leftmost of all
 * theirs and, where several begin at the same place, the first listed's, which is what trying them
 * one by one and keeping the first leftmost gives, in one pass over the text instead of fourteen.
 * Built only when every expression is plain (the i flag alone, no groups that capture).
 */
const SUGGESTION_ANY: RegExp | null = (() => {
  const groups = (re: RegExp) => new RegExp(`${re.source}|`).exec('')!.length - 1;
  if (SUGGESTIONS.some(([re]) => re.flags !== 'i' || groups(re) > 0)) return null;
  return new RegExp(SUGGESTIONS.map(([re]) => `(${re.source})`).join('|'), 'i');
})();

/** The first electrical thing a passage names (see SUGGESTIONS). */
function firstSuggestion(text: string): FindingCode | null {
  if (SUGGESTION_ANY !== null) {
    const m = SUGGESTION_ANY.exec(text);
    if (m === null) return null;
    let k = 1;
    while (m[k] === undefined) k++;
    return SUGGESTIONS[k - 1][1];
  }
  let best: { code: FindingCode; index: number } | null = null;
  for (const [re, code] of SUGGESTIONS) {
    const m = re.exec(text);
    if (m && (best === null || m.index < best.index)) best = { code, index: m.index };
  }
  return best?.code ?? null;
}

/** What an item made from a passage that gave no finding would most likely be, or null if it names nothing electrical. */
export function suggestItem(text: string, sectionRoom: Room | null): { code: FindingCode; room: Room } | null {
  const code = firstSuggestion(text);
  if (code === null) return null;
  const info = CODE_RULES.find((r) => r.code === code);
  const named = findRooms(text).find((r) => !r.isReferencePoint && r.room !== 'panel');
  return { code, room: info?.fixedRoom ?? named?.room ?? sectionRoom ?? info?.defaultRoom ?? 'unknown' };
}

/** The original text of a mapped stretch, exactly as the report wrote it. */
function sourceText(joined: string, m: MappedText): string {
  const { start, end } = sourceRange(m);
  return joined.slice(start, end);
}

/** Convenience for plain text: pages are separated by form feeds. */
export function parseText(text: string): ParseResult {
  return parseReport(text.split(PAGE_SEPARATOR));
}
