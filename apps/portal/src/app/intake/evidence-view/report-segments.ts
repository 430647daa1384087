/** A stretch of a report's joined text, with the items whose evidence covers it. */
export interface ReportSegment {
  /** Offset in the joined text (pages joined with "\f"). */
  readonly start: number;
  readonly text: string;
  readonly itemIds: readonly number[];
}

export interface ReportPage {
  /** 1-based page number. */
  readonly number: number;
  /** Offset of the page's first character in the joined text. */
  readonly start: number;
  readonly segments: readonly ReportSegment[];
}

/** Where an item's evidence sits in the joined text. */
export interface EvidenceRange {
  readonly id: number;
  readonly start: number;
  readonly end: number;
}

/**
 * Cuts each page into plain and highlighted stretches. Offsets refer to `pages.join('\f')`, so a
 * range that runs over a page break is highlighted on both pages; the form feed itself is not shown.
 */
export function reportSegments(pages: readonly string[], ranges: readonly EvidenceRange[]): ReportPage[] {
  const result: ReportPage[] = [];
  let pageStart = 0;
  pages.forEach((text, index) => {
    const pageEnd = pageStart + text.length;
    const cuts = new Set([pageStart, pageEnd]);
    for (const r of ranges) {
      if (r.start > pageStart && r.start < pageEnd) cuts.add(r.start);
      if (r.end > pageStart && r.end < pageEnd) cuts.add(r.end);
    }
    const sorted = [...cuts].sort((a, b) => a - b);
    const segments: ReportSegment[] = [];
    for (let i = 0; i + 1 < sorted.length; i++) {
      const [from, to] = [sorted[i], sorted[i + 1]];
      const itemIds = ranges.filter((r) => r.start <= from && r.end >= to).map((r) => r.id);
      segments.push({ start: from, text: text.slice(from - pageStart, to - pageStart), itemIds });
    }
    result.push({ number: index + 1, start: pageStart, segments });
    pageStart = pageEnd + 1;
  });
  return result;
}
