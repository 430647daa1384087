import { Injectable } from '@angular/core';
import { MatPaginatorIntl } from '@angular/material/paginator';

const count = new Intl.NumberFormat('en-US');

/**
 * Paginator words for lists whose server stops counting at a cap: "1 – 20 of 1,000+" then.
 * Provide it on the component that owns the paginator and set `isCapped` from the page answer.
 */
@Injectable()
export class CappedPaginatorIntl extends MatPaginatorIntl {
  private isCapped = false;

  setCapped(isCapped: boolean): void {
    if (isCapped === this.isCapped) return;
    this.isCapped = isCapped;
    this.changes.next();
  }

  override getRangeLabel = (page: number, pageSize: number, length: number): string => {
    if (length === 0 || pageSize === 0) return `0 of ${count.format(length)}`;
    const start = page * pageSize;
    const end = Math.min(start + pageSize, length);
    return `${count.format(start + 1)} – ${count.format(end)} of ${count.format(length)}${this.isCapped ? '+' : ''}`;
  };
}
