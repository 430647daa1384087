import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { LineItem, ReportFile, SkippedText } from '@cc/shared';
import { codeLabel } from '../../ui/code-label';
import { Notice } from '../../core/http/notice';
import { IntakeApi } from '../intake-api';
import { ROOM_LABELS } from '../room-labels';

interface Passage {
  readonly key: string;
  readonly reportId: number;
  readonly reportName: string;
  readonly passage: SkippedText & { suggestion: NonNullable<SkippedText['suggestion']> };
}

/**
 * Passages that name electrical things but gave no item ("read but not itemised"), each one click
 * from becoming an item with the reader's suggested finding and room, anchored to the passage.
 */
@Component({
  selector: 'cc-unitemised-text',
  imports: [MatButtonModule, MatIconModule],
  templateUrl: './unitemised-text.html',
  styleUrl: './unitemised-text.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UnitemisedText {
  private readonly api = inject(IntakeApi);
  private readonly notice = inject(Notice);

  readonly requestId = input.required<number>();
  readonly reports = input.required<ReportFile[]>();
  /** The request's items: a passage an item already covers is not listed again. */
  readonly items = input.required<LineItem[]>();
  readonly isEditable = input(true);
  /** An item was added from a passage: the items should be loaded again. */
  readonly added = output<void>();

  protected readonly addingKey = signal<string | null>(null);
  protected readonly passages = computed<Passage[]>(() =>
    this.reports().flatMap((report) =>
      report.skipped
        .filter((p): p is Passage['passage'] => p.reason === 'not-itemised' && p.suggestion !== undefined)
        .filter((p) => !this.items().some((i) => i.reportFileId === report.id && i.evidenceStart !== null && i.evidenceEnd !== null && i.evidenceStart < p.end && p.start < i.evidenceEnd))
        .map((passage) => ({ key: `${report.id}:${passage.start}`, reportId: report.id, reportName: report.originalName, passage })),
    ),
  );
  protected readonly isSeveralReports = computed(() => this.reports().length > 1);

  protected suggestionLabel(p: Passage): string {
    return `${codeLabel(p.passage.suggestion.code)}, ${ROOM_LABELS[p.passage.suggestion.room]}`;
  }

  protected add(p: Passage): void {
    this.addingKey.set(p.key);
    const { suggestion, start, end } = p.passage;
    this.api
      .add(this.requestId(), { code: suggestion.code, room: suggestion.room, reportFileId: p.reportId, evidenceStart: start, evidenceEnd: end })
      .subscribe({
        next: () => {
          this.addingKey.set(null);
          this.notice.success(`Added “${codeLabel(suggestion.code)}”. Change it in the list if the reader guessed wrong.`);
          this.added.emit();
        },
        error: (err: unknown) => {
          this.addingKey.set(null);
          this.notice.failure(err);
        },
      });
  }
}
