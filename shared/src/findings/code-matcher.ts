import { CODE_RULES, type CodePattern, type CodeRule } from './code-patterns';
import { FINDING_CODES } from './finding-code';
import { LiteralScanner } from './literal-scanner';
import { requiredLiterals } from './phrase-literals';
import { scanAll } from './regex-scan';

/** One defect phrase found in a sentence. */
export interface CodeMatch {
  readonly rule: CodeRule;
  readonly start: number;
  readonly end: number;
  readonly isRecommendation: boolean;
}

const TABLE_ORDER = new Map(FINDING_CODES.map((code, i) => [code, i]));

export interface MatchOptions {
  /**
   * Whether to try every phrase on the sentence, skipping neither the code's trigger words nor the
   * phrase's own required words (for checks that the shortcuts change nothing).
   */
  readonly ignoreTriggers?: boolean;
}

/** Every phrase of the table with its id, and whether it has required words (else it is always tried). */
interface IndexedPattern {
  readonly id: number;
  readonly pattern: CodePattern;
  readonly isAlwaysTried: boolean;
}

const INDEXED: ReadonlyArray<{ readonly rule: CodeRule; readonly patterns: readonly IndexedPattern[] }> = (() => {
  let id = 0;
  return CODE_RULES.map((rule) => ({
    rule,
    patterns: rule.patterns.map((pattern) => ({ id: id++, pattern, isAlwaysTried: requiredLiterals(pattern.re) === null })),
  }));
})();

/**
 * Per-phrase trigger words, derived from the phrase table (phrase-literals.ts): one scanner finds
 * in a single pass which phrases can match the sentence at all.
 */
const PHRASE_WORDS: LiteralScanner = (() => {
  const idsByLiteral = new Map<string, number[]>();
  for (const { patterns } of INDEXED) {
    for (const { id, pattern } of patterns) {
      for (const literal of requiredLiterals(pattern.re) ?? []) idsByLiteral.set(literal, [...(idsByLiteral.get(literal) ?? []), id]);
    }
  }
  const count = INDEXED.reduce((n, { patterns }) => n + patterns.length, 0);
  return new LiteralScanner([...idsByLiteral].map(([text, ids]) => ({ text, ids })), count);
})();

function allMatches(sentence: string, options: MatchOptions): CodeMatch[] {
  const found: CodeMatch[] = [];
  const possible = options.ignoreTriggers ? null : PHRASE_WORDS.scan(sentence.toLowerCase());
  const isPossible = (p: IndexedPattern) => possible === null || p.isAlwaysTried || possible[p.id] === 1;
  for (const { rule, patterns } of INDEXED) {
    // The code's trigger words are tested only when one of its phrases has its own words here.
    if (possible !== null && (!patterns.some(isPossible) || !rule.trigger.test(sentence))) continue;
    for (const indexed of patterns) {
      if (!isPossible(indexed)) continue;
      const { pattern } = indexed;
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
  return found;
}

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
