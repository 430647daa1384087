import { computed, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { PageEvent } from '@angular/material/paginator';
import type { Page } from '@cc/shared';
import { catchError, Observable, of, switchMap, tap } from 'rxjs';

export interface PageRequest {
  page: number;
  pageSize: number;
}

/**
 * State of a server-paged list: page signals for a mat-paginator, the current page's items, and a
 * reload after something was added. Call it in an injection context (a field initialiser).
 */
export function pagedList<T>(load: (request: PageRequest) => Observable<Page<T>>, onError: (err: unknown) => void) {
  const pageIndex = signal(0);
  const pageSize = signal(20);
  const version = signal(0);
  const isLoading = signal(true);
  const request = computed(() => ({ page: pageIndex(), pageSize: pageSize(), version: version() }));
  const result = toSignal(
    toObservable(request).pipe(
      tap(() => isLoading.set(true)),
      switchMap(({ page, pageSize: size }) =>
        load({ page, pageSize: size }).pipe(
          catchError((err: unknown) => {
            onError(err);
            return of(null);
          }),
        ),
      ),
      tap(() => isLoading.set(false)),
    ),
  );
  return {
    pageIndex: pageIndex.asReadonly(),
    pageSize: pageSize.asReadonly(),
    isLoading: isLoading.asReadonly(),
    items: computed<T[]>(() => result()?.items ?? []),
    total: computed(() => result()?.total ?? 0),
    changePage(event: PageEvent): void {
      pageSize.set(event.pageSize);
      pageIndex.set(event.pageIndex);
    },
    reload(): void {
      version.update((v) => v + 1);
    },
  };
}
