import { ChangeDetectionStrategy, Component, computed, inject, signal, viewChild } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTabsModule } from '@angular/material/tabs';
import { ContractorRateBook } from '@cc/shared';
import { catchError, map, of, switchMap } from 'rxjs';
import { describeFailure } from '../../core/http/api-error-of';
import { AddersTable } from '../adders-table/adders-table';
import { ChangeLog } from '../change-log/change-log';
import { CsvImport } from '../csv-import/csv-import';
import { EntriesTable } from '../entries-table/entries-table';
import { RateBookApi } from '../rate-book-api';
import { TermsForm } from '../terms-form/terms-form';

type Loaded = { book: ContractorRateBook; error?: undefined } | { book?: undefined; error: string };

/** The contractor organisation's rate book: terms, entries (with CSV), site conditions and the change log. */
@Component({
  selector: 'cc-rate-book-editor',
  imports: [MatTabsModule, MatProgressBarModule, TermsForm, EntriesTable, AddersTable, CsvImport, ChangeLog],
  templateUrl: './rate-book-editor.html',
  styleUrl: './rate-book-editor.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RateBookEditor {
  private readonly api = inject(RateBookApi);
  private readonly changeLog = viewChild(ChangeLog);

  private readonly reloads = signal(0);
  private readonly loaded = toSignal(
    toObservable(this.reloads).pipe(
      switchMap(() =>
        this.api.get().pipe(
          map((book): Loaded => ({ book })),
          catchError((err: unknown) => of<Loaded>({ error: describeFailure(err) })),
        ),
      ),
    ),
  );
  protected readonly book = computed(() => this.loaded()?.book ?? null);
  protected readonly loadError = computed(() => this.loaded()?.error ?? null);

  /** Reads the rate book (and its change log) again after something was saved. */
  protected reload(): void {
    this.reloads.update((n) => n + 1);
    this.changeLog()?.reload();
  }
}
