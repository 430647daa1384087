import { readBlock } from './block-findings';
import { splitBlocks } from './block-splitter';
import { findingCodeInfo } from './finding-code';
import type { Finding, ParseResult, SkippedText } from './finding.schema';
import { sourceRange, type MappedText } from './mapped-text';

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
export function parseReport(pages: readonly string[]): ParseResult {
  const joined = joinPages(pages);
  const pageOf = pageLocator(joined);
  const findings: Finding[] = [];
  const skipped: SkippedText[] = [];

  for (const block of splitBlocks(joined)) {
    const { start, end } = sourceRange(block.text);
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
    if (block.section.kind === 'non-electrical') {
      skip('non-electrical-section');
      continue;
    }
    const result = readBlock(block.text, block.section);
    if (result.findings.length === 0) {
      skip(result.hasNegated ? 'negated' : 'no-electrical-finding');
      continue;
    }
    for (const f of result.findings) {
      const range = sourceRange(f.sentence);
      const info = findingCodeInfo(f.code);
      findings.push({
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
      });
    }
  }
  return { findings, skipped };
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
