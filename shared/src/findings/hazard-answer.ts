import type { MappedText } from './mapped-text';

/**
 * Insurance and underwriting checklists (four-point forms, carrier checklists) list the hazards they
 * ask about and answer each in a Y/N column: "Double taps ......  N", "| 2 | Double taps | N | |",
 * "Double taps;none seen;N;". A hazard answered "no" is a question, not a finding (common practice in
 * insurance inspection forms). The answer column is known from the checklist's own heading: a cell
 * or a line that names hazards (defects, deficiencies) with a Y/N answer.
 */
interface Range {
  readonly start: number;
  readonly end: number;
}

/** A column heading for the answer: "Hazard present Y/N", "Hazard present (Y/N)", "Deficient? (Y/N)". */
const ANSWER_HEADING = /\b(?:hazards?|defects?|deficien\w*|concerns?|condition\s+present)\b[^|;\t]{0,24}?\(?\s*(?:y\s*\/\s*n|yes\s*\/\s*no)\s*\)?\s*$/i;
/** A heading line whose Y and N stand over the answers of the rows below ("Hazard present?   Y   N"). */
const ANSWER_LINE = /\b(?:hazards?|defects?|deficien\w*)\b[^.]{0,60}?\s(Y)\s{1,12}(N)\s*$/di;
const NO = /^(?:n|no|none)\.?$/i;
/** A row that ends in its answer after a leader ("Double lugged breakers ......     N"). */
const LEADER_ANSWER = /\.{3,}\s*(N|No|Y|Yes|X)\s*$/d;

function cellsOf(line: string): string[] | null {
  const t = line.trim();
  if (t.includes('|')) return t.replace(/^\|/, '').replace(/\|$/, '').split('|').map((c) => c.trim());
  if (t.includes('\t')) return t.split('\t').map((c) => c.trim());
  if ((t.match(/;/g) ?? []).length >= 2) return t.split(';').map((c) => c.trim());
  return null;
}

/** The joined report's lines (offsets in the joined text) that answer a checklist hazard "no". */
export function answeredNoLines(joined: string): Range[] {
  if (!/y\s*\/\s*n|yes\s*\/\s*no|\sY\s{1,12}N\s*$/im.test(joined)) return [];
  const denied: Range[] = [];
  let column: number | null = null;
  // Positions of the Y and N over the answer column, for rows answered with a mark ("X").
  let marks: { y: number; n: number } | null = null;
  const lineBreak = /\r?\n|\f/g;
  for (let start = 0; start <= joined.length; ) {
    const brk = lineBreak.exec(joined);
    const end = brk ? brk.index : joined.length;
    const text = joined.slice(start, end);
    const cells = cellsOf(text);
    if (cells) {
      const heading = cells.findIndex((c) => ANSWER_HEADING.test(c));
      if (heading !== -1) column = heading;
      else if (column !== null && NO.test(cells[column] ?? '')) denied.push({ start, end });
    } else if (text.trim().length > 0 && !/^[\s+|=-]*$/.test(text)) {
      column = null;
    }
    const line = ANSWER_LINE.exec(text);
    if (line?.indices) {
      marks = { y: line.indices[1][0], n: line.indices[2][0] };
    } else if (text.trim().length === 0) {
      marks = null;
    } else if (marks) {
      const answer = LEADER_ANSWER.exec(text);
      if (answer?.indices) {
        const at = answer.indices[1][0];
        const isNo = answer[1] === 'X' ? Math.abs(at - marks.n) < Math.abs(at - marks.y) : NO.test(answer[1]);
        if (isNo) denied.push({ start, end });
      }
    }
    if (!brk) break;
    start = brk.index + brk[0].length;
  }
  return denied;
}

/** The block without the rows that answer a hazard "no", or null when nothing is left to read. */
export function withoutAnsweredNo(block: MappedText, denied: readonly Range[]): MappedText | null {
  if (denied.length === 0) return block;
  const first = block.offsets[0];
  const last = block.offsets[block.offsets.length - 1];
  if (!denied.some((r) => r.start <= last && first < r.end)) return block;
  const inDenied = (offset: number) => denied.some((r) => offset >= r.start && offset < r.end);
  let text = '';
  const offsets: number[] = [];
  let cut = false;
  for (let i = 0; i < block.text.length; i++) {
    if (inDenied(block.offsets[i])) {
      cut = true;
      continue;
    }
    // What is left of the rows around a removed one stands as rows of its own.
    if (cut && text.length > 0 && !text.endsWith('\n')) {
      text += '\n';
      offsets.push(offsets[offsets.length - 1]);
    }
    cut = false;
    text += block.text[i];
    offsets.push(block.offsets[i]);
  }
  return text.trim().length > 0 ? { text, offsets } : null;
}
