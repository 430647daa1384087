import Papa from 'papaparse';
import type { PeriodEconomics } from '@cc/shared';
import { neutraliseCell } from '../rate-book/rate-book-csv';

const COLUMNS = [
  'date',
  'electrician',
  'request',
  'street',
  'corrected_items',
  'billed_cents',
  'materials_cost_cents',
  'earnings_cents',
  'on_site_minutes',
  'drive_minutes',
  'per_on_site_hour_cents',
  'per_paid_hour_cents',
] as const;

/** The period's visits, one row each, amounts in cents; text cells neutralised against spreadsheet formulas. */
export function periodToCsv(period: PeriodEconomics): string {
  const n = (v: number | null) => (v === null ? '' : String(v));
  return Papa.unparse(
    {
      fields: [...COLUMNS],
      data: period.visits.map((v) => [
        v.date,
        neutraliseCell(v.electrician.name),
        v.reference,
        neutraliseCell(v.street),
        String(v.correctedCount),
        String(v.billedCents),
        String(v.materialsCostCents),
        String(v.earningsCents),
        n(v.onSiteMinutes),
        n(v.driveMinutes),
        n(v.perOnSiteHourCents),
        n(v.perPaidHourCents),
      ]),
    },
    { newline: '\n' },
  );
}
