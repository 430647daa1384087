import { ChangeDetectionStrategy, Component, computed, inject, input, linkedSignal, output, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import { LineItem, ReportFile } from '@cc/shared';
import { Observable } from 'rxjs';
import { Notice } from '../../core/http/notice';
import { askToConfirm } from '../../ui/confirm-dialog/confirm-dialog';
import { EvidenceView } from '../evidence-view/evidence-view';
import { TextSelection } from '../evidence-view/selection-offsets';
import { IntakeApi } from '../intake-api';
import { ItemEditData, ItemEditDialog } from '../item-edit-dialog/item-edit-dialog';
import { isLowConfidence, ItemTable } from '../item-table/item-table';
import { conflictMessage, ReviewOutcome } from '../review-outcome';
import { SplitData, SplitDialog } from '../split-dialog/split-dialog';
import { UnitemisedText } from '../unitemised-text/unitemised-text';

const DIALOG_SIZE = { width: '640px', maxWidth: '95vw' };

const CONFIDENCE_RANK: Record<string, number> = { inferred: 0, composed: 1, normalised: 2, exact: 3 };

/** Stable order: inferred items first, then items read from a device and its condition, then from shorthand, then the rest as listed. */
export function orderByConfidence(items: readonly LineItem[]): LineItem[] {
  const rank = (i: LineItem) => (i.confidence ? CONFIDENCE_RANK[i.confidence] : 4);
  return items.map((item, index) => ({ item, index })).sort((a, b) => rank(a.item) - rank(b.item) || a.index - b.index).map((x) => x.item);
}

/**
 * The agent's review of the proposed items beside the report text: change, remove, merge, split,
 * add from selected text, and confirm. Every change is sent with the version the agent saw.
 */
@Component({
  selector: 'cc-item-review',
  imports: [MatButtonModule, MatIconModule, MatFormFieldModule, MatSelectModule, ItemTable, EvidenceView, UnitemisedText],
  templateUrl: './item-review.html',
  styleUrl: './item-review.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ItemReview {
  private readonly api = inject(IntakeApi);
  private readonly dialog = inject(MatDialog);
  private readonly notice = inject(Notice);

  readonly requestId = input.required<number>();
  readonly items = input.required<LineItem[]>();
  readonly reports = input.required<ReportFile[]>();
  /** Something changed on the server: the items should be loaded again. */
  readonly changed = output<void>();
  /** The review was confirmed; the request has moved on to pricing. */
  readonly confirmed = output<LineItem[]>();

  protected readonly proposed = computed(() => this.items().filter((i) => i.status === 'proposed'));
  /** Items the reader is less sure of come first (inferred, then composed, then read from shorthand), otherwise report order. */
  protected readonly ordered = computed(() => orderByConfidence(this.items()));
  protected readonly lowConfidenceCount = computed(() => this.proposed().filter((i) => isLowConfidence(i.confidence)).length);
  protected readonly activeItemId = signal<number | null>(null);
  /** Ticked items (for a merge); only ids still in the list count. */
  protected readonly selectedIds = linkedSignal<LineItem[], ReadonlySet<number>>({
    source: this.items,
    computation: (items, previous) => new Set(items.map((i) => i.id).filter((id) => previous?.value.has(id))),
  });
  /** The report shown beside the table: the newest unless the person picks another. */
  protected readonly shownReportId = linkedSignal(() => this.reports().at(-1)?.id ?? null);
  protected readonly shownReport = computed(() => this.reports().find((r) => r.id === this.shownReportId()) ?? null);
  /** The shown report's pages, loaded when it is shown (report lists carry no text). */
  protected readonly shownText = rxResource({
    params: () => this.shownReportId() ?? undefined,
    stream: ({ params: reportId }) => this.api.reportText(this.requestId(), reportId),
  });
  protected readonly selection = signal<TextSelection | null>(null);
  protected readonly conflict = signal<string | null>(null);
  protected readonly isBusy = signal(false);
  protected readonly canMerge = computed(() => this.selectedIds().size === 2);

  protected activate(item: LineItem): void {
    this.activeItemId.set(item.id);
    if (item.reportFileId !== null && item.reportFileId !== this.shownReportId()) this.showReport(item.reportFileId);
  }

  protected pickFromText(id: number): void {
    this.activeItemId.set(id);
  }

  protected showReport(id: number): void {
    this.shownReportId.set(id);
    this.selection.set(null);
  }

  protected toggleSelected(id: number): void {
    const next = new Set(this.selectedIds());
    if (!next.delete(id)) next.add(id);
    this.selectedIds.set(next);
  }

  protected edit(item: LineItem): void {
    this.openEditor({ requestId: this.requestId(), item, selection: null });
  }

  protected addFromSelection(): void {
    const selection = this.selection();
    const report = this.shownReport();
    if (!selection || !report) return;
    this.openEditor({ requestId: this.requestId(), item: null, selection: { ...selection, reportFileId: report.id } });
  }

  protected split(item: LineItem): void {
    const ref = this.dialog.open<SplitDialog, SplitData, ReviewOutcome>(SplitDialog, { ...DIALOG_SIZE, data: { requestId: this.requestId(), item } });
    ref.afterClosed().subscribe((outcome) => this.settle(outcome));
  }

  protected remove(item: LineItem): void {
    const message = 'The item leaves the list and is not sent to the contractor. Reading the report again does not bring it back; add it again from the report text if you need it.';
    askToConfirm(this.dialog, { title: 'Remove this item?', message, confirmLabel: 'Remove item' }).subscribe((isSure) => {
      if (isSure) this.send(this.api.remove(this.requestId(), item), () => this.notice.success('Item removed.'));
    });
  }

  /** The first ticked item (in table order) keeps its id and absorbs the second. */
  protected merge(): void {
    const [keep, drop] = this.items().filter((i) => this.selectedIds().has(i.id));
    if (!keep || !drop) return;
    const ref = (i: LineItem) => ({ id: i.id, version: i.version });
    this.send(this.api.merge(this.requestId(), { items: [ref(keep), ref(drop)] }), () => this.notice.success('Items merged.'));
  }

  protected confirm(): void {
    const count = this.proposed().length;
    const what = `${count} ${count === 1 ? 'item' : 'items'}`;
    const message = `The ${what} go to the contractor for prices and can no longer be changed here. Reports cannot be added afterwards.`;
    askToConfirm(this.dialog, { title: `Confirm ${what}?`, message, confirmLabel: `Confirm ${what}` }).subscribe((isSure) => {
      if (isSure) this.sendConfirmation();
    });
  }

  private sendConfirmation(): void {
    const items = this.proposed().map((i) => ({ id: i.id, version: i.version }));
    this.conflict.set(null);
    this.isBusy.set(true);
    this.api.confirm(this.requestId(), { items }).subscribe({
      next: (confirmed) => {
        this.isBusy.set(false);
        this.notice.success(`${confirmed.length} ${confirmed.length === 1 ? 'item' : 'items'} confirmed. The contractor can now price them.`);
        this.confirmed.emit(confirmed);
      },
      error: (err: unknown) => this.fail(err),
    });
  }

  private openEditor(data: ItemEditData): void {
    const ref = this.dialog.open<ItemEditDialog, ItemEditData, ReviewOutcome>(ItemEditDialog, { ...DIALOG_SIZE, data });
    ref.afterClosed().subscribe((outcome) => {
      if (outcome?.kind === 'saved' && !data.item) this.selection.set(null);
      this.settle(outcome);
    });
  }

  /** After a dialog: reload on a kept change, and on a conflict say so and reload too. */
  private settle(outcome: ReviewOutcome | undefined): void {
    if (!outcome) return;
    this.conflict.set(outcome.kind === 'conflict' ? outcome.message : null);
    this.changed.emit();
  }

  private send(request: Observable<unknown>, done: () => void): void {
    this.conflict.set(null);
    this.isBusy.set(true);
    request.subscribe({
      next: () => {
        this.isBusy.set(false);
        done();
        this.changed.emit();
      },
      error: (err: unknown) => this.fail(err),
    });
  }

  private fail(err: unknown): void {
    this.isBusy.set(false);
    const conflict = conflictMessage(err);
    if (conflict) {
      this.conflict.set(conflict);
      this.changed.emit();
    } else {
      this.notice.failure(err);
    }
  }
}
