import { linesOf, type Line, type Range } from './form-marks';

/**
 * Re-inspections, final walk-throughs and repair trackers repeat each item of the first report with
 * its status today, in a column of its own ("Open junction box, attic      CORRECTED. Cover installed.")
 * or on the line under it ("3. Attic junction box without cover" / "   > Corrected. Cover installed.").
 * An item whose status says it was put right reports no defect any more (common practice in
 * re-inspection reports); "NOT CORRECTED", "PARTIAL", "OPEN" and a status that goes on to say what is
 * still wrong keep it. Item statuses after a leader ("...... CLOSED") are read in item-status.ts.
 */
const CLOSING = String.raw`(?:corrected|resolved|closed|repaired|completed|complete|done|fixed|addressed|cleared)`;
/** A line that opens with a closing status: "> Corrected.", "RESOLVED.", "- Repaired:", "Status: closed". */
const STATUS_OPENING_ANY_CASE = new RegExp(String.raw`^[\s>»→*-]*(?:status\s*:\s*)?(${CLOSING})\b\s*(?:[.:;,!]|-\s|$)`, 'i');
/** The status opens its line as a sentence does (a capital), so a wrapped "... should be / corrected." is no status. */
const STATUS_OPENING = { test: (line: string): boolean => /^[A-Z]/.test(STATUS_OPENING_ANY_CASE.exec(line)?.[1] ?? '') };
/** A status in its own column after a run of spaces, upper case: "... pos. 11        CORRECTED." */
const STATUS_COLUMN = new RegExp(String.raw`\s{3,}(?<!\bNOT\s{0,3})(?:${CLOSING.toUpperCase()})\b(?!\s+IN\s+PART)`);
/** Words of a status that leave part of the item open. */
const STILL_WRONG = /\b(?:still|not\b|partial|partly|remains?|however|but\b|except|open\b|outstanding|pending|recommend|needs?\b)/i;

/** Where an item of a list begins: a number, a letter or label with a number, a bullet, or an "Item N". */
const ITEM_OPENING = /^\s*(?:\d{1,3}[.)]|[A-Z]{1,3}-?\d{1,3}\b|#\s?\d{1,3}\b|item\s+\d{1,3}\b|[-*•]\s)/i;

/** The rest of a status: its own line and the lines after it up to the next item or blank line. */
function statusText(lines: readonly Line[], i: number, from: number): string {
  let text = lines[i].text.slice(from);
  for (let k = i + 1; k < lines.length && lines[k].text.trim() !== '' && !ITEM_OPENING.test(lines[k].text) && !STATUS_OPENING.test(lines[k].text); k++) text += ` ${lines[k].text.trim()}`;
  return text;
}

/** The joined report's item text that a re-inspection status marks as put right. */
export function closedItemLines(joined: string): Range[] {
  if (!new RegExp(CLOSING, 'i').test(joined)) return [];
  const lines = linesOf(joined);
  const closed: Range[] = [];
  lines.forEach((line, i) => {
    const column = STATUS_COLUMN.exec(line.text);
    if (column !== null && column.index > 0 && /[a-z]/i.test(line.text.slice(0, column.index))) {
      const status = statusText(lines, i, column.index);
      if (!STILL_WRONG.test(status.replace(/^\s*\w+/, ''))) closed.push({ start: line.start, end: line.start + column.index });
      return;
    }
    if (i === 0 || !STATUS_OPENING.test(line.text)) return;
    if (STILL_WRONG.test(statusText(lines, i, 0))) return;
    // The item above: back to its opening line (or to a blank line).
    for (let k = i - 1; k >= 0 && lines[k].text.trim() !== '' && !STATUS_OPENING.test(lines[k].text); k--) {
      closed.push({ start: lines[k].start, end: lines[k].start + lines[k].text.length });
      if (ITEM_OPENING.test(lines[k].text)) break;
    }
  });
  return closed;
}
