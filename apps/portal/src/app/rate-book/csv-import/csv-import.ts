import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RateBookImportResult } from '@cc/shared';
import { apiErrorOf, describeFailure } from '../../core/http/api-error-of';
import { RATE_BOOK_CSV_PATH, RateBookApi } from '../rate-book-api';
import { CsvProblem, csvProblems } from './csv-problems';

/** Downloads the entries as CSV and imports a changed file back, listing every row that needs attention. */
@Component({
  selector: 'cc-csv-import',
  imports: [MatButtonModule, MatIconModule],
  templateUrl: './csv-import.html',
  styleUrl: './csv-import.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CsvImport {
  private readonly api = inject(RateBookApi);

  /** Entries were created or changed by an import. */
  readonly imported = output<RateBookImportResult>();

  protected readonly csvPath = RATE_BOOK_CSV_PATH;
  protected readonly result = signal<RateBookImportResult | null>(null);
  protected readonly failure = signal<string | null>(null);
  protected readonly problems = signal<CsvProblem[]>([]);
  protected readonly isBusy = signal(false);

  protected upload(input: HTMLInputElement): void {
    const file = input.files?.[0];
    if (!file) return;
    this.result.set(null);
    this.failure.set(null);
    this.problems.set([]);
    this.isBusy.set(true);
    this.api.importCsv(file).subscribe({
      next: (result) => {
        this.isBusy.set(false);
        input.value = '';
        this.result.set(result);
        this.imported.emit(result);
      },
      error: (err: unknown) => {
        this.isBusy.set(false);
        input.value = '';
        const body = apiErrorOf(err);
        this.failure.set(body?.error ?? describeFailure(err));
        if (err instanceof HttpErrorResponse && err.status === 400 && body) this.problems.set(csvProblems(body.details));
      },
    });
  }
}
