import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, effect, inject, input, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatChipsModule } from '@angular/material/chips';
import { ACTIVITY_KIND_LABELS, ACTIVITY_KINDS, ActivityEntry, ActivityKind, ActivityValues } from '@cc/shared';
import { Notice } from '../../core/http/notice';
import { ActivityApi } from '../activity-api';

const PAGE_SIZE = 20;

const FIELD_LABELS: Record<string, string> = {
  status: 'Status',
  quantity: 'Quantity',
  location: 'Where',
  room: 'Room',
  code: 'Finding',
  severity: 'Severity',
  contractor: 'Contractor',
  emailedTo: 'E-mailed to',
  role: 'Part',
  email: 'E-mail',
};

export interface FieldChange {
  field: string;
  before: string | null;
  after: string;
}

const show = (v: ActivityValues[string] | undefined): string => (v === null || v === undefined || v === '' ? '—' : Array.isArray(v) ? v.join(', ') || '—' : String(v));

/** The fields an entry changed, in words: “Quantity: 1 → 3”. */
export function changesOf(entry: ActivityEntry): FieldChange[] {
  const after = entry.after ?? {};
  return Object.keys(after).map((key) => ({
    field: FIELD_LABELS[key] ?? key,
    before: entry.before && key in entry.before ? show(entry.before[key]) : null,
    after: show(after[key]),
  }));
}

/** Every change to a request and its items (who, what, when, before and after), newest first, filterable by kind. */
@Component({
  selector: 'cc-activity-timeline',
  imports: [DatePipe, MatButtonModule, MatChipsModule],
  templateUrl: './activity-timeline.html',
  styleUrl: './activity-timeline.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ActivityTimeline {
  private readonly api = inject(ActivityApi);
  private readonly notice = inject(Notice);

  readonly requestId = input.required<number>();
  /** Changes whenever the request changed, so the timeline is read again. */
  readonly revision = input<string>('');

  protected readonly kinds = ACTIVITY_KINDS;
  protected readonly kindLabels = ACTIVITY_KIND_LABELS;
  protected readonly chosen = signal<ActivityKind[]>([]);
  protected readonly entries = signal<ActivityEntry[]>([]);
  protected readonly total = signal(0);
  protected readonly isLoading = signal(false);
  protected readonly changesOf = changesOf;
  private page = 0;

  constructor() {
    effect(() => {
      this.requestId();
      this.revision();
      this.chosen();
      untracked(() => this.load(0));
    });
  }

  protected choose(kinds: ActivityKind[] | null): void {
    this.chosen.set(kinds ?? []);
  }

  protected more(): void {
    this.load(this.page + 1);
  }

  private load(page: number): void {
    this.isLoading.set(true);
    this.api.list(this.requestId(), this.chosen(), page, PAGE_SIZE).subscribe({
      next: (result) => {
        this.page = page;
        this.entries.update((list) => (page === 0 ? result.items : [...list, ...result.items]));
        this.total.set(result.total);
        this.isLoading.set(false);
      },
      error: (err: unknown) => {
        this.isLoading.set(false);
        this.notice.failure(err);
      },
    });
  }
}
