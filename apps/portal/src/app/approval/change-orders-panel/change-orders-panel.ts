import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { ApprovalView, ChangeOrder, changeOrderConsentText, CreateChangeOrderSchema, DecideChangeOrderSchema, FINDING_CODES, ROOMS, type ChangeOrderLineInput } from '@cc/shared';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { zodValidator } from '../../core/forms/zod-validator';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { Notice } from '../../core/http/notice';
import { ROOM_LABELS } from '../../intake/room-labels';
import { codeLabel } from '../../ui/code-label';
import { formatCentsDelta, MoneyPipe } from '../../ui/money/money';
import { ApprovalApi } from '../approval-api';
import { changeOrderDecidedBy } from '../signed-by/signed-by';

type LineKind = ChangeOrderLineInput['kind'];

/** Change orders: the contractor sends one from site; the seller's side approves or declines it like a quote. */
@Component({
  selector: 'cc-change-orders-panel',
  imports: [DatePipe, ReactiveFormsModule, MatButtonModule, MatCardModule, MatCheckboxModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, MoneyPipe, ErrorMessagePipe],
  templateUrl: './change-orders-panel.html',
  styleUrl: './change-orders-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChangeOrdersPanel {
  private readonly api = inject(ApprovalApi);
  private readonly notice = inject(Notice);

  readonly view = input.required<ApprovalView>();
  readonly changed = output<ApprovalView>();

  protected readonly codes = FINDING_CODES;
  protected readonly rooms = ROOMS;
  protected readonly roomLabels = ROOM_LABELS;
  protected readonly label = codeLabel;
  protected readonly delta = formatCentsDelta;
  protected readonly isBusy = signal(false);
  protected readonly isComposing = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly kind = signal<LineKind>('add');

  protected readonly entries = computed(() => this.view().pricing.book.entries);
  protected readonly approvedItems = computed(() => this.view().items.filter((i) => i.status === 'approved'));
  protected readonly openOrder = computed(() => this.view().changeOrders.find((c) => c.status === 'sent') ?? null);

  protected readonly compose = new FormGroup({
    reason: new FormControl('', { nonNullable: true, validators: zodValidator(CreateChangeOrderSchema.shape.reason) }),
    code: new FormControl<string>('', { nonNullable: true }),
    room: new FormControl<string>('unknown', { nonNullable: true }),
    location: new FormControl('', { nonNullable: true }),
    entryId: new FormControl('', { nonNullable: true }),
    lineItemId: new FormControl<number | null>(null),
    quantity: new FormControl(1, { nonNullable: true }),
  });

  protected readonly decideForm = new FormGroup({
    signerName: new FormControl('', { nonNullable: true, validators: zodValidator(DecideChangeOrderSchema.shape.signerName) }),
    hasConsented: new FormControl(false, { nonNullable: true, validators: zodValidator(DecideChangeOrderSchema.shape.hasConsented) }),
  });

  protected readonly decidedBy = changeOrderDecidedBy;

  protected consentFor(order: ChangeOrder): string {
    return changeOrderConsentText({ contractorName: this.view().quote.contractor.name, number: order.number, decision: 'approve' });
  }

  protected send(): void {
    this.compose.markAllAsTouched();
    const v = this.compose.getRawValue();
    const line: ChangeOrderLineInput | null =
      this.kind() === 'add'
        ? { kind: 'add', code: v.code as never, room: v.room as never, location: v.location, entryId: v.entryId, quantity: Number(v.quantity) }
        : this.kind() === 'quantity'
          ? { kind: 'quantity', lineItemId: Number(v.lineItemId), quantity: Number(v.quantity) }
          : { kind: 'remove', lineItemId: Number(v.lineItemId) };
    const parsed = CreateChangeOrderSchema.safeParse({ reason: v.reason, lines: [line] });
    if (!parsed.success) {
      this.problem.set(parsed.error.issues.map((i) => i.message).join(' '));
      return;
    }
    this.isBusy.set(true);
    this.problem.set(null);
    this.api.sendChangeOrder(this.view().requestId, parsed.data).subscribe({
      next: (answer) => {
        this.isBusy.set(false);
        this.isComposing.set(false);
        this.compose.reset();
        this.notice.success('Change order sent to the seller.');
        this.changed.emit(answer);
      },
      error: (err: unknown) => {
        this.isBusy.set(false);
        this.problem.set(applyServerErrors(this.compose, err));
      },
    });
  }

  protected decide(order: ChangeOrder, decision: 'approve' | 'decline'): void {
    this.decideForm.markAllAsTouched();
    if (this.decideForm.invalid || this.isBusy()) return;
    this.isBusy.set(true);
    this.problem.set(null);
    this.api.decideChangeOrder(this.view().requestId, order.id, { decision, signerName: this.decideForm.controls.signerName.value, hasConsented: true }).subscribe({
      next: (answer) => {
        this.isBusy.set(false);
        this.decideForm.reset();
        this.notice.success(`Change order ${order.number} ${decision === 'approve' ? 'approved' : 'declined'}.`);
        this.changed.emit(answer);
      },
      error: (err: unknown) => {
        this.isBusy.set(false);
        this.problem.set(applyServerErrors(this.decideForm, err));
      },
    });
  }
}
