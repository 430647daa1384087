import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { LineItem, mayAct, RepairRequestDetail, ReportFile, requestMove, statesAllowing, UploadResult } from '@cc/shared';
import { catchError, forkJoin, map, of, switchMap } from 'rxjs';
import { Auth } from '../../core/auth/auth';
import { Notice } from '../../core/http/notice';
import { IntakeApi } from '../intake-api';
import { ItemReview } from '../item-review/item-review';
import { LineItemList } from '../line-item-list/line-item-list';
import { ParseSummary } from '../parse-summary/parse-summary';
import { ReportUpload } from '../report-upload/report-upload';
import { SkippedText } from '../skipped-text/skipped-text';
import { ReportFiles } from '../report-files/report-files';

interface Loaded {
  reports: ReportFile[];
  items: LineItem[];
}

/**
 * The line items of a request: while the report is being taken in, its upload and the agent's
 * review; afterwards the confirmed items, read-only, for every party.
 */
@Component({
  selector: 'cc-intake-panel',
  imports: [MatProgressBarModule, ReportUpload, ParseSummary, ItemReview, LineItemList, SkippedText, ReportFiles],
  templateUrl: './intake-panel.html',
  styleUrl: './intake-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class IntakePanel {
  private readonly api = inject(IntakeApi);
  private readonly auth = inject(Auth);
  private readonly notice = inject(Notice);

  readonly request = input.required<RepairRequestDetail>();
  /** The request itself changed on the server (its state moved on): load it again. */
  readonly requestChanged = output<void>();

  /** Whether the report is still being taken in (the flow table's states for adding it). */
  protected readonly isIntake = computed(() => statesAllowing('upload-report').includes(this.request().status));
  private readonly actors = computed(() => this.auth.actorsOn(this.request()));
  /** Whether the signed-in person may add the report (agents, inspector, admin) right now. */
  protected readonly canUpload = computed(() => mayAct(this.actors(), 'upload-report', this.request().status));
  /** Whether the signed-in person reviews the items (the agents, admin) right now. */
  protected readonly canReview = computed(() => mayAct(this.actors(), 'review-items', this.request().status));

  private readonly reloads = signal(0);
  /** Loads again when asked, and when the request's state changes. */
  private readonly source = computed(() => `${this.request().id}:${this.request().status}:${this.reloads()}`);
  private readonly loaded = toSignal(
    toObservable(this.source).pipe(
      switchMap((key) => {
        const id = this.request().id;
        return forkJoin({ reports: this.api.reports(id), items: this.api.items(id) }).pipe(
          map((value): (Loaded & { key: string }) | null => ({ ...value, key })),
          catchError((err: unknown) => {
            this.notice.failure(err);
            return of(null);
          }),
        );
      }),
    ),
  );
  /** What was loaded for the current request state; nothing while a newer load is on its way. */
  private readonly current = computed(() => {
    const loaded = this.loaded();
    return loaded && loaded.key === this.source() ? loaded : null;
  });
  protected readonly isLoading = computed(() => this.loaded() === undefined || (this.loaded() !== null && this.current() === null));
  protected readonly reports = computed(() => this.current()?.reports ?? []);
  protected readonly items = computed(() => this.current()?.items ?? []);
  protected readonly lastResult = signal<UploadResult | null>(null);

  protected reload(): void {
    this.reloads.update((n) => n + 1);
  }

  protected showResult(result: UploadResult): void {
    this.lastResult.set(result);
    this.reload();
    // The first report moves the request on (into intake): load the request again.
    if (requestMove('add-report', this.request().status)) this.requestChanged.emit();
  }

  protected finishReview(): void {
    this.lastResult.set(null);
    this.requestChanged.emit();
  }
}
