import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import { placeLabel, quantityLabel, QuoteVersion, QuoteVersionSummary } from '@cc/shared';
import { catchError, combineLatest, map, of, switchMap } from 'rxjs';
import { Auth } from '../../core/auth/auth';
import { describeFailure } from '../../core/http/api-error-of';
import { codeLabel } from '../../ui/code-label';
import { formatCents, formatCentsDelta, MoneyPipe } from '../../ui/money/money';
import { BillSum } from '../../pricing/bill-sum/bill-sum';
import { PricingTotals } from '../../pricing/pricing-totals/pricing-totals';
import { QuotesApi } from '../quotes-api';
import { VersionChanges } from '../version-changes/version-changes';

type Loaded = { quote: QuoteVersion; error?: undefined } | { quote?: undefined; error: string };

/**
 * One sent quote version as the seller, the agents and the contractor see it: its lines, totals,
 * terms, warranty, validity and the contractor's licence; which version is current, what changed
 * against the one before, and its PDF.
 */
@Component({
  selector: 'cc-quote-view',
  imports: [
    DatePipe,
    RouterLink,
    MatButtonModule,
    MatCardModule,
    MatFormFieldModule,
    MatIconModule,
    MatProgressBarModule,
    MatSelectModule,
    MatTableModule,
    MoneyPipe,
    PricingTotals,
    BillSum,
    VersionChanges,
  ],
  templateUrl: './quote-view.html',
  styleUrl: './quote-view.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class QuoteView {
  private readonly api = inject(QuotesApi);
  private readonly router = inject(Router);
  private readonly auth = inject(Auth);

  /** The request id (route parameter). */
  readonly id = input.required<string>();
  /** The version to show (route parameter); the current one when left out. */
  readonly version = input<string | undefined>(undefined);

  protected readonly requestId = computed(() => Number(this.id()));
  private readonly wanted = computed(() => {
    const version = Number(this.version());
    return Number.isInteger(version) && version > 0 ? version : null;
  });

  private readonly loaded = toSignal(
    combineLatest([toObservable(this.requestId), toObservable(this.wanted)]).pipe(
      switchMap(([id, version]) =>
        this.api.get(id, version).pipe(
          map((quote): Loaded => ({ quote })),
          catchError((err: unknown) => of<Loaded>({ error: describeFailure(err) })),
        ),
      ),
    ),
  );
  protected readonly quote = computed(() => this.loaded()?.quote ?? null);
  protected readonly loadError = computed(() => this.loaded()?.error ?? null);
  protected readonly versions = toSignal(
    toObservable(this.requestId).pipe(switchMap((id) => this.api.list(id).pipe(catchError(() => of<QuoteVersionSummary[]>([]))))),
    { initialValue: [] },
  );
  protected readonly currentVersion = computed(() => this.versions().find((v) => v.isCurrent)?.version ?? null);
  protected readonly isContractor = computed(() => this.auth.role() === 'contractor');

  protected readonly pricedLines = computed(() => (this.quote()?.lines ?? []).filter((l) => l.kind === 'priced'));
  protected readonly declinedLines = computed(() => (this.quote()?.lines ?? []).filter((l) => l.kind === 'out-of-scope'));
  protected readonly columns = ['location', 'finding', 'entry', 'quantity', 'adders', 'line'];
  protected readonly label = codeLabel;

  protected versionLabel(summary: QuoteVersionSummary): string {
    const delta = summary.totalDeltaCents === null ? '' : ` (${formatCentsDelta(summary.totalDeltaCents)})`;
    return `Version ${summary.version} · ${formatCents(summary.totalCents)}${delta}${summary.isCurrent ? ' · current' : ''}`;
  }

  protected place(line: QuoteVersion['lines'][number]): string {
    return placeLabel(line.room, line.location);
  }

  protected quantity(line: QuoteVersion['lines'][number]): string {
    return quantityLabel(line.quantity, line.entry?.unit);
  }

  protected adderNames(line: QuoteVersion['lines'][number]): string {
    return line.adders.map((a) => a.name).join(', ');
  }

  protected showVersion(version: number): void {
    void this.router.navigate(['/requests', this.requestId(), 'quotes', version]);
  }
}
