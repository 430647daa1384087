import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MoneyTotals, QuoteBreakdown } from '@cc/shared';
import { MoneyPipe } from '../../ui/money/money';
import { VisitLabelPipe } from '../visit-label';

interface TotalsRow {
  label: string;
  field: keyof MoneyTotals;
}

/** The rows of a price, in the order a reader adds them up; rows of 0 are left out except the totals. */
const ROWS: TotalsRow[] = [
  { label: 'Service call', field: 'serviceCallCents' },
  { label: 'First-hour minimum', field: 'firstHourMinimumCents' },
  { label: 'Labour after the first hour', field: 'extraLabourCents' },
  { label: 'Flat-rate entries', field: 'flatCents' },
  { label: 'Materials', field: 'materialsCostCents' },
  { label: 'Materials markup', field: 'materialsMarkupCents' },
  { label: 'Permit', field: 'permitCents' },
  { label: 'Subtotal', field: 'subtotalCents' },
  { label: 'Sales tax on materials', field: 'materialsTaxCents' },
];
const ALWAYS: (keyof MoneyTotals)[] = ['subtotalCents', 'materialsTaxCents'];

/** A row's words; labour after the first hour says its minutes and, when they were rounded up, the minutes billed. */
function labelOf(row: TotalsRow, visit: QuoteBreakdown['visits'][number]): string {
  if (row.field !== 'extraLabourCents') return row.label;
  return visit.billedExtraMinutes === visit.extraMinutes
    ? `${row.label} (${visit.extraMinutes} min)`
    : `${row.label} (${visit.extraMinutes} min, billed as ${visit.billedExtraMinutes})`;
}

/** The money of a priced request or quote: each visit and the whole, as the shared engine computed it. */
@Component({
  selector: 'cc-pricing-totals',
  imports: [MoneyPipe, VisitLabelPipe],
  templateUrl: './pricing-totals.html',
  styleUrl: './pricing-totals.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PricingTotals {
  readonly breakdown = input.required<QuoteBreakdown | null>();
  /** Share of the total due as deposit on a card payment (basis points), to name it. */
  readonly cardDepositBp = input<number | null>(null);
  /** Whether the figures are a preview of a change not applied yet. */
  readonly isPreview = input(false);

  protected readonly visits = computed(() =>
    (this.breakdown()?.visits ?? []).map((visit) => ({
      key: visit.key,
      minutes: visit.pooledMinutes,
      rows: ROWS.filter((row) => ALWAYS.includes(row.field) || visit[row.field] > 0).map((row) => ({ ...row, label: labelOf(row, visit), cents: visit[row.field] })),
      totalCents: visit.totalCents,
    })),
  );
  protected readonly depositPercent = computed(() => {
    const bp = this.cardDepositBp();
    return bp === null ? null : (bp / 100).toLocaleString('en-US', { maximumFractionDigits: 2 });
  });
}
