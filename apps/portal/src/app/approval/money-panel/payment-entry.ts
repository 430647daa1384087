import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { ApprovalView, CreateRefundSchema, Payment, RecordFundsSchema } from '@cc/shared';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { zodValidator } from '../../core/forms/zod-validator';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { Notice } from '../../core/http/notice';
import { MoneyPipe } from '../../ui/money/money';
import { ApprovalApi, newIdempotencyKey } from '../approval-api';

const PURPOSE_LABELS: Record<Payment['purpose'], string> = { deposit: 'Deposit by card', full: 'Payment in full by card', balance: 'Balance by card', closing: 'Invoice payable at closing' };
const STATUS_LABELS: Record<Payment['status'], string> = { pending: 'Waiting for payment', succeeded: 'Received', failed: 'Failed', cancelled: 'Cancelled' };

/** Dollars typed as text ("157.17") to whole cents, or NaN when it is not an amount. */
export function centsOf(text: string): number {
  const match = /^\s*\$?\s*(\d{1,7})(?:\.(\d{1,2}))?\s*$/.exec(text);
  return match ? Number(match[1]) * 100 + Number((match[2] ?? '').padEnd(2, '0')) : NaN;
}

/** One payment: what it is, where it stands, and what the contractor can do with it (refund, record funds). */
@Component({
  selector: 'cc-payment-entry',
  imports: [DatePipe, ReactiveFormsModule, MatButtonModule, MatCardModule, MatFormFieldModule, MatIconModule, MatInputModule, MoneyPipe, ErrorMessagePipe],
  templateUrl: './payment-entry.html',
  styleUrl: './payment-entry.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PaymentEntry {
  private readonly api = inject(ApprovalApi);
  private readonly notice = inject(Notice);

  readonly payment = input.required<Payment>();
  readonly view = input.required<ApprovalView>();
  readonly resume = output<void>();
  readonly changed = output<ApprovalView>();

  protected readonly purposeLabel = computed(() => PURPOSE_LABELS[this.payment().purpose]);
  protected readonly statusLabel = computed(() => STATUS_LABELS[this.payment().status]);
  protected readonly refundable = computed(() => {
    const p = this.payment();
    const pending = p.refunds.filter((r) => r.status === 'pending').reduce((s, r) => s + r.amountCents, 0);
    return p.method === 'card' && p.status === 'succeeded' ? p.amountCents - p.refundedCents - pending : 0;
  });
  protected readonly canRefund = computed(() => this.view().can.refund && this.refundable() > 0);
  protected readonly canRecord = computed(() => this.view().can.recordFunds && this.payment().method === 'closing' && this.payment().status === 'pending');
  protected readonly isOpen = signal(false);
  protected readonly isBusy = signal(false);
  protected readonly problem = signal<string | null>(null);
  private refundKey = newIdempotencyKey();

  protected readonly refundForm = new FormGroup({
    amount: new FormControl('', { nonNullable: true, validators: zodValidator(CreateRefundSchema.shape.amountCents, (v) => centsOf(String(v ?? ''))) }),
    reason: new FormControl('', { nonNullable: true, validators: zodValidator(CreateRefundSchema.shape.reason) }),
  });
  protected readonly fundsForm = new FormGroup({
    receivedOn: new FormControl(new Date().toISOString().slice(0, 10), { nonNullable: true, validators: zodValidator(RecordFundsSchema.shape.receivedOn) }),
    reference: new FormControl('', { nonNullable: true, validators: zodValidator(RecordFundsSchema.shape.reference) }),
  });

  protected toggle(): void {
    this.isOpen.update((open) => !open);
    this.problem.set(null);
    this.refundKey = newIdempotencyKey();
  }

  protected refund(): void {
    this.refundForm.markAllAsTouched();
    if (this.refundForm.invalid || this.isBusy()) return;
    this.isBusy.set(true);
    const { amount, reason } = this.refundForm.getRawValue();
    this.api.refund(this.view().requestId, this.payment().id, { amountCents: centsOf(amount), reason, idempotencyKey: this.refundKey }).subscribe({
      next: (v) => this.done(v, 'Refund sent to the payment service.'),
      error: (err: unknown) => this.failed(this.refundForm, err, { amountCents: 'amount' }),
    });
  }

  protected recordFunds(): void {
    this.fundsForm.markAllAsTouched();
    if (this.fundsForm.invalid || this.isBusy()) return;
    this.isBusy.set(true);
    const p = this.payment();
    this.api.recordFunds(this.view().requestId, { paymentId: p.id, amountCents: p.amountCents, ...this.fundsForm.getRawValue() }).subscribe({
      next: (v) => this.done(v, 'Funds recorded.'),
      error: (err: unknown) => this.failed(this.fundsForm, err, {}),
    });
  }

  private done(v: ApprovalView, message: string): void {
    this.isBusy.set(false);
    this.isOpen.set(false);
    this.notice.success(message);
    this.changed.emit(v);
  }

  private failed(form: FormGroup, err: unknown, _paths: Record<string, string>): void {
    this.isBusy.set(false);
    this.problem.set(applyServerErrors(form, err));
  }
}
