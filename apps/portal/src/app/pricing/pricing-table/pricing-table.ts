import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { effectiveQuantity, ITEM_STATUS_LABELS, PricingItem, QuoteBreakdown, RateBook } from '@cc/shared';
import { EditionNote } from '../../ui/edition-note/edition-note';
import { MoneyPipe } from '../../ui/money/money';
import { codeLabel } from '../../ui/code-label';
import { lineCentsOf } from '../live-pricing';
import { VisitLabelPipe } from '../visit-label';

/** One row as shown: the item with the names of its entry and conditions and its live line price. */
interface Row {
  item: PricingItem;
  codeLabel: string;
  entryName: string | null;
  adderNames: string[];
  /** The quantity the item is priced at (null: the report said "several" and nobody set one). */
  quantity: number | null;
  lineCents: number | null;
  statusLabel: string;
}

/** The items of a request with their prices, and checkboxes to select many of them at once. */
@Component({
  selector: 'cc-pricing-table',
  imports: [MatTableModule, MatCheckboxModule, MatIconModule, MatTooltipModule, MoneyPipe, VisitLabelPipe, EditionNote],
  templateUrl: './pricing-table.html',
  styleUrl: './pricing-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PricingTable {
  readonly items = input.required<PricingItem[]>();
  readonly rateBook = input.required<RateBook | null>();
  /** The live breakdown the line prices come from. */
  readonly breakdown = input.required<QuoteBreakdown | null>();
  readonly selectedIds = input.required<ReadonlySet<number>>();
  /** Whether the checkboxes are there (the assigned contractor, while the request awaits prices). */
  readonly isSelectable = input(true);
  readonly selectedIdsChange = output<Set<number>>();

  protected readonly columns = computed(() => {
    const columns = ['location', 'code', 'entry', 'quantity', 'adders', 'visit', 'status', 'line'];
    return this.isSelectable() ? ['select', ...columns] : columns;
  });

  protected readonly rows = computed<Row[]>(() => {
    const book = this.rateBook();
    const entries = new Map((book?.entries ?? []).map((e) => [e.id, e.name]));
    const adders = new Map((book?.adders ?? []).map((a) => [a.id, a.name]));
    return this.items().map((item) => ({
      item,
      codeLabel: codeLabel(item.code),
      entryName: item.entryId === null ? null : (entries.get(String(item.entryId)) ?? 'Entry no longer in the rate book'),
      adderNames: item.adderIds.map((id) => adders.get(String(id)) ?? 'Removed condition'),
      quantity: effectiveQuantity(item),
      lineCents: lineCentsOf(this.breakdown(), item.id),
      statusLabel: ITEM_STATUS_LABELS[item.status],
    }));
  });

  protected readonly allSelected = computed(() => this.items().length > 0 && this.items().every((i) => this.selectedIds().has(i.id)));
  protected readonly someSelected = computed(() => !this.allSelected() && this.items().some((i) => this.selectedIds().has(i.id)));

  protected toggle(id: number, isChecked: boolean): void {
    const next = new Set(this.selectedIds());
    if (isChecked) next.add(id);
    else next.delete(id);
    this.selectedIdsChange.emit(next);
  }

  protected toggleAll(isChecked: boolean): void {
    this.selectedIdsChange.emit(isChecked ? new Set(this.items().map((i) => i.id)) : new Set());
  }
}
