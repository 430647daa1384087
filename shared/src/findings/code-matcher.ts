import { CODE_RULES, type CodeRule } from './code-patterns';
import { FINDING_CODES } from './finding-code';

/** One defect phrase found in a sentence. */
export interface CodeMatch {
  readonly rule: CodeRule;
  readonly start: number;
  readonly end: number;
  readonly isRecommendation: boolean;
}

const TABLE_ORDER = new Map(FINDING_CODES.map((code, i) => [code, i]));

export interface MatchOptions {
  /** Whether to try every phrase even where the code's trigger words are absent (for checks). */
  readonly ignoreTriggers?: boolean;
}

function allMatches(sentence: string, options: MatchOptions): CodeMatch[] {
  const found: CodeMatch[] = [];
  for (const rule of CODE_RULES) {
    if (!options.ignoreTriggers && !rule.trigger.test(sentence)) continue;
    for (const pattern of rule.patterns) {
      if (pattern.context && !pattern.context.test(sentence)) continue;
      if (pattern.unless && pattern.unless.test(sentence)) continue;
      for (const m of sentence.matchAll(pattern.re)) {
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
