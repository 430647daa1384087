import { scanAll } from './regex-scan';

/** A [start, end) range of a sentence. */
export interface Range {
  readonly start: number;
  readonly end: number;
}

/**
 * Splits a sentence into clauses at semicolons and at contrast or cause words ("but", "although",
 * "however", "because"..., and ", only": "none in the bedrooms, only a hall unit"). Negation never crosses a clause, and a room named in one clause
 * belongs first to the findings of that clause.
 */
const CLAUSE_BREAK = /\s*;\s*|,?\s+(?:but|although|though|however|whereas|because|except|yet)\b,?\s*|,\s+(?=only\b)/gi;

export function clauseRanges(text: string): Range[] {
  const ranges: Range[] = [];
  let start = 0;
  for (const m of scanAll(CLAUSE_BREAK, text)) {
    if (m.index > start) ranges.push({ start, end: m.index });
    start = m.index + m[0].length;
  }
  if (start < text.length) ranges.push({ start, end: text.length });
  return ranges;
}

/** Index of the clause that contains `position` (the last clause when past the end). */
export function clauseIndexAt(clauses: readonly Range[], position: number): number {
  const found = clauses.findIndex((c) => position < c.end);
  return found === -1 ? clauses.length - 1 : found;
}
