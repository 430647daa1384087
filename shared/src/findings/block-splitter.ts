import { csvCells, isNonElectricalCsvRow } from './csv-row';
import type { SectionKind } from './finding.schema';
import { MappedTextBuilder, sourceRange, type MappedText } from './mapped-text';
import type { Room } from './room';
import { scanAll } from './regex-scan';
import { classifyHeadingLine, inlineNonElectricalLabel, SUMMARY_HEADING } from './section-heading';
import { lineItemMarker } from './line-items';

/**
 * Cuts the joined report text (pages joined with "\f") into sections and blocks. A block is one
 * numbered item, one bullet, or one paragraph; it ends at a blank line, a heading or the next item
 * marker, but not at a page break, so a sentence can run from one page to the next. Running page
 * headers and footers ("Page 3 of 9", "-- 1 of 2 --") are left out of the text that is matched.
 */
export interface Section {
  readonly kind: SectionKind;
  /** The heading as written, or null before the first heading. */
  readonly title: string | null;
  readonly room: Room | null;
}

export interface Block {
  readonly section: Section;
  readonly text: MappedText;
  /** Counts a table's quantity column gives its rows (source offsets of each row). */
  readonly rowCounts?: readonly RowCount[];
}

/** The count a quantity column ("Qty", "Count") gives one table row, by the row's source offsets. */
export interface RowCount {
  readonly start: number;
  readonly end: number;
  /** null for a row that only carries an item number. */
  readonly count: number | null;
  /** End of the row's leading item number ("7 | Basement | ..."), which is an index, not a count. */
  readonly itemNumberEnd?: number;
}

/** A table's quantity column heading. */
const QUANTITY_HEADING = /^(?:qty\.?|quantity|count|no\.|#|number|units?)$/i;
const ITEM_NUMBER_HEADING = /^(?:no\.|#|number)$/i;

/** The cells of a table row (pipes, tabs or fixed-width columns), or null for a line that is no row. */
function tableCells(line: Line): string[] | null {
  const trimmed = line.text.trim();
  let cells: string[];
  if (trimmed.includes('|')) cells = trimmed.replace(/^\|/, '').replace(/\|$/, '').split('|');
  else if (trimmed.includes('\t')) cells = trimmed.split('\t');
  else if (trimmed.includes('   ') && /\S {3,}\S/.test(trimmed)) cells = trimmed.split(/ {3,}/);
  else return csvCellsOf(line);
  cells = cells.map((c) => c.trim());
  return cells.length >= 3 ? cells : null;
}

interface Line {
  readonly start: number;
  readonly end: number;
  readonly text: string;
  /** csvCells of the text and isTableRow of it, each worked out once per line when first asked. */
  csv?: string[] | null;
  tableRow?: boolean;
}

/** csvCells of a line's text (the same for the text and its trimmed copy), read once per line. */
function csvCellsOf(line: Line): string[] | null {
  if (line.csv === undefined) line.csv = csvCells(line.text);
  return line.csv;
}

/** isTableRow of a line's text, read once per line. */
function isTableRowLine(line: Line): boolean {
  if (line.tableRow === undefined) line.tableRow = isTableRow(line.text, line);
  return line.tableRow;
}

const ITEM_MARKER = /^\s*(?:\d{1,3}(?:\.\d{1,3})+\.?|\d{1,3}[.)]|[a-h][.)]|item\s+\d{1,3}\s*[:.)-]|\[\d{1,3}\]|\[\s*(?:photos?|pics?|images?|img|fig\.?|figure)\s*#?\s*\d{1,3}[a-z]?\s*\]|(?:photos?|pics?|images?|img)\s*#?\s*\d{1,3}[a-z]?\s*[:.)-]|[a-z]{1,3}[-.]\d{1,3}[.):]?|#\d{1,3}(?![\d.]|\s*(?:awg|ga\b|gauge|cu\b|al\b|copper|alum|wires?\b|conductors?\b|thhn|nm\b|solid|strand))|[-•*‣▪◦●·–—>]|(?:\[\s?[x ]?\]\s*){1,6})\s+/i;
const NOISE_LINE = /^(?:[|+:=\s-]{3,}|.{0,80}\bpage\s+\d+(?:\s*(?:of|\/)\s*\d+)?|-{1,2}\s*\d+\s+of\s+\d+\s*-{1,2}|\d+\s*\/\s*\d+)\s*$/i;
const CONNECTOR_END = /(?:[,;&/-]|\b(?:and|or|the|a|an|at|of|to|with|in|on|for|by|from|is|are|was|were|not|no))$/i;
/** A checklist line that ends in its answer ("GFCI at exterior: No"). */
const CHECKLIST_ANSWER = /^[^.!?]{0,40}:\s*(?:yes|no|none|n\/a|ok|missing)$/i;
const SHORT_LINE = 45;
/** A line counts as short against the report's own measure: narrow columns make every line shorter. */
const SHORT_SHARE = 0.75;

/** The length below which a line is short in this report: 45 characters, less for narrow columns. */
function shortLineFor(lines: readonly Line[]): number {
  const lengths = lines.map((l) => l.text.trim().length).filter((n) => n >= 20).sort((a, b) => a - b);
  if (lengths.length < 8) return SHORT_LINE;
  const typical = lengths[Math.floor(lengths.length * 0.75)];
  return Math.min(SHORT_LINE, Math.round(typical * SHORT_SHARE));
}
const LINE_BREAK = /\r?\n\f|\f\r?\n|\r?\n|\f/g;
const NO_SECTION: Section = { kind: 'none', title: null, room: null };

/** Lines of the joined text; "\n\f" and "\f\n" count as one break (a page ending in a newline is not a blank line). */
function splitLines(joined: string): Line[] {
  const lines: Line[] = [];
  let start = 0;
  for (const m of scanAll(LINE_BREAK, joined)) {
    lines.push({ start, end: m.index, text: joined.slice(start, m.index) });
    start = m.index + m[0].length;
  }
  lines.push({ start, end: joined.length, text: joined.slice(start) });
  return lines;
}

export function splitBlocks(joined: string): Block[] {
  const blocks: Block[] = [];
  let section = NO_SECTION;
  let builder = null as MappedTextBuilder | null;
  let blockSection = section;
  let prevLine = null as Line | null;

  const close = () => {
    if (builder) {
      const text = builder.build();
      if (text.text.length > 0) blocks.push({ section: blockSection, text });
    }
    builder = null;
    prevLine = null;
  };
  const open = (line: Line, from: number, owner: Section) => {
    close();
    builder = new MappedTextBuilder();
    blockSection = owner;
    builder.appendSource(joined, from, line.end);
    prevLine = line;
  };

  // Numbered headings that named a room, most recent first.
  const numbered: Array<{ readonly number: string; readonly room: Room }> = [];
  // A summary whose items stand under topic headings of their own ("REPORT SUMMARY" then
  // "ELECTRICAL"): the summary, its topic titles so far, and whether an item of its own has come since its heading.
  let summary: { readonly title: string; readonly topics: Set<string>; hasTopics: boolean; hasContent: boolean } | null = null;
  // The quantity column of the table being read ("Item | Location | Qty | Condition"), and the rows' counts.
  let quantityColumn: number | null = null;
  const rowCounts: RowCount[] = [];
  const lines = withoutQuoteMarks(splitLines(joined));
  const shortLine = shortLineFor(lines);
  for (const [index, line] of lines.entries()) {
    const content = line.text.trim();
    const cells = content.length > 0 ? tableCells(line) : null;
    const isNoise = content.length > 0 && NOISE_LINE.test(content);
    if (cells) {
      // "No." or "#" heading the first column numbers the rows ("7 | Basement | ..."): an item number, not a count.
      const heading = cells.findIndex((c, k) => QUANTITY_HEADING.test(c) && !(k === 0 && ITEM_NUMBER_HEADING.test(c)));
      if (heading !== -1) quantityColumn = heading;
      else if (quantityColumn !== null && /^\d{1,2}$/.test(cells[quantityColumn] ?? '') && Number(cells[quantityColumn]) > 0) {
        rowCounts.push({ start: line.start, end: line.end, count: Number(cells[quantityColumn]) });
      } else if (quantityColumn !== 0 && /^\d{1,3}[.)]?$/.test(cells[0])) {
        rowCounts.push({ start: line.start, end: line.end, count: null, itemNumberEnd: line.start + line.text.indexOf(cells[0]) + cells[0].length });
      }
    } else if (content.length > 0 && !isNoise && !/^\s{8,}\S/.test(line.text) && !content.includes('|')) {
      // (A line with a column rule but too few cells is a pipe row wrapped by a narrow page: the table goes on.)
      quantityColumn = null;
    }
    if (content.length === 0) {
      close();
      continue;
    }
    if (isNoise) continue;
    const headingLine = wrapsIntoNextLine(content, lines[index + 1]) ? null : classifyHeadingLine(content);
    if (headingLine) {
      close();
      if (headingLine.type === 'heading') {
        // "6.3 RECEPTACLES" under "6.0 ELECTRICAL - DETACHED GARAGE" is still in the garage.
        const number = HEADING_NUMBER.exec(content)?.[1] ?? null;
        let heading = headingLine.heading;
        const topic = heading.title.toLowerCase();
        if (SUMMARY_HEADING.test(heading.title)) {
          summary = { title: heading.title, topics: new Set(), hasTopics: false, hasContent: false };
        } else if (summary && number === null && (summary.hasTopics || !summary.hasContent) && !summary.topics.has(topic) && !BODY_WORD.test(topic)) {
          // A topic heading right under a summary heading, and its siblings, are still the summary
          // (a numbered heading or a topic named again starts the body).
          summary.topics.add(topic);
          summary.hasTopics = true;
          heading = { ...heading, title: `${heading.title} (${summary.title})` };
        } else {
          summary = null;
        }
        const parent = number !== null ? numbered.find((n) => isSubsection(number, n.number)) : undefined;
        section = heading.room === null && heading.kind !== 'non-electrical' && parent ? { ...heading, room: parent.room } : heading;
        if (number !== null && section.room !== null) numbered.unshift({ number, room: section.room });
      } else if (headingLine.startsBody && section.title !== null && SUMMARY_HEADING.test(section.title)) {
        // "COMMENTS" after the summary: the body starts, and its findings merge with the summary's.
        section = { kind: 'general', title: content.replace(/\s*:$/, ''), room: null };
        summary = null;
      }
      continue;
    }
    const csv = csvCellsOf(line);
    const label = csv && isNonElectricalCsvRow(csv) ? 'non-electrical row' : inlineNonElectricalLabel(content);
    if (label !== null) {
      open(line, line.start, { kind: 'non-electrical', title: label, room: null });
      close();
      continue;
    }
    const marker = ITEM_MARKER.exec(line.text) ?? lineItemMarker(line.text);
    if (marker || !builder || !prevLine) {
      // A note about the summary itself ("This summary is not the entire report") is not one of its items.
      if (summary && !SUMMARY_NOTE.test(content)) summary.hasContent = true;
      open(line, line.start + (marker ? marker[0].length : 0), section);
      continue;
    }
    if (summary && !SUMMARY_NOTE.test(content) && (/[.!?]$/.test(prevLine.text.trim()) || isTableRowLine(line))) summary.hasContent = true;
    joinLine(builder, prevLine, line, shortLine);
    builder.appendSource(joined, line.start, line.end);
    prevLine = line;
  }
  close();
  if (rowCounts.length === 0) return blocks;
  return blocks.map((b) => {
    const { start, end } = sourceRange(b.text);
    const own = rowCounts.filter((r) => r.start < end && start < r.end);
    return own.length > 0 ? { ...b, rowCounts: own } : b;
  });
}

/** A line about the summary itself, not one of its items. */
const SUMMARY_NOTE = /\b(?:summary|report)\b/i;
/** A heading word that opens the report's body ("ELECTRICAL -- DETAILED OBSERVATIONS"). */
const BODY_WORD = /\b(?:detail\w*|observations|findings|body|comments|discussion|narrative)\b/i;

/** The numbering of a heading line ("6.0", "6.3", "7.2.1"). */
const HEADING_NUMBER = /^\s*(?:section\s+)?(\d{1,2}(?:\.\d{1,2})*)\.?\s/i;

/** Whether heading number `child` lies under `parent` ("6.3" under "6.0" or "6", "7.2.1" under "7.2"). */
function isSubsection(child: string, parent: string): boolean {
  const base = parent.replace(/(?:\.0)+$/, '');
  return child !== parent && child.startsWith(`${base}.`);
}

/** Decides whether a line break inside a block is a sentence boundary, a space or a word wrap. */
/** The quote mark an e-mail puts before each line it quotes ("> 4.3 Main Panel: ..."), with one space after it. */
const QUOTE_MARK = /^\s*>[ \t]?/;

/**
 * A forwarded e-mail quotes the report with a ">" before every line, wrapped sentences included: the
 * quoted lines are read as the report's own lines (headings, items and wrapped sentences), without the
 * mark. Only where two quoted lines follow each other and the first does not end its sentence, so a
 * ">" used as a bullet ("> Corrected. New device installed.") stays a bullet.
 */
function withoutQuoteMarks(lines: Line[]): Line[] {
  const quoted = (l: Line | undefined) => l !== undefined && QUOTE_MARK.test(l.text);
  const isQuotation = lines.some((l, i) => quoted(l) && quoted(lines[i + 1]) && !/[.!?]\s*$/.test(l.text) && /\w/.test(lines[i + 1].text));
  if (!isQuotation) return lines;
  return lines.map((l) => {
    const mark = QUOTE_MARK.exec(l.text);
    return mark === null ? l : { start: l.start + mark[0].length, end: l.end, text: l.text.slice(mark[0].length) };
  });
}

/**
 * Twelfth round: "- The receptacle on the equipment" / "pad post is not GFCI protected": a line that
 * opens like a sentence (an article or a count, then a lower-case word) and goes on in lower case on
 * the next line is wrapped prose, not a heading, even when every word of it is a heading word.
 */
const SENTENCE_OPENING = /^(?:[-•*]\s+)?(?:The|A|An|This|That|One|Two|Three|Some|All|Both)\s+\p{Ll}/u;
function wrapsIntoNextLine(content: string, next: Line | undefined): boolean {
  return next !== undefined && SENTENCE_OPENING.test(content) && /^\p{Ll}/u.test(next.text.trim());
}

function joinLine(builder: MappedTextBuilder, prev: Line, next: Line, shortLine: number): void {
  const before = prev.text.trim();
  const after = next.text.trim();
  if (/\p{L}-$/u.test(before) && /^\p{Ll}/u.test(after)) {
    builder.dropTrailingHyphen();
    return;
  }
  const breakAt = prev.end;
  // A table cell wrapped onto a deeply indented line of its own ("... missing its" / "cover, splices
  // exposed") goes on with the row.
  // So does a pipe row that a narrow column wrapped mid-cell ("Receptacle | Den | Reversed" /
  // "polarity | Electrician"): the next line goes on in lower case.
  const continuesCell =
    (isTableRowLine(prev) && /^\s{16,}\S/.test(next.text) && !isTableRowLine(next) && !/[.!?:]$/.test(before) && !prev.text.includes('|') && !next.text.includes('\t')) ||
    (prev.text.includes('|') && /^\p{Ll}/u.test(after) && !/[.!?:|]$/.test(before)) ||
    // A pipe row whose first cell is empty goes on with the row above ("3 | Main panel | ... 10 AWG alum." /
    // "  |   | conductors on a 30A 2-pole breaker |").
    (prev.text.includes('|') && (/^\s*\|/.test(prev.text) ? /^\s*\|\s*\|/ : /^\s*\|/).test(next.text));
  const isBoundary =
    !continuesCell &&
    (/:$/.test(before) ||
    CHECKLIST_ANSWER.test(before) ||
    prev.text.includes('\t') ||
    next.text.includes('\t') ||
    isTableRowLine(prev) ||
    isTableRowLine(next) ||
    // A terse note that starts with its own place label ("Kitch: fridge recep loose") is a new sentence.
    /^[\p{Lu}][\p{L}\d./ -]{0,18}:\s/u.test(after) ||
    (before.length < shortLine && !/[.!?]$/.test(before) && !CONNECTOR_END.test(before) && /^[\p{Lu}\d(]/u.test(after)));
  builder.appendSeparator(isBoundary ? '\n' : ' ', breakAt);
}

/** A row of a table export: pipe-separated, or fixed-width columns (runs of 3+ spaces between words). */
function isTableRow(line: string, of?: Line): boolean {
  // The literal each expression needs is looked for first (a plain search is much cheaper).
  return (line.includes('|') && /\S\s*\|\s*\S/.test(line)) || (line.includes('   ') && /\S {3,}\S/.test(line.trim())) || (of ? csvCellsOf(of) : csvCells(line)) !== null;
}
