import { Injectable } from '@angular/core';
import { MatPaginatorIntl } from '@angular/material/paginator';
import type { Page } from '@cc/shared';

const count = new Intl.NumberFormat('en-US');

/** How many rows a paged list has, as its server tells it. */
export interface ListCount {
  /** The exact total, or the cap the server stopped counting at. */
  total: number;
  isTotalCapped: boolean;
  /** The server gave a cursor for the next page: at least one more row follows this page. */
  hasMore: boolean;
  /** This page: its index, size and how many rows it holds. */
  page: number;
  pageSize: number;
  rowCount: number;
}

/** How many rows the list of `page` has, as the page tells it (null before the first page came). */
export function listCountOf(page: Page<unknown> | null | undefined): ListCount | null {
  if (!page) return null;
  return { total: page.total, isTotalCapped: page.isTotalCapped ?? false, hasMore: Boolean(page.nextCursor), page: page.page, pageSize: page.pageSize, rowCount: page.items.length };
}

/**
 * The paginator's length for a list whose server may stop counting at a cap: the total when it is
 * exact; past a capped total, one page more than the current one while pages follow (so "next"
 * stays on), and the exact number once the last page is reached (its rows end the list).
 */
export function paginatorLength(c: ListCount): number {
  if (!c.isTotalCapped) return c.total;
  if (c.hasMore) return Math.max(c.total, (c.page + 2) * c.pageSize);
  return c.page * c.pageSize + c.rowCount;
}

/**
 * Paginator words for lists whose server stops counting at a cap: "1 – 20 of 1,000+", and past the
 * cap "1,001 – 1,020 of 1,020+" (never an exact figure the server did not count); the last page of
 * such a list says its exact total. Provide it on the component that owns the paginator, give it
 * each page's count (`setCount`) and use `paginatorLength` for the paginator's length.
 */
@Injectable()
export class CappedPaginatorIntl extends MatPaginatorIntl {
  /** The figure shown with a "+" while the list's end is not known; null when the length is exact. */
  private atLeast: number | null = null;

  setCount(c: ListCount | null): void {
    const atLeast = c && c.isTotalCapped && c.hasMore ? c.total : null;
    if (atLeast === this.atLeast) return;
    this.atLeast = atLeast;
    this.changes.next();
  }

  override getRangeLabel = (page: number, pageSize: number, length: number): string => {
    if (length === 0 || pageSize === 0) return `0 of ${count.format(length)}`;
    const start = page * pageSize;
    const end = Math.min(start + pageSize, length);
    // More rows follow this page: the list holds more than the larger of the cap and this page's end.
    const of = this.atLeast === null ? count.format(length) : `${count.format(Math.max(this.atLeast, end))}+`;
    return `${count.format(start + 1)} – ${count.format(end)} of ${of}`;
  };
}
