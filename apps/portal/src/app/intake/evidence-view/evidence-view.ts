import { afterRenderEffect, ChangeDetectionStrategy, Component, computed, ElementRef, input, output, viewChild } from '@angular/core';
import { LineItem, ReportText } from '@cc/shared';
import { reportSegments } from './report-segments';
import { selectionOffsets, TextSelection } from './selection-offsets';

/**
 * A report's extracted text, page by page, with each item's evidence highlighted. Clicking a
 * highlight picks its item; selecting text offers it as the evidence of a new item.
 */
@Component({
  selector: 'cc-evidence-view',
  templateUrl: './evidence-view.html',
  styleUrl: './evidence-view.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EvidenceView {
  /** The report's pages (its id ties items' evidence to it). */
  readonly report = input.required<ReportText>();
  readonly items = input.required<LineItem[]>();
  readonly activeItemId = input<number | null>(null);
  /** The item whose highlight was clicked. */
  readonly itemPicked = output<number>();
  /** The text the person selected (offsets into the joined text), or null when the selection went. */
  readonly textSelected = output<TextSelection | null>();

  private readonly text = viewChild.required<ElementRef<HTMLElement>>('text');

  private readonly joined = computed(() => this.report().pages.join('\f'));
  protected readonly pages = computed(() => {
    const reportId = this.report().id;
    const ranges = this.items()
      .filter((i) => i.reportFileId === reportId && i.evidenceStart !== null && i.evidenceEnd !== null)
      .map((i) => ({ id: i.id, start: i.evidenceStart!, end: i.evidenceEnd! }));
    return reportSegments(this.report().pages, ranges);
  });

  constructor() {
    // Brings the picked item's evidence into view once it is drawn.
    afterRenderEffect(() => {
      if (this.activeItemId() === null) return;
      this.pages();
      const mark = this.text().nativeElement.querySelector<HTMLElement>('mark.is-active');
      mark?.scrollIntoView?.({ block: 'nearest', behavior: 'smooth' });
    });
  }

  protected isActive(itemIds: readonly number[]): boolean {
    const active = this.activeItemId();
    return active !== null && itemIds.includes(active);
  }

  protected pick(itemIds: readonly number[]): void {
    const active = this.activeItemId();
    // A click on overlapping evidence moves on to the next item that covers it.
    const next = active !== null && itemIds.includes(active) ? itemIds[(itemIds.indexOf(active) + 1) % itemIds.length] : itemIds[0];
    this.itemPicked.emit(next);
  }

  protected readSelection(): void {
    const root = this.text().nativeElement;
    this.textSelected.emit(selectionOffsets(root, root.ownerDocument.getSelection(), this.joined()));
  }
}
