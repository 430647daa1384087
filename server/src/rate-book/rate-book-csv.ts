import Papa from 'papaparse';
import {
  CreateRateBookEntrySchema,
  RateBookKeySchema,
  type ApiErrorDetail,
  type EntryPricing,
  type RateBookEntryContent,
} from '@cc/shared';

/*
 * The CSV form of a rate book's entries (docs/rate-book.md): one row per entry, matched by `key` on
 * import. Money in whole cents, time in minutes, shares in basis points, as everywhere in pricing;
 * the columns of the other pricing mode stay empty; `materials` holds the materials list as JSON.
 */

export const RATE_BOOK_CSV_COLUMNS = [
  'key',
  'code',
  'name',
  'unit',
  'mode',
  'labourMinutesPerUnit',
  'materialsCentsPerUnit',
  'markupBp',
  'minutesLow',
  'minutesHigh',
  'firstUnitCents',
  'additionalUnitCents',
  'hardSiteMultiplierBp',
  'materials',
] as const;
type Column = (typeof RATE_BOOK_CSV_COLUMNS)[number];

const TEXT_COLUMNS: readonly Column[] = ['key', 'code', 'name', 'unit', 'mode', 'materials'];
/** Cells holding whole numbers: cents, minutes or basis points. */
const NUMBER_COLUMNS = RATE_BOOK_CSV_COLUMNS.filter((c) => !TEXT_COLUMNS.includes(c));

/** An entry as the CSV carries it. */
export interface CsvEntry extends RateBookEntryContent {
  key: string;
}

/** The content of an entry in one fixed field order, so two entries compare by their JSON. */
export function canonicalContent(entry: RateBookEntryContent): string {
  const p: EntryPricing = entry.pricing;
  const pricing =
    p.mode === 'flat'
      ? [p.mode, p.firstUnitCents, p.additionalUnitCents, p.hardSiteMultiplierBp]
      : [p.mode, p.labourMinutesPerUnit, p.materialsCentsPerUnit, p.markupBp, p.minutesLow, p.minutesHigh, p.materials.map((m) => [m.name, m.quantityPerUnit, m.unitCostCents])];
  return JSON.stringify([entry.code, entry.name, entry.unit, pricing]);
}

function toCells(entry: CsvEntry): Record<Column, string> {
  const p = entry.pricing;
  const isTimed = p.mode === 'time-and-materials';
  const text = (v: number | null | undefined) => (v === null || v === undefined ? '' : String(v));
  return {
    key: entry.key,
    code: entry.code ?? '',
    name: entry.name,
    unit: entry.unit,
    mode: p.mode,
    labourMinutesPerUnit: text(isTimed ? p.labourMinutesPerUnit : null),
    materialsCentsPerUnit: text(isTimed ? p.materialsCentsPerUnit : null),
    markupBp: text(isTimed ? p.markupBp : null),
    minutesLow: text(isTimed ? p.minutesLow : null),
    minutesHigh: text(isTimed ? p.minutesHigh : null),
    firstUnitCents: text(isTimed ? null : p.firstUnitCents),
    additionalUnitCents: text(isTimed ? null : p.additionalUnitCents),
    hardSiteMultiplierBp: text(isTimed ? null : p.hardSiteMultiplierBp),
    materials: isTimed && p.materials.length ? JSON.stringify(p.materials.map((m) => ({ name: m.name, quantityPerUnit: m.quantityPerUnit, unitCostCents: m.unitCostCents }))) : '',
  };
}

export function entriesToCsv(entries: readonly CsvEntry[]): string {
  return Papa.unparse({ fields: [...RATE_BOOK_CSV_COLUMNS], data: entries.map((e) => RATE_BOOK_CSV_COLUMNS.map((c) => toCells(e)[c])) }, { newline: '\n' });
}

/** Where a zod issue of an entry lands in the CSV: its column. */
function columnOf(path: readonly PropertyKey[]): string {
  const [first, second] = path;
  if (first === 'pricing') return second === undefined || second === 'mode' ? 'mode' : String(second);
  return String(first ?? 'row');
}

export type CsvParseResult = { ok: true; entries: CsvEntry[] } | { ok: false; details: ApiErrorDetail[] };

/**
 * Reads entries from CSV text. Rows are numbered from 1 after the header (`rows.3.markupBp` is the
 * markupBp cell of the third entry); every problem of every row is listed, nothing is half-read.
 */
export function parseEntriesCsv(text: string): CsvParseResult {
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: 'greedy', transformHeader: (h) => h.trim() });
  const details: ApiErrorDetail[] = [];
  const header = parsed.meta.fields ?? [];
  const missing = RATE_BOOK_CSV_COLUMNS.filter((c) => !header.includes(c));
  if (missing.length) details.push({ path: 'header', message: `Missing column${missing.length > 1 ? 's' : ''}: ${missing.join(', ')}` });
  const unknown = header.filter((h) => !(RATE_BOOK_CSV_COLUMNS as readonly string[]).includes(h));
  if (unknown.length) details.push({ path: 'header', message: `Unknown column${unknown.length > 1 ? 's' : ''}: ${unknown.join(', ')}` });
  if (details.length) return { ok: false, details };
  for (const error of parsed.errors) {
    if (error.type !== 'FieldMismatch') details.push({ path: error.row === undefined ? 'rows' : `rows.${error.row + 1}`, message: error.message });
  }
  if (parsed.data.length === 0) details.push({ path: 'rows', message: 'The file has no entries' });

  const entries: CsvEntry[] = [];
  const rowOfKey = new Map<string, number>();
  parsed.data.forEach((cells, index) => {
    const row = index + 1;
    const problems: ApiErrorDetail[] = [];
    const at = (column: string, message: string) => problems.push({ path: `rows.${row}.${column}`, message });
    const cell = (c: Column) => (cells[c] ?? '').trim();
    const numbers: Partial<Record<Column, number | null>> = {};
    for (const c of NUMBER_COLUMNS) {
      const value = cell(c);
      if (value === '') numbers[c] = null;
      else if (/^\d+$/.test(value)) numbers[c] = Number(value);
      else at(c, 'Enter a whole number (cents, minutes or basis points)');
    }
    let materials: unknown = [];
    if (cell('materials') !== '') {
      try {
        materials = JSON.parse(cell('materials'));
      } catch {
        at('materials', 'Write the materials list as JSON: [{"name": …, "quantityPerUnit": 1, "unitCostCents": …}]');
      }
    }
    const key = RateBookKeySchema.safeParse(cell('key'));
    if (!key.success) at('key', key.error.issues[0]?.message ?? 'Enter a key');
    else if (rowOfKey.has(key.data)) at('key', `The key "${key.data}" is used in row ${rowOfKey.get(key.data)} already`);
    else rowOfKey.set(key.data, row);

    const mode = cell('mode');
    const required = (c: Column) => numbers[c] ?? undefined;
    const pricing =
      mode === 'flat'
        ? { mode, firstUnitCents: required('firstUnitCents'), additionalUnitCents: required('additionalUnitCents'), hardSiteMultiplierBp: required('hardSiteMultiplierBp') }
        : {
            mode,
            labourMinutesPerUnit: required('labourMinutesPerUnit'),
            materialsCentsPerUnit: required('materialsCentsPerUnit'),
            markupBp: numbers.markupBp ?? null,
            materials,
            minutesLow: required('minutesLow'),
            minutesHigh: required('minutesHigh'),
          };
    const checked = CreateRateBookEntrySchema.safeParse({ code: cell('code') || null, name: cell('name'), unit: cell('unit'), pricing });
    if (!checked.success) {
      for (const issue of checked.error.issues) {
        const column = columnOf(issue.path);
        const message = column === 'mode' && mode !== 'flat' && mode !== 'time-and-materials' ? 'Use "time-and-materials" or "flat"' : issue.message;
        if (!problems.some((p) => p.path === `rows.${row}.${column}`)) at(column, message);
      }
    }
    if (problems.length) details.push(...problems);
    else if (checked.success && key.success) entries.push({ key: key.data, ...checked.data });
  });
  return details.length ? { ok: false, details } : { ok: true, entries };
}
