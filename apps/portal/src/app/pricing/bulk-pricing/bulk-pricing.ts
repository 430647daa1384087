import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, input, linkedSignal, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import {
  formatCents,
  ItemRef,
  listWords,
  PARTY_ROLE_LABELS,
  partiesTold,
  PricingVisit,
  QUOTE_NOTE_MAX,
  RepairRequestDetail,
  RequestPricing,
  SendQuoteSchema,
} from '@cc/shared';
import { catchError, map, Observable, of, switchMap } from 'rxjs';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { zodValidator } from '../../core/forms/zod-validator';
import { apiErrorOf, describeFailure } from '../../core/http/api-error-of';
import { Notice } from '../../core/http/notice';
import { QuotesApi } from '../../quotes/quotes-api';
import { RequestsApi } from '../../requests/requests-api';
import { DaysToClosing } from '../../ui/days-to-closing/days-to-closing';
import { askToConfirm } from '../../ui/confirm-dialog/confirm-dialog';
import { SafetyNotice } from '../../ui/safety-notice/safety-notice';
import { StatusChip } from '../../ui/status-chip/status-chip';
import { BallparkCard } from '../ballpark-card/ballpark-card';
import { BulkToolbar } from '../bulk-toolbar/bulk-toolbar';
import { claimedTotals, livePrice, PendingChange } from '../live-pricing';
import { MoneyPipe } from '../../ui/money/money';
import { codeLabel } from '../../ui/code-label';
import { OutOfScopeData, OutOfScopeDialog } from '../out-of-scope-dialog/out-of-scope-dialog';
import { PricingApi } from '../pricing-api';
import { PricingTable } from '../pricing-table/pricing-table';
import { PricingTotals } from '../pricing-totals/pricing-totals';
import { VisitPlanner } from '../visit-planner/visit-planner';

type Loaded = { pricing: RequestPricing; error?: undefined } | { pricing?: undefined; error: string };

/**
 * Bulk pricing of one request by the assigned contractor: select many items (or all of one finding),
 * change them at once, auto-price, leave some out, and see the totals the shared engine computes while
 * editing; the server prices again on every change and on sending, and refuses totals that differ.
 */
@Component({
  selector: 'cc-bulk-pricing',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    MatExpansionModule,
    MatFormFieldModule,
    MatInputModule,
    StatusChip,
    DaysToClosing,
    MoneyPipe,
    PricingTable,
    BulkToolbar,
    PricingTotals,
    VisitPlanner,
    BallparkCard,
    SafetyNotice,
    ErrorMessagePipe,
  ],
  templateUrl: './bulk-pricing.html',
  styleUrl: './bulk-pricing.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BulkPricing {
  private readonly api = inject(PricingApi);
  private readonly quotes = inject(QuotesApi);
  private readonly requests = inject(RequestsApi);
  private readonly dialog = inject(MatDialog);
  private readonly notice = inject(Notice);
  private readonly router = inject(Router);

  /** The request id (route parameter). */
  readonly id = input.required<string>();
  protected readonly requestId = computed(() => Number(this.id()));

  private readonly reloads = signal(0);
  private readonly loaded = toSignal(
    toObservable(computed(() => ({ id: this.requestId(), n: this.reloads() }))).pipe(
      switchMap(({ id }) =>
        this.api.view(id).pipe(
          map((pricing): Loaded => ({ pricing })),
          catchError((err: unknown) => of<Loaded>({ error: describeFailure(err) })),
        ),
      ),
    ),
  );
  /** The pricing as last answered by the server (replaced after every change). */
  protected readonly pricing = linkedSignal(() => this.loaded()?.pricing ?? null);
  protected readonly loadError = computed(() => this.loaded()?.error ?? null);
  protected readonly request = toSignal(
    toObservable(this.requestId).pipe(switchMap((id) => this.requests.get(id).pipe(catchError(() => of<RepairRequestDetail | null>(null))))),
  );

  protected readonly selectedIds = linkedSignal<RequestPricing | null, Set<number>>({
    source: this.pricing,
    computation: (pricing, previous) => {
      const ids = new Set(pricing?.items.map((i) => i.id) ?? []);
      return new Set([...(previous?.value ?? [])].filter((id) => ids.has(id)));
    },
  });
  private readonly pendingSet = signal<PendingChange['set'] | null>(null);
  protected readonly isBusy = signal(false);
  /** A 409 from the server: someone else changed the items, or the totals shown are out of date. */
  protected readonly conflict = signal<string | null>(null);
  /** Why the last change could not be made, when the engine refuses it before it is sent. */
  protected readonly actionError = signal<string | null>(null);
  protected readonly noteMax = QUOTE_NOTE_MAX;
  protected readonly noteControl = new FormControl('', { nonNullable: true, validators: zodValidator(SendQuoteSchema.shape.note) });

  /** The totals of the items as they stand, from the shared engine. */
  protected readonly live = computed(() => {
    const pricing = this.pricing();
    return pricing ? livePrice(pricing) : { breakdown: null, problem: null };
  });
  /** The totals if the change in the toolbar were applied to the selected items. */
  protected readonly preview = computed(() => {
    const pricing = this.pricing();
    const set = this.pendingSet();
    if (!pricing || !set || this.selectedIds().size === 0) return null;
    return livePrice(pricing, { itemIds: [...this.selectedIds()], set });
  });
  protected readonly codes = computed(() => [...new Set(this.pricing()?.items.map((i) => i.code) ?? [])]);
  /** One button per finding: how many items it has, in plain words (never the code itself). */
  protected readonly codePicks = computed(() =>
    this.codes().map((code) => ({ code, label: codeLabel(code), count: (this.pricing()?.items ?? []).filter((i) => i.code === code).length })),
  );
  protected readonly selectedCodes = computed(() => {
    const ids = this.selectedIds();
    return [...new Set((this.pricing()?.items ?? []).filter((i) => ids.has(i.id)).map((i) => i.code))];
  });
  protected readonly canSend = computed(() => {
    const pricing = this.pricing();
    return !!pricing?.canEdit && pricing.unpricedItemIds.length === 0 && this.live().breakdown !== null && !this.live().problem;
  });

  protected reload(): void {
    this.conflict.set(null);
    this.reloads.update((n) => n + 1);
  }

  protected changeSelection(ids: Set<number>): void {
    this.selectedIds.set(ids);
  }

  protected selectCode(code: string): void {
    const ids = (this.pricing()?.items ?? []).filter((i) => i.code === code).map((i) => i.id);
    this.selectedIds.set(new Set(ids));
  }

  protected previewChange(set: PendingChange['set'] | null): void {
    this.actionError.set(null);
    this.pendingSet.set(set);
  }

  protected applyChange(set: PendingChange['set']): void {
    const items = this.selectedRefs();
    if (!items.length) {
      this.actionError.set('Select the items to change first.');
      return;
    }
    const after = livePrice(this.pricing()!, { itemIds: items.map((i) => i.id), set });
    if (after.problem) {
      this.actionError.set(after.problem);
      return;
    }
    this.pendingSet.set(null);
    this.run(this.api.bulkUpdate(this.requestId(), { items, set: { ...set, adderIds: set.adderIds ? [...set.adderIds] : undefined }, claimedTotals: claimedTotals(after.breakdown) }), `${items.length} ${items.length === 1 ? 'item' : 'items'} changed.`);
  }

  protected autoPrice(): void {
    this.isBusy.set(true);
    this.api.autoPrice(this.requestId()).subscribe({
      next: (result) => {
        this.isBusy.set(false);
        this.pricing.set(result.pricing);
        const assumed = result.assumedQuantityItemIds.length ? ` ${result.assumedQuantityItemIds.length} at an assumed quantity of 1: check them.` : '';
        const missing = result.noEntryItemIds.length ? ` ${result.noEntryItemIds.length} without an entry for their finding.` : '';
        this.notice.success(`${result.pricedItemIds.length} items priced from your rate book.${assumed}${missing}`);
      },
      error: (err: unknown) => this.fail(err),
    });
  }

  protected declineSelected(): void {
    const items = this.selectedRefs();
    if (!items.length) return;
    this.dialog
      .open<OutOfScopeDialog, OutOfScopeData, string>(OutOfScopeDialog, { data: { count: items.length }, width: '480px' })
      .afterClosed()
      .subscribe((reason) => {
        if (reason) this.run(this.api.markOutOfScope(this.requestId(), { items, reason }), 'Left out of the quote as not your scope.');
      });
  }

  protected saveVisits(visits: PricingVisit[]): void {
    this.run(this.api.updateVisits(this.requestId(), visits), 'Visits saved.');
  }

  /** Asks before sending: who receives the quote (as the notification rule picks them) and its total. */
  protected sendQuote(): void {
    const pricing = this.pricing();
    const totals = this.live().breakdown;
    if (!pricing || !totals) return;
    if (this.noteControl.invalid) {
      this.noteControl.markAsTouched();
      return;
    }
    const version = (pricing.currentQuoteVersion ?? 0) + 1;
    const total = formatCents(totals.totalCents);
    askToConfirm(this.dialog, {
      title: `Send quote version ${version}?`,
      message: `${this.recipientsSentence()} Version ${version} asks ${total} in all; a later change needs a new version.`,
      confirmLabel: `Send quote of ${total}`,
    }).subscribe((isConfirmed) => {
      if (isConfirmed) this.send();
    });
  }

  /** Who is told of the quote, by name and part, or that nobody with an account is there yet. */
  private recipientsSentence(): string {
    const request = this.request();
    if (!request) return 'The seller and the agents on this request will be e-mailed the quote and can approve it at once.';
    const told = partiesTold('quote-sent', request.parties);
    if (!told.length) return 'Nobody on this request has an account yet to be e-mailed it: the quote waits on the request until they sign in.';
    const names = told.map((p) => `${p.name ?? p.email} (${PARTY_ROLE_LABELS[p.role].toLowerCase()})`);
    return `${listWords(names)} will be e-mailed the quote and can approve it at once.`;
  }

  private send(): void {
    const note = this.noteControl.value.trim();
    this.isBusy.set(true);
    this.quotes.send(this.requestId(), { claimedTotals: claimedTotals(this.live().breakdown), note: note || undefined }).subscribe({
      next: (quote) => {
        this.isBusy.set(false);
        this.notice.success(`Quote version ${quote.version} sent.`);
        void this.router.navigate(['/requests', this.requestId(), 'quotes', quote.version]);
      },
      error: (err: unknown) => this.fail(err),
    });
  }

  /** The selected items with the versions the contractor sees, so a stale one is refused. */
  private selectedRefs(): ItemRef[] {
    const ids = this.selectedIds();
    return (this.pricing()?.items ?? []).filter((i) => ids.has(i.id)).map((i) => ({ id: i.id, version: i.version }));
  }

  private run(request: Observable<RequestPricing>, success: string): void {
    this.isBusy.set(true);
    request.subscribe({
      next: (pricing) => {
        this.isBusy.set(false);
        this.conflict.set(null);
        this.pricing.set(pricing);
        this.notice.success(success);
      },
      error: (err: unknown) => this.fail(err),
    });
  }

  private fail(err: unknown): void {
    this.isBusy.set(false);
    if (err instanceof HttpErrorResponse && err.status === 409) {
      this.conflict.set(apiErrorOf(err)?.error ?? 'Someone else changed this request meanwhile. Reload to see the current prices.');
      return;
    }
    this.notice.failure(err);
  }
}
