import { classifyHeadingLine } from './section-heading';

/**
 * Spreadsheet exports pasted as comma-separated text ("Kitchen,Electrical,Receptacle,"Cracked face",1"):
 * each line is a table row. A line is read as one when it has at least three commas outside quotes
 * and none of them is followed by a space (prose puts a space after its commas).
 */
const MIN_CELLS = 4;

/** The cells of a comma-separated row, or null when the line is not one. */
export function csvCells(line: string): string[] | null {
  const text = line.trim();
  if (!text.includes(',')) return null;
  const cells: string[] = [];
  let cell = '';
  let quoted = false;
  let quotedCells = 0;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (ch === '"') {
      if (quoted && text[i + 1] === '"') {
        cell += '"';
        i++;
      } else {
        quoted = !quoted;
        if (quoted) quotedCells++;
      }
    } else if (ch === ',' && !quoted) {
      if (text[i + 1] === ' ') return null;
      cells.push(cell.trim());
      cell = '';
    } else {
      cell += ch;
    }
  }
  if (quoted) return null;
  cells.push(cell.trim());
  if (cells.length < MIN_CELLS) return null;
  // A header row names its columns in a capitalised word or two each; a data row quotes its longer cells.
  const isHeader = cells.every((c) => /^[A-Z#][\w #./()-]{0,24}$/.test(c));
  return isHeader || quotedCells > 0 ? cells : null;
}

/**
 * A row whose system column names another trade ("Roof - house,Roofing,Shingles,...") and none of
 * whose cells is electrical: its text is that trade's, like a line labelled "Plumbing:".
 */
export function isNonElectricalCsvRow(cells: readonly string[]): boolean {
  let other = false;
  for (const c of cells.slice(0, 4)) {
    if (c.length === 0 || c.length > 30) continue;
    const heading = classifyHeadingLine(c);
    if (heading?.type !== 'heading') continue;
    if (heading.heading.kind === 'electrical') return false;
    if (heading.heading.kind === 'non-electrical') other = true;
  }
  return other;
}
