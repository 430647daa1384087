import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { FormArray, FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCardModule } from '@angular/material/card';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import {
  ApprovalView,
  DECISION_NOTE_MAX,
  declineCaution,
  DecisionNoteSchema,
  lineAmountsOf,
  placeLabel,
  priceScope,
  quantityLabel,
  SignApprovalSchema,
} from '@cc/shared';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { zodValidator } from '../../core/forms/zod-validator';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { codeLabel } from '../../ui/code-label';
import { MoneyPipe } from '../../ui/money/money';
import { BillSum } from '../../pricing/bill-sum/bill-sum';
import { PricingTotals } from '../../pricing/pricing-totals/pricing-totals';
import { ApprovalApi } from '../approval-api';

type Decision = 'approved' | 'declined';

/**
 * The seller's decision on the current quote, made for a phone: one card per item with Approve /
 * Decline and an optional note, the totals of what is approved as the shared engine prices them,
 * and the signature (typed full name and the terms ticked).
 */
@Component({
  selector: 'cc-decision-form',
  imports: [ReactiveFormsModule, MatButtonModule, MatButtonToggleModule, MatCardModule, MatCheckboxModule, MatFormFieldModule, MatIconModule, MatInputModule, MoneyPipe, PricingTotals, BillSum, ErrorMessagePipe],
  templateUrl: './decision-form.html',
  styleUrl: './decision-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DecisionForm {
  private readonly api = inject(ApprovalApi);

  readonly view = input.required<ApprovalView>();
  readonly signed = output<ApprovalView>();

  protected readonly label = codeLabel;
  protected readonly place = placeLabel;
  protected readonly quantity = quantityLabel;
  /** The caution beside a declined item whose finding is a safety hazard (it never blocks the decline). */
  protected readonly caution = declineCaution;
  protected readonly decisions = signal<Partial<Record<number, Decision>>>({});
  protected readonly noteMax = DECISION_NOTE_MAX;
  protected readonly isSending = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly isMissingDecisions = signal(false);

  /** The quote's priced lines: the items to decide on. */
  protected readonly lines = computed(() => this.view().quote.lines.filter((l) => l.kind === 'priced' && l.lineItemId !== null));

  /**
   * The signature and one note per line, at the paths of the request body (`decisions.<i>.note`), so a
   * note the server refuses shows its message under that note.
   */
  protected readonly form = new FormGroup({
    signerName: new FormControl('', { nonNullable: true, validators: zodValidator(SignApprovalSchema.shape.signerName) }),
    hasConsented: new FormControl(false, { nonNullable: true, validators: zodValidator(SignApprovalSchema.shape.hasConsented) }),
    decisions: new FormArray<FormGroup<{ note: FormControl<string> }>>([]),
  });
  private readonly notes = computed(() => {
    const rows = this.lines().map(() => new FormGroup({ note: new FormControl('', { nonNullable: true, validators: zodValidator(DecisionNoteSchema) }) }));
    this.form.setControl('decisions', new FormArray(rows));
    return rows.map((r) => r.controls.note);
  });
  protected readonly undecided = computed(() => this.lines().filter((l) => !this.decisions()[l.lineItemId!]).length);
  /** What the approved items cost together, priced by the same engine as the server. */
  protected readonly approvedTotals = computed(() => {
    const approvedKeys = Object.entries(this.decisions()).filter(([, d]) => d === 'approved').map(([id]) => id);
    const { book, input } = this.view().pricing;
    return priceScope({ book, input, approvedKeys });
  });
  /**
   * What each item costs as signed: an approved item at its amount in the approved scope (the visit's
   * first-hour minimum is shared by the approved items only, so the amount can differ from the
   * quote's when another item is declined); an item not approved at the quote's amount.
   */
  protected readonly amounts = computed(() => {
    const inScope = lineAmountsOf(this.approvedTotals());
    return new Map(this.lines().map((l) => [l.lineItemId!, inScope.get(String(l.lineItemId)) ?? l.lineCents]));
  });
  protected readonly isRepriced = computed(() => this.lines().some((l) => this.amounts().get(l.lineItemId!) !== l.lineCents));

  protected decide(lineItemId: number, decision: Decision): void {
    this.decisions.update((all) => ({ ...all, [lineItemId]: decision }));
    this.isMissingDecisions.set(false);
  }

  /** The note control of the line at `index`. */
  protected noteAt(index: number): FormControl<string> {
    return this.notes()[index]!;
  }

  protected sign(): void {
    this.notes();
    this.form.markAllAsTouched();
    const missing = this.undecided() > 0;
    this.isMissingDecisions.set(missing);
    if (missing || this.form.invalid || this.isSending()) return;
    this.isSending.set(true);
    this.problem.set(null);
    const v = this.view();
    const body = {
      quoteVersion: v.quote.version,
      decisions: this.lines().map((l, i) => {
        const note = this.notes()[i]!.value.trim();
        return { lineItemId: l.lineItemId!, decision: this.decisions()[l.lineItemId!]!, ...(note ? { note } : {}) };
      }),
      signerName: this.form.controls.signerName.value,
      hasConsented: true as const,
    };
    this.api.sign(v.requestId, body).subscribe({
      next: (answer) => {
        this.isSending.set(false);
        this.signed.emit(answer);
      },
      error: (err: unknown) => {
        this.isSending.set(false);
        this.problem.set(applyServerErrors(this.form, err));
      },
    });
  }
}
