import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { RateBookChange } from '@cc/shared';
import { Notice } from '../../core/http/notice';
import { pagedList } from '../../core/http/paged-list';
import { RateBookApi } from '../rate-book-api';

const SUBJECTS: Record<RateBookChange['subject'], string> = { terms: 'Terms', entry: 'Entry', adder: 'Site condition' };
const ACTIONS: Record<RateBookChange['action'], string> = { create: 'added', update: 'changed', delete: 'deleted', import: 'imported' };

/** The name a recorded change is about, from the record after it (or before, for a deletion). */
export function changedRecordName(change: RateBookChange): string {
  for (const record of [change.after, change.before]) {
    if (record && typeof record === 'object' && 'name' in record && typeof record.name === 'string') return record.name;
  }
  return change.subject === 'terms' ? 'Visit terms' : `#${change.subjectId ?? '?'}`;
}

/** Every recorded change of the rate book, newest first: who, when, what. */
@Component({
  selector: 'cc-change-log',
  imports: [DatePipe, MatTableModule, MatPaginatorModule, MatProgressBarModule],
  templateUrl: './change-log.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
  styles: 'table { width: 100%; min-width: 600px; }',
})
export class ChangeLog {
  private readonly api = inject(RateBookApi);
  private readonly notice = inject(Notice);

  protected readonly columns = ['at', 'by', 'what', 'name'];
  protected readonly nameOf = changedRecordName;
  protected readonly list = pagedList<RateBookChange>(
    ({ page, pageSize }) => this.api.changes(page, pageSize),
    (err) => this.notice.failure(err),
  );

  protected describe(change: RateBookChange): string {
    return `${SUBJECTS[change.subject]} ${ACTIONS[change.action]}`;
  }

  /** Reads the log again (after a change was saved). */
  reload(): void {
    this.list.reload();
  }
}
