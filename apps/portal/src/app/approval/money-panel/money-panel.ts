import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { ApprovalView, EscrowCompanySchema, InvoiceSummary, Payment, PaymentPlan, SendClosingInvoiceSchema } from '@cc/shared';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { zodValidator } from '../../core/forms/zod-validator';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { describeFailure } from '../../core/http/api-error-of';
import { Notice } from '../../core/http/notice';
import { formatCents, MoneyPipe } from '../../ui/money/money';
import { ApprovalApi, newIdempotencyKey } from '../approval-api';
import { PaymentEntry } from './payment-entry';

const PLAN_LABELS: Record<PaymentPlan, string> = {
  'card-deposit': 'Pay the deposit by card now, the balance on completion',
  'card-full': 'Pay by card now',
  'at-closing': 'Pay at closing: an invoice to the escrow or title company',
};

/** Where the money stands, how the seller pays, what was paid and refunded, and the invoices. */
@Component({
  selector: 'cc-money-panel',
  imports: [DatePipe, ReactiveFormsModule, MatButtonModule, MatCardModule, MatFormFieldModule, MatIconModule, MatInputModule, MatRadioModule, MoneyPipe, ErrorMessagePipe, PaymentEntry],
  templateUrl: './money-panel.html',
  styleUrl: './money-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MoneyPanel {
  private readonly api = inject(ApprovalApi);
  private readonly notice = inject(Notice);

  readonly view = input.required<ApprovalView>();
  readonly changed = output<ApprovalView>();
  /** The payment page to go to (the page leaves the portal for it). */
  readonly leave = output<string>();

  protected readonly plan = signal<PaymentPlan | null>(null);
  protected readonly isBusy = signal(false);
  protected readonly problem = signal<string | null>(null);
  /** One key per payment attempt: a double click sends the same one. */
  private attemptKey = newIdempotencyKey();

  protected readonly escrow = new FormGroup({
    company: new FormControl('', { nonNullable: true, validators: zodValidator(EscrowCompanySchema.shape.company) }),
    officer: new FormControl('', { nonNullable: true }),
    email: new FormControl('', { nonNullable: true, validators: zodValidator(EscrowCompanySchema.shape.email) }),
    fileNumber: new FormControl('', { nonNullable: true }),
  });

  /** The invoice payable at closing being e-mailed again, and the address it goes to. */
  protected readonly resending = signal<number | null>(null);
  protected readonly resendForm = new FormGroup({ email: new FormControl('', { nonNullable: true, validators: zodValidator(SendClosingInvoiceSchema.shape.email) }) });

  protected readonly account = computed(() => this.view().account);
  protected readonly chosen = computed(() => this.view().plans.find((p) => p.plan === this.plan()) ?? null);

  protected planLabel(plan: PaymentPlan, amountCents: number): string {
    return `${PLAN_LABELS[plan]} — ${formatCents(amountCents)}`;
  }

  protected choose(plan: PaymentPlan): void {
    this.plan.set(plan);
    this.problem.set(null);
    this.attemptKey = newIdempotencyKey();
  }

  protected pay(): void {
    const chosen = this.chosen();
    if (!chosen) {
      this.problem.set('Choose how to pay first.');
      return;
    }
    if (chosen.plan === 'at-closing') {
      this.escrow.markAllAsTouched();
      if (this.escrow.invalid) return;
    }
    if (this.isBusy()) return;
    this.isBusy.set(true);
    this.problem.set(null);
    const requestId = this.view().requestId;
    const body = chosen.plan === 'at-closing' ? { plan: chosen.plan, idempotencyKey: this.attemptKey, escrow: this.escrow.getRawValue() } : { plan: chosen.plan, idempotencyKey: this.attemptKey };
    this.api.startPayment(requestId, body).subscribe({
      next: (started) => {
        if (started.checkoutUrl) {
          this.leave.emit(started.checkoutUrl);
          return;
        }
        this.isBusy.set(false);
        this.notice.success(`Invoice ${started.invoiceNumber} is on its way by e-mail to ${this.escrow.getRawValue().email.trim()}.`);
        this.reload();
      },
      error: (err: unknown) => {
        this.isBusy.set(false);
        this.problem.set(applyServerErrors(this.escrow, err));
      },
    });
  }

  /** Back to a payment page that is still open (the payer left it before paying). */
  protected resume(payment: Payment): void {
    if (payment.checkoutUrl) this.leave.emit(payment.checkoutUrl);
  }

  protected startResend(invoice: InvoiceSummary): void {
    this.resendForm.reset({ email: invoice.sentTo ?? '' });
    this.resending.set(invoice.id);
  }

  protected resend(invoice: InvoiceSummary): void {
    this.resendForm.markAllAsTouched();
    if (this.resendForm.invalid || this.isBusy()) return;
    this.isBusy.set(true);
    const email = this.resendForm.getRawValue().email.trim();
    this.api.sendClosingInvoice(this.view().requestId, invoice.id, { email }).subscribe({
      next: (view) => {
        this.isBusy.set(false);
        this.resending.set(null);
        this.notice.success(`Invoice ${invoice.number} is on its way by e-mail to ${email}.`);
        this.changed.emit(view);
      },
      error: (err: unknown) => {
        this.isBusy.set(false);
        // A refused address shows under the field; anything else (funds recorded meanwhile) as a notice.
        if (applyServerErrors(this.resendForm, err)) this.notice.failure(err);
      },
    });
  }

  protected issueInvoice(): void {
    this.isBusy.set(true);
    this.api.issueInvoice(this.view().requestId).subscribe({
      next: (invoice) => {
        this.isBusy.set(false);
        this.notice.success(`Invoice ${invoice.number} issued.`);
        this.reload();
      },
      error: (err: unknown) => {
        this.isBusy.set(false);
        this.notice.failure(err);
      },
    });
  }

  protected reload(): void {
    this.api.view(this.view().requestId).subscribe({ next: (v) => this.changed.emit(v), error: (err: unknown) => this.problem.set(describeFailure(err)) });
  }
}
