import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatCardModule } from '@angular/material/card';
import { MatChipsModule } from '@angular/material/chips';
import { MatIconModule } from '@angular/material/icon';
import { BALLPARK_LABEL, RequestBallpark, SiteConditions } from '@cc/shared';
import { catchError, combineLatest, map, of, switchMap } from 'rxjs';
import { describeFailure } from '../../core/http/api-error-of';
import { Notice } from '../../core/http/notice';
import { adderEffectLabel } from '../adder-effect-label';
import { MoneyPipe } from '../../ui/money/money';
import { PricingApi } from '../pricing-api';

type Loaded = { range: RequestBallpark; error?: undefined } | { range?: undefined; error: string };

/**
 * A low–high range for the whole request from its findings, the age of the house and the site
 * conditions flagged: shown to the agents and the contractor before any price, and labelled as an
 * estimate, never as a quote.
 */
@Component({
  selector: 'cc-ballpark-card',
  imports: [MatCardModule, MatChipsModule, MatIconModule, MoneyPipe],
  templateUrl: './ballpark-card.html',
  styleUrl: './ballpark-card.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BallparkCard {
  private readonly api = inject(PricingApi);
  private readonly notice = inject(Notice);

  readonly requestId = input.required<number>();
  /** Whether the viewer may flag site conditions (the agents and the assigned contractor). */
  readonly canFlag = input(false);

  /** The label every range carries, whatever the server sends. */
  protected readonly label = BALLPARK_LABEL;
  private readonly reloads = signal(0);
  private readonly source = computed(() => ({ id: this.requestId(), reload: this.reloads() }));

  private readonly loaded = toSignal(
    toObservable(this.source).pipe(
      switchMap(({ id }) =>
        this.api.ballpark(id).pipe(
          map((range): Loaded => ({ range })),
          catchError((err: unknown) => of<Loaded>({ error: describeFailure(err) })),
        ),
      ),
    ),
  );
  protected readonly range = computed(() => this.loaded()?.range ?? null);
  protected readonly error = computed(() => this.loaded()?.error ?? null);

  private readonly conditions = toSignal(
    combineLatest([toObservable(this.requestId), toObservable(this.canFlag), toObservable(this.reloads)]).pipe(
      switchMap(([id, canFlag]) => (canFlag ? this.api.siteConditions(id).pipe(catchError(() => of<SiteConditions | null>(null))) : of(null))),
    ),
  );
  protected readonly options = computed(() => {
    const conditions = this.conditions();
    if (!conditions) return [];
    return conditions.available.map((c) => ({ id: c.id, name: c.name, effect: adderEffectLabel(c.effect), isFlagged: conditions.adderIds.includes(c.id) }));
  });
  protected readonly isSaving = signal(false);

  protected toggleCondition(id: number, isFlagged: boolean): void {
    const current = this.conditions()?.adderIds ?? [];
    const next = isFlagged ? [...new Set([...current, id])] : current.filter((c) => c !== id);
    this.isSaving.set(true);
    this.api.setSiteConditions(this.requestId(), next).subscribe({
      next: () => {
        this.isSaving.set(false);
        this.reloads.update((n) => n + 1);
      },
      error: (err: unknown) => {
        this.isSaving.set(false);
        this.notice.failure(err);
      },
    });
  }
}
