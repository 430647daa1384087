/**
 * Marks of forms that are not statements of a defect: the check boxes of an insurance or
 * underwriting form ("[ ] Knob & tube   [X] Aluminum", "double taps [ ]  exposed wiring [X]") and the
 * legend of a tester sweep or a rated checklist ("OG = open ground", "RP = reversed polarity").
 *
 * - A label whose box is left empty is a hazard the form asks about and the inspector did not find
 *   (common practice in four-point and similar insurance forms): it reports nothing.
 * - A label whose box is checked is the form's summary of a hazard that the form then explains
 *   ("Explain checked items: ..."); it stands only when nothing else in the report names that defect
 *   (it is read as a summary item).
 * - A legend line defines the abbreviations the rows below use; it reports nothing.
 *
 * Offsets are in the joined report text (see report-parser.ts).
 */
export interface Range {
  readonly start: number;
  readonly end: number;
}

export interface FormMarks {
  /** Labels of empty boxes and legend lines: read as if they were not there. */
  readonly denied: Range[];
  /** Labels of checked boxes: summary items of the form. */
  readonly checked: Range[];
}

const BOX = /\[\s?([xX✓✔]?)\s?\]|(☐)|(☒|☑)/g;
/** Text before a line's first box after which the boxes lead their labels ("Wiring type ...... [X] Copper"). */
const LEADS_LABELS = /(?:^|[:?]|\.{2,}|\s[-–—])\s*$/;
const HAS_WORD = /[a-z]/i;
/** One abbreviation defined: "OG = open ground", "DEAD= no power", "NP=Not Present". */
const DEFINITION = /(?:^|\s)[A-Z][A-Z0-9/&]{0,5}\s*=\s*(?![\d$])\S/g;
const LEGEND_LINE = /^\s*(?:(?:legend|key|abbreviations?|codes?)\s*:?\s*)?[A-Z][A-Z0-9/&]{0,5}\s*=\s*(?![\d$])\S/i;

export interface Line {
  readonly start: number;
  readonly text: string;
}

/** The lines of the joined report (page breaks end lines too), each with its offset. */
export function linesOf(joined: string): Line[] {
  const lines: Line[] = [];
  const brk = /\r?\n|\f/g;
  let start = 0;
  for (let m = brk.exec(joined); m !== null; m = brk.exec(joined)) {
    lines.push({ start, text: joined.slice(start, m.index) });
    start = m.index + m[0].length;
  }
  lines.push({ start, text: joined.slice(start) });
  return lines;
}

/** The boxes of one line with their labels, when every box of it has a label of its own (a grid of labelled boxes). */
function gridOf(line: Line, out: FormMarks): void {
  const boxes: Array<{ start: number; end: number; checked: boolean }> = [];
  BOX.lastIndex = 0;
  for (let m = BOX.exec(line.text); m !== null; m = BOX.exec(line.text)) {
    boxes.push({ start: m.index, end: m.index + m[0].length, checked: Boolean(m[1]) || Boolean(m[3]) });
  }
  if (boxes.length < 2) return;
  const prefix = line.text.slice(0, boxes[0].start);
  const leading = LEADS_LABELS.test(prefix);
  const labels = boxes.map((box, i) => {
    if (leading) return { start: box.end, end: i + 1 < boxes.length ? boxes[i + 1].start : line.text.length };
    const from = i === 0 ? prefix.lastIndexOf(':') + 1 : boxes[i - 1].end;
    return { start: from, end: box.start };
  });
  // Columns of boxes with one label for the whole row ("[X][ ][ ][X] B. Branch Circuits") are not a grid.
  if (!labels.every((l) => HAS_WORD.test(line.text.slice(l.start, l.end)))) return;
  boxes.forEach((box, i) => {
    const label = labels[i];
    const range = leading ? { start: box.start, end: label.end } : { start: label.start, end: box.end };
    (box.checked ? out.checked : out.denied).push({ start: line.start + range.start, end: line.start + range.end });
  });
}

/** A line that defines abbreviations, next to another such line or defining two itself. */
function legendLines(lines: readonly Line[], out: FormMarks): void {
  const isLegend = lines.map((l) => LEGEND_LINE.test(l.text));
  lines.forEach((line, i) => {
    if (!isLegend[i]) return;
    const many = (line.text.match(DEFINITION) ?? []).length >= 2;
    if (many || isLegend[i - 1] === true || isLegend[i + 1] === true) out.denied.push({ start: line.start, end: line.start + line.text.length });
  });
}

/** The form marks of a joined report (see FormMarks). */
export function formMarks(joined: string): FormMarks {
  const out: FormMarks = { denied: [], checked: [] };
  if (!/\[\s?[xX✓✔]?\s?\]|[☐☒☑]|=/.test(joined)) return out;
  const lines = linesOf(joined);
  for (const line of lines) if (line.text.includes('[') || /[☐☒☑]/.test(line.text)) gridOf(line, out);
  legendLines(lines, out);
  return out;
}
