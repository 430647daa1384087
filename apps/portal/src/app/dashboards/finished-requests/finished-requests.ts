import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, signal, untracked } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatCardModule } from '@angular/material/card';
import { MatPaginatorIntl, MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { CLOSING_RISK_LABELS, FINAL_STATUSES, RepairRequestListQuery } from '@cc/shared';
import { catchError, of, switchMap } from 'rxjs';
import { Notice } from '../../core/http/notice';
import { RequestsApi } from '../../requests/requests-api';
import { CappedPaginatorIntl, listCountOf, paginatorLength } from '../../ui/capped-paginator-intl';
import { DaysToClosing } from '../../ui/days-to-closing/days-to-closing';
import { StatusChip } from '../../ui/status-chip/status-chip';

/** Cards per page: two rows of the dashboard's grid at desktop width. */
export const FINISHED_PAGE_SIZE = 6;

/**
 * The agent's finished requests (the flow table's final states: corrections accepted, declined,
 * withdrawn), latest closing first, so that they stay findable against their closing dates. One page
 * at a time from the request list (`GET /api/requests`, paged by key in the viewer's status and
 * closing-date index), never a second query of our own.
 */
@Component({
  selector: 'cc-finished-requests',
  imports: [DatePipe, RouterLink, MatCardModule, MatPaginatorModule, MatProgressBarModule, StatusChip, DaysToClosing],
  providers: [CappedPaginatorIntl, { provide: MatPaginatorIntl, useExisting: CappedPaginatorIntl }],
  templateUrl: './finished-requests.html',
  styleUrl: '../dashboard.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FinishedRequests {
  private readonly api = inject(RequestsApi);
  private readonly notice = inject(Notice);
  private readonly paginatorIntl = inject(CappedPaginatorIntl);

  protected readonly finishedLabel = CLOSING_RISK_LABELS.none;
  protected readonly pageSize = FINISHED_PAGE_SIZE;
  protected readonly pageIndex = signal(0);
  /** The cursor each page starts after, learnt from the page before it (`nextCursor`). */
  private readonly cursors = new Map<number, string>();

  private readonly query = computed<RepairRequestListQuery>(() => {
    const page = this.pageIndex();
    return {
      page,
      pageSize: FINISHED_PAGE_SIZE,
      sort: 'closingDate',
      direction: 'desc',
      status: FINAL_STATUSES.join(','),
      after: page > 0 ? this.cursors.get(page) : undefined,
    };
  });

  private readonly result = toSignal(
    toObservable(this.query).pipe(
      switchMap((query) =>
        this.api.list(query).pipe(
          catchError((err: unknown) => {
            this.notice.failure(err);
            return of(null);
          }),
        ),
      ),
    ),
  );
  protected readonly isLoading = computed(() => this.result() === undefined);
  protected readonly rows = computed(() => this.result()?.items ?? []);
  private readonly count = computed(() => listCountOf(this.result()));
  protected readonly length = computed(() => {
    const count = this.count();
    return count ? paginatorLength(count) : 0;
  });

  constructor() {
    effect(() => {
      const page = this.result();
      if (page?.nextCursor) this.cursors.set(page.page + 1, page.nextCursor);
      untracked(() => this.paginatorIntl.setCount(this.count()));
    });
  }

  protected changePage(event: PageEvent): void {
    this.pageIndex.set(event.pageIndex);
  }
}
