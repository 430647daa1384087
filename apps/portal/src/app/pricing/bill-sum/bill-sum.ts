import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { billRows, QuoteBreakdown } from '@cc/shared';
import { MoneyPipe } from '../../ui/money/money';

/**
 * How the item amounts of a price add up to its subtotal: the items, then what is charged once per
 * visit (service calls, labour of site conditions that concern the visit as a whole, permits). The rows
 * come from the shared engine's `billRows`, the same as on the invoice, so they always add up.
 */
@Component({
  selector: 'cc-bill-sum',
  imports: [MoneyPipe],
  template: `
    @if (rows(); as r) {
      <dl class="sum" data-testid="bill-sum" aria-label="How the items add up to the subtotal">
        <dt>Items above</dt>
        <dd data-testid="bill-sum-items">{{ r.itemsCents | money }}</dd>
        @if (r.serviceCallCents) {
          <dt>Service {{ r.visits === 1 ? 'call' : 'calls (' + r.visits + ' visits)' }}</dt>
          <dd>{{ r.serviceCallCents | money }}</dd>
        }
        @if (r.visitConditionsCents) {
          <dt>Site conditions of the visit as a whole</dt>
          <dd data-testid="bill-sum-conditions">{{ r.visitConditionsCents | money }}</dd>
        }
        @if (r.permitCents) {
          <dt>Permit fee and handling</dt>
          <dd>{{ r.permitCents | money }}</dd>
        }
        <dt class="total">Subtotal</dt>
        <dd class="total" data-testid="bill-sum-subtotal">{{ r.subtotalCents | money }}</dd>
      </dl>
    }
  `,
  styles: `
    .sum {
      display: grid;
      grid-template-columns: minmax(0, 1fr) auto;
      gap: 2px 16px;
      max-width: 28rem;
      margin: 8px 0 0 auto;
      font: var(--mat-sys-body-medium);
    }
    dt {
      color: var(--mat-sys-on-surface-variant);
    }
    dd {
      margin: 0;
      text-align: right;
      font-variant-numeric: tabular-nums;
    }
    .total {
      font-weight: 600;
      color: var(--mat-sys-on-surface);
      border-top: 1px solid var(--mat-sys-outline-variant);
      padding-top: 2px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BillSum {
  readonly breakdown = input.required<QuoteBreakdown | null>();

  protected readonly rows = computed(() => {
    const breakdown = this.breakdown();
    if (!breakdown) return null;
    const bill = billRows(breakdown);
    return { ...bill, itemsCents: bill.lines.reduce((sum, l) => sum + l.amountCents, 0), visits: breakdown.visits.length };
  });
}
