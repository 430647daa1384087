import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, linkedSignal, signal, untracked } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorIntl, MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import {
  REQUEST_STATUS_LABELS,
  REQUEST_STATUSES,
  RepairRequestListQuery,
  RepairRequestSummary,
  RequestSort,
  RequestStatus,
} from '@cc/shared';
import { catchError, debounceTime, distinctUntilChanged, map, of, switchMap, tap } from 'rxjs';
import { Auth } from '../../core/auth/auth';
import { Notice } from '../../core/http/notice';
import { requestListTitle } from '../../core/layout/nav-items';
import { CappedPaginatorIntl, listCountOf, paginatorLength } from '../../ui/capped-paginator-intl';
import { DaysToClosing } from '../../ui/days-to-closing/days-to-closing';
import { StatusChip } from '../../ui/status-chip/status-chip';
import { RequestsApi } from '../requests-api';
import { AtRiskFlag } from '../at-risk-flag/at-risk-flag';

/** Build-year filters: years around which the code's protections changed (GFCI 1975 and 1987, the 2005 edition). */
const BUILT_BEFORE_CHOICES = [1960, 1975, 1987, 2005] as const;
const DEFAULT_SORT: Sort = { active: 'closingDate', direction: 'asc' };

/** The requests the signed-in person takes part in, paged, sorted and filtered on the server. */
@Component({
  selector: 'cc-request-list',
  imports: [
    AtRiskFlag,
    DatePipe,
    ReactiveFormsModule,
    RouterLink,
    MatTableModule,
    MatSortModule,
    MatPaginatorModule,
    MatSelectModule,
    MatFormFieldModule,
    MatInputModule,
    MatIconModule,
    MatButtonModule,
    MatProgressBarModule,
    StatusChip,
    DaysToClosing,
  ],
  providers: [CappedPaginatorIntl, { provide: MatPaginatorIntl, useExisting: CappedPaginatorIntl }],
  templateUrl: './request-list.html',
  styleUrl: './request-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RequestList {
  private readonly api = inject(RequestsApi);
  private readonly router = inject(Router);
  private readonly notice = inject(Notice);
  private readonly auth = inject(Auth);
  private readonly paginatorIntl = inject(CappedPaginatorIntl);

  protected readonly title = computed(() => requestListTitle(this.auth.role()));
  protected readonly canCreate = computed(() => this.auth.role() === 'agent' || this.auth.role() === 'admin');
  protected readonly statuses = REQUEST_STATUSES;
  protected readonly statusLabels = REQUEST_STATUS_LABELS;
  protected readonly columns = ['reference', 'street', 'closingDate', 'status', 'contractor', 'itemCount', 'createdAt'];
  protected readonly pageSizes = [10, 20, 50];

  protected readonly sort = signal<Sort>(DEFAULT_SORT);
  protected readonly pageSize = signal(20);
  protected readonly statusFilter = signal<RequestStatus[]>([]);
  protected readonly builtBeforeChoices = BUILT_BEFORE_CHOICES;
  /** Only houses built before this year; null for any year. */
  protected readonly builtBefore = signal<number | null>(null);
  protected readonly searchControl = new FormControl('', { nonNullable: true });
  private readonly search = toSignal(
    this.searchControl.valueChanges.pipe(
      debounceTime(300),
      map((text) => text.trim()),
      distinctUntilChanged(),
    ),
    { initialValue: '' },
  );
  /** Back to the first page whenever the sort, the filters or the page size change. */
  protected readonly pageIndex = linkedSignal({
    source: () => [this.sort(), this.statusFilter(), this.builtBefore(), this.search(), this.pageSize()] as const,
    computation: () => 0,
  });
  protected readonly isLoading = signal(true);

  /**
   * Keyset paging: the cursor each page of the current list starts after, learnt from the page
   * before it (`nextCursor`); a new sort, filter or page size starts the list again.
   */
  private readonly cursors = linkedSignal({
    source: () => [this.sort(), this.statusFilter(), this.builtBefore(), this.search(), this.pageSize()] as const,
    computation: () => new Map<number, string>(),
  });

  protected readonly query = computed<RepairRequestListQuery>(() => {
    const sort = this.sort().direction ? this.sort() : DEFAULT_SORT;
    const page = this.pageIndex();
    return {
      page,
      pageSize: this.pageSize(),
      sort: sort.active as RequestSort,
      direction: sort.direction || 'asc',
      status: this.statusFilter().join(',') || undefined,
      q: this.search() || undefined,
      builtBefore: this.builtBefore() ?? undefined,
      // Known once the page before was shown; otherwise the server counts `page` pages in.
      after: page > 0 ? untracked(() => this.cursors().get(page)) : undefined,
    };
  });

  private readonly result = toSignal(
    toObservable(this.query).pipe(
      tap(() => this.isLoading.set(true)),
      switchMap((query) =>
        this.api.list(query).pipe(
          catchError((err: unknown) => {
            this.notice.failure(err);
            return of(null);
          }),
        ),
      ),
      tap((page) => {
        this.isLoading.set(false);
        if (page?.nextCursor) untracked(() => this.cursors()).set(page.page + 1, page.nextCursor);
      }),
    ),
  );
  protected readonly rows = computed<RepairRequestSummary[]>(() => this.result()?.items ?? []);
  /**
   * The server stops counting at a cap (1,000; 100 for a search): the paginator then says "of 100+",
   * goes on past the cap while the server gives a cursor for the next page, and tells the exact
   * total on the last page.
   */
  private readonly count = computed(() => listCountOf(this.result()));
  protected readonly length = computed(() => {
    const count = this.count();
    return count ? paginatorLength(count) : 0;
  });
  private readonly showsCount = effect(() => this.paginatorIntl.setCount(this.count()));
  protected readonly isFiltered = computed(() => this.statusFilter().length > 0 || this.builtBefore() !== null || this.search() !== '');

  protected changeSort(sort: Sort): void {
    this.sort.set(sort);
  }

  protected changePage(event: PageEvent): void {
    this.pageSize.set(event.pageSize);
    this.pageIndex.set(event.pageIndex);
  }

  protected filterByStatus(statuses: RequestStatus[]): void {
    this.statusFilter.set(statuses);
  }

  protected filterByBuildYear(year: number | null): void {
    this.builtBefore.set(year);
  }

  protected open(row: RepairRequestSummary): void {
    void this.router.navigate(['/requests', row.id]);
  }
}
