import { CODE_RULES, type CodePattern, type CodeRule } from './code-patterns';
import { FINDING_CODES } from './finding-code';
import { LiteralScanner } from './literal-scanner';
import { requiredLiteralLists } from './phrase-literals';
import { checkOvercurrent, type CarriedRatings } from './overcurrent-check';
import { scanAll } from './regex-scan';

/** One defect phrase found in a sentence. */
export interface CodeMatch {
  readonly rule: CodeRule;
  readonly start: number;
  readonly end: number;
  readonly isRecommendation: boolean;
  /** For a computed finding (overcurrent device vs conductor or nameplate), how it was computed. */
  readonly computation?: string;
}

const TABLE_ORDER = new Map(FINDING_CODES.map((code, i) => [code, i]));

export interface MatchOptions {
  /**
   * Whether to try every phrase on the sentence, skipping neither the code's trigger words nor the
   * phrase's own required words (for checks that the shortcuts change nothing).
   */
  readonly ignoreTriggers?: boolean;
  /** A nameplate maximum or device rating stated by the sentence before in the same block (see checkOvercurrent). */
  readonly carried?: CarriedRatings | null;
}

/**
 * A regular expression of the table with the lists of words it cannot match without (derived by
 * phrase-literals.ts): it can match a sentence only if each list has a word there. `ids` number
 * the lists for the scanner; with no list derived the expression is always tried.
 */
interface Indexed<T> {
  readonly item: T;
  readonly ids: readonly number[];
  readonly lists: ReadonlyArray<readonly string[]>;
}

interface IndexedRule {
  readonly rule: CodeRule;
  /** The code's trigger words, as a regular expression of their own. */
  readonly trigger: Indexed<RegExp>;
  readonly patterns: ReadonlyArray<Indexed<CodePattern>>;
}

const INDEXED: readonly IndexedRule[] = (() => {
  let id = 0;
  const index = <T>(item: T, re: RegExp): Indexed<T> => {
    const lists = requiredLiteralLists(re);
    return { item, lists, ids: lists.map(() => id++) };
  };
  return CODE_RULES.map((rule) => ({
    rule,
    trigger: index(rule.trigger, rule.trigger),
    patterns: rule.patterns.map((pattern) => index(pattern, pattern.re)),
  }));
})();

/**
 * Per-phrase and per-trigger required words, derived from the phrase table: one scanner finds in
 * a single pass over the sentence which lists have a word there.
 */
const REQUIRED_WORDS: LiteralScanner = (() => {
  const idsByLiteral = new Map<string, number[]>();
  let count = 0;
  for (const { trigger, patterns } of INDEXED) {
    for (const { lists, ids } of [trigger, ...patterns]) {
      lists.forEach((list, k) => {
        for (const literal of list) idsByLiteral.set(literal, [...(idsByLiteral.get(literal) ?? []), ids[k]]);
      });
      count += ids.length;
    }
  }
  return new LiteralScanner([...idsByLiteral].map(([text, ids]) => ({ text, ids })), count);
})();

/** Whether each list of the expression has a word in the sentence (`present` from the scanner). */
function hasAllLists(indexed: Indexed<unknown>, present: Uint8Array): boolean {
  for (const id of indexed.ids) if (present[id] === 0) return false;
  return true;
}

function allMatches(sentence: string, options: MatchOptions): CodeMatch[] {
  const found: CodeMatch[] = [];
  const present = options.ignoreTriggers ? null : REQUIRED_WORDS.scan(sentence.toLowerCase());
  for (const { rule, trigger, patterns } of INDEXED) {
    // The code's trigger is tested only when one of its phrases and the trigger itself can match.
    if (present !== null) {
      if (!hasAllLists(trigger, present) || !patterns.some((p) => hasAllLists(p, present))) continue;
      if (!rule.trigger.test(sentence)) continue;
    }
    for (const indexed of patterns) {
      if (present !== null && !hasAllLists(indexed, present)) continue;
      const pattern = indexed.item;
      if (pattern.context && !pattern.context.test(sentence)) continue;
      if (pattern.unless && pattern.unless.test(sentence)) continue;
      for (const m of scanAll(pattern.re, sentence)) {
        if (m[0].trim().length === 0 || (pattern.check && !pattern.check(m))) continue;
        const start = m.index + (m[0].length - m[0].trimStart().length);
        const end = m.index + m[0].trimEnd().length;
        found.push({ rule, start, end, isRecommendation: pattern.isRecommendation === true });
      }
    }
  }
  for (const check of checkOvercurrent(sentence, options.carried ?? null)) found.push({ rule: OVERCURRENT_RULE, start: check.start, end: check.end, isRecommendation: false, computation: check.computation });
  return found;
}

const OVERCURRENT_RULE = CODE_RULES.find((r) => r.code === 'overcurrent-mismatch')!;

/**
 * The defect phrases of a sentence, in reading order and without overlaps: where two phrases
 * overlap the longer one wins (a full phrase beats a fragment of it), then the code listed first
 * in the code table. A recommendation-only phrase ("recommend GFCI protection") is dropped when
 * its code yields to another code found in the same sentence (GFCI offered as the remedy for an
 * open ground is not a missing-GFCI finding).
 */
export function matchCodes(sentence: string, options: MatchOptions = {}): CodeMatch[] {
  const ranked = allMatches(sentence, options).sort(
    (a, b) =>
      Number(b.computation !== undefined) - Number(a.computation !== undefined) ||
      b.end - b.start - (a.end - a.start) ||
      (TABLE_ORDER.get(a.rule.code) ?? 0) - (TABLE_ORDER.get(b.rule.code) ?? 0) ||
      a.start - b.start,
  );
  const kept: CodeMatch[] = [];
  for (const match of ranked) {
    if (kept.some((k) => match.start < k.end && k.start < match.end)) continue;
    kept.push(match);
  }
  const codes = new Set(kept.map((k) => k.rule.code));
  return kept
    .filter((k) => !(k.isRecommendation && k.rule.yieldsTo?.some((code) => codes.has(code))))
    .sort((a, b) => a.start - b.start);
}
