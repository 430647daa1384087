import Papa from 'papaparse';
import { DEMO_RATE_BOOK } from '@cc/shared';
import { canonicalContent, entriesToCsv, parseEntriesCsv, RATE_BOOK_CSV_COLUMNS, type CsvEntry } from '../../server/src/rate-book/rate-book-csv';

const demoEntries: CsvEntry[] = DEMO_RATE_BOOK.entries.map(({ id, ...content }) => ({ key: id, ...content }));

function parsedOrFail(text: string): CsvEntry[] {
  const result = parseEntriesCsv(text);
  if (!result.ok) throw new Error(JSON.stringify(result.details));
  return result.entries;
}

/** Rewrites one cell of the demo CSV (row counted from 1 after the header). */
function withCell(row: number, column: string, value: string): string {
  const table = Papa.parse<string[]>(entriesToCsv(demoEntries), { skipEmptyLines: true }).data;
  table[row][table[0].indexOf(column)] = value;
  return Papa.unparse(table, { newline: '\n' });
}

describe('rate-book CSV', () => {
  describe('entriesToCsv → parseEntriesCsv', () => {
    it('gives back every entry of the demo rate book unchanged, both pricing modes and custom entries', () => {
      const back = parsedOrFail(entriesToCsv(demoEntries));
      expect(back.map((e) => e.key)).toEqual(demoEntries.map((e) => e.key));
      expect(back.map(canonicalContent)).toEqual(demoEntries.map(canonicalContent));
      expect(back.some((e) => e.pricing.mode === 'flat')).toBe(true);
      expect(back.find((e) => e.key === 'custom-doorbell')?.code).toBeNull();
    });

    it('writes the header in the documented column order', () => {
      expect(entriesToCsv(demoEntries).split('\n')[0]).toBe(RATE_BOOK_CSV_COLUMNS.join(','));
    });

    it('keeps names with commas, quotes and line breaks intact (RFC 4180 quoting by papaparse)', () => {
      const tricky: CsvEntry = { ...demoEntries[0], key: 'tricky', name: 'Install "GFCI", first device\nof the run' };
      const csv = entriesToCsv([tricky]);
      expect(csv).toContain('"Install ""GFCI"", first device\nof the run"');
      expect(parsedOrFail(csv)[0].name).toBe(tricky.name);
    });

    it('reads a byte-order mark and trailing blank lines as a spreadsheet writes them', () => {
      expect(parsedOrFail(`\uFEFF${entriesToCsv(demoEntries)}\n\n`)).toHaveLength(demoEntries.length);
    });
  });

  describe('parseEntriesCsv with problems', () => {
    it('names the row and column of a cell that is not a whole number', () => {
      const result = parseEntriesCsv(withCell(3, 'labourMinutesPerUnit', 'ten'));
      expect(result).toEqual({ ok: false, details: [{ path: 'rows.3.labourMinutesPerUnit', message: expect.stringContaining('whole number') }] });
    });

    it('lists the problems of several rows at once and reads none of them', () => {
      const text = withCell(1, 'mode', 'hourly').split('\n');
      const second = Papa.parse<string[]>(text[2]).data[0];
      second[RATE_BOOK_CSV_COLUMNS.indexOf('minutesLow')] = '99';
      text[2] = Papa.unparse([second]);
      const result = parseEntriesCsv(text.join('\n'));
      expect(result.ok).toBe(false);
      if (result.ok) return;
      expect(result.details.map((d) => d.path)).toEqual(['rows.1.mode', 'rows.2.minutesLow']);
      // The engine's own rule (docs/pricing.md 1.1: minutesLow ≤ minutesHigh) is the message of row 2.
      expect(result.details[1].message).toBe('Easy-site minutes exceed hard-site minutes');
    });

    it('refuses a materials list that does not add up to the materials cost', () => {
      const result = parseEntriesCsv(withCell(1, 'materialsCentsPerUnit', '2500'));
      expect(result).toEqual({ ok: false, details: [{ path: 'rows.1.materialsCentsPerUnit', message: 'Materials list adds up to 2400 cents, not 2500' }] });
    });

    it('refuses a materials cell that is not JSON', () => {
      const result = parseEntriesCsv(withCell(1, 'materials', 'GFCI x1'));
      expect(result.ok === false && result.details[0].path).toBe('rows.1.materials');
    });

    it('refuses a key used twice, naming the first row', () => {
      const result = parseEntriesCsv(withCell(2, 'key', demoEntries[0].key));
      expect(result).toEqual({ ok: false, details: [{ path: 'rows.2.key', message: `The key "${demoEntries[0].key}" is used in row 1 already` }] });
    });

    it('refuses a file without the documented columns', () => {
      const result = parseEntriesCsv('key,name\nx,Y\n');
      expect(result.ok === false && result.details[0]).toEqual({ path: 'header', message: expect.stringMatching(/^Missing columns: code, unit, mode/) });
    });

    it('refuses a file with a header only', () => {
      expect(parseEntriesCsv(`${RATE_BOOK_CSV_COLUMNS.join(',')}\n`)).toEqual({ ok: false, details: [{ path: 'rows', message: 'The file has no entries' }] });
    });
  });
});
