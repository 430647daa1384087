import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, linkedSignal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { ApprovalView, ITEM_STATUS_LABELS, placeLabel, quantityLabel } from '@cc/shared';
import { catchError, map, of, switchMap } from 'rxjs';
import { describeFailure } from '../../core/http/api-error-of';
import { Notice } from '../../core/http/notice';
import { codeLabel } from '../../ui/code-label';
import { MoneyPipe } from '../../ui/money/money';
import { SafetyNotice } from '../../ui/safety-notice/safety-notice';
import { StatusChip } from '../../ui/status-chip/status-chip';
import { ApprovalApi } from '../approval-api';
import { ChangeOrdersPanel } from '../change-orders-panel/change-orders-panel';
import { DecisionForm } from '../decision-form/decision-form';
import { MoneyPanel } from '../money-panel/money-panel';
import { signedByText } from '../signed-by/signed-by';

type Loaded = { view: ApprovalView; error?: undefined } | { view?: undefined; error: string };

/**
 * The seller's side of a request on one page, phone first: the decision and signature on the
 * current quote, then the decision as signed, payment, change orders and invoices. Everyone on
 * the request sees the decision per item; money is shown to the seller's side and the contractor.
 */
@Component({
  selector: 'cc-approval-page',
  imports: [DatePipe, RouterLink, MatCardModule, MatIconModule, MatProgressBarModule, MoneyPipe, SafetyNotice, StatusChip, DecisionForm, MoneyPanel, ChangeOrdersPanel],
  templateUrl: './approval-page.html',
  styleUrl: './approval-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ApprovalPage {
  private readonly api = inject(ApprovalApi);
  private readonly notice = inject(Notice);

  /** The request id (route parameter). */
  readonly id = input.required<string>();
  /** The payment the payer comes back from (query parameter set by the payment page's return link). */
  readonly payment = input<string | undefined>(undefined);
  readonly cancelled = input<string | undefined>(undefined);

  private readonly loaded = toSignal(
    toObservable(this.id).pipe(
      switchMap((id) =>
        this.api.view(Number(id)).pipe(
          map((view): Loaded => ({ view })),
          catchError((err: unknown) => of<Loaded>({ error: describeFailure(err) })),
        ),
      ),
    ),
  );
  protected readonly view = linkedSignal(() => this.loaded()?.view ?? null);
  protected readonly loadError = computed(() => this.loaded()?.error ?? null);
  protected readonly label = codeLabel;
  protected readonly place = placeLabel;
  protected readonly quantity = quantityLabel;
  protected readonly itemStatusLabel = ITEM_STATUS_LABELS;

  /** The payment the payer came back from, as the server now knows it. */
  protected readonly returnedPayment = computed(() => {
    const id = Number(this.payment());
    return this.view()?.payments.find((p) => p.id === id) ?? null;
  });
  protected readonly signedBy = signedByText;
  /** Each item's amount in the quote as sent, to say so where the signed amount differs. */
  protected readonly quotedCents = computed(() => new Map((this.view()?.quote.lines ?? []).filter((l) => l.lineItemId !== null).map((l) => [l.lineItemId!, l.lineCents])));
  protected readonly decisionNotes = computed(() => new Map((this.view()?.decisions ?? []).filter((d) => d.note).map((d) => [d.lineItemId, d.note])));
  protected readonly showsMoney = computed(() => {
    const v = this.view();
    return !!v && !!v.signature && v.requestStatus !== 'declined' && (v.can.pay || v.can.recordFunds || v.payments.length > 0 || v.invoices.length > 0);
  });

  protected showSigned(view: ApprovalView): void {
    this.view.set(view);
    this.notice.success(view.requestStatus === 'declined' ? 'Your decision is recorded: every item declined.' : 'Signed. Next, choose how to pay.');
  }

  protected goToPaymentPage(url: string): void {
    window.location.assign(url);
  }
}
