import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, effect, inject, input, output, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { PermitTermsSchema, RateBookTermsRecord, VisitTerms, VisitTermsSchema } from '@cc/shared';
import { applyIssues } from '../../core/forms/apply-issues';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { issuesOf } from '../../core/forms/issues-of';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { Notice } from '../../core/http/notice';
import { RateBookApi } from '../rate-book-api';
import { bpToPercent, centsToDollars, dollarsToCents, percentToBp, toWholeNumber } from '../units';
import { DOLLARS, PERCENT, textValidator, unitValidator, WHOLE } from '../field-validators';

const field = VisitTermsSchema.shape;
const permit = PermitTermsSchema.shape;

/** The visit terms of the rate book: charges per visit, labour rates, markup, tax, permit, deposit and warranty. */
@Component({
  selector: 'cc-terms-form',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule, ErrorMessagePipe],
  templateUrl: './terms-form.html',
  styleUrl: './terms-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TermsForm {
  private readonly api = inject(RateBookApi);
  private readonly notice = inject(Notice);
  private readonly fb = inject(FormBuilder).nonNullable;

  /** The saved terms, or null for a rate book not started yet. */
  readonly record = input.required<RateBookTermsRecord | null>();
  readonly saved = output<RateBookTermsRecord>();

  protected readonly form = this.fb.group({
    serviceCallCents: ['', unitValidator(DOLLARS, field.serviceCallCents)],
    firstHourMinimumCents: ['', unitValidator(DOLLARS, field.firstHourMinimumCents)],
    firstHourCoversMinutes: ['60', unitValidator(WHOLE, field.firstHourCoversMinutes)],
    hourlyRateCents: ['', unitValidator(DOLLARS, field.hourlyRateCents)],
    billingIncrementMinutes: ['15', unitValidator(WHOLE, field.billingIncrementMinutes)],
    materialsMarkupBp: ['', unitValidator(PERCENT, field.materialsMarkupBp)],
    materialsTaxBp: ['0', unitValidator(PERCENT, field.materialsTaxBp)],
    permit: this.fb.group({
      feeCents: ['', unitValidator(DOLLARS, permit.feeCents)],
      handlingCents: ['', unitValidator(DOLLARS, permit.handlingCents)],
    }),
    cardDepositBp: ['', unitValidator(PERCENT, field.cardDepositBp)],
    quoteValidityDays: ['30', unitValidator(WHOLE, field.quoteValidityDays)],
    visitCapacityMinutes: ['480', unitValidator(WHOLE, field.visitCapacityMinutes)],
    warrantyText: ['', textValidator(field.warrantyText, 'Write the warranty the seller reads')],
  });
  protected readonly formError = signal<string | null>(null);
  protected readonly isBusy = signal(false);

  constructor() {
    effect(() => {
      const terms = this.record()?.terms;
      if (terms) this.form.reset(this.toForm(terms));
    });
  }

  protected save(): void {
    this.formError.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      this.formError.set('Some fields need attention.');
      return;
    }
    const v = this.form.getRawValue();
    const checked = VisitTermsSchema.safeParse({
      serviceCallCents: dollarsToCents(v.serviceCallCents),
      firstHourMinimumCents: dollarsToCents(v.firstHourMinimumCents),
      firstHourCoversMinutes: toWholeNumber(v.firstHourCoversMinutes),
      hourlyRateCents: dollarsToCents(v.hourlyRateCents),
      billingIncrementMinutes: toWholeNumber(v.billingIncrementMinutes),
      materialsMarkupBp: percentToBp(v.materialsMarkupBp),
      materialsTaxBp: percentToBp(v.materialsTaxBp),
      permit: { feeCents: dollarsToCents(v.permit.feeCents), handlingCents: dollarsToCents(v.permit.handlingCents) },
      cardDepositBp: percentToBp(v.cardDepositBp),
      quoteValidityDays: toWholeNumber(v.quoteValidityDays),
      visitCapacityMinutes: toWholeNumber(v.visitCapacityMinutes),
      warrantyText: v.warrantyText,
    });
    if (!checked.success) {
      applyIssues(this.form, issuesOf(checked.error));
      this.formError.set('Some fields need attention.');
      return;
    }
    this.isBusy.set(true);
    this.api.saveTerms({ version: this.record()?.version ?? 0, terms: checked.data }).subscribe({
      next: (record) => {
        this.isBusy.set(false);
        this.notice.success('Terms saved. New prices use them; sent quotes keep theirs.');
        this.saved.emit(record);
      },
      error: (err: unknown) => {
        this.isBusy.set(false);
        const isStale = err instanceof HttpErrorResponse && err.status === 409;
        this.formError.set(isStale ? 'Someone changed the terms meanwhile. Reload the rate book to see them.' : applyServerErrors(this.form, err));
      },
    });
  }

  private toForm(t: VisitTerms) {
    return {
      serviceCallCents: centsToDollars(t.serviceCallCents),
      firstHourMinimumCents: centsToDollars(t.firstHourMinimumCents),
      firstHourCoversMinutes: String(t.firstHourCoversMinutes),
      hourlyRateCents: centsToDollars(t.hourlyRateCents),
      billingIncrementMinutes: String(t.billingIncrementMinutes),
      materialsMarkupBp: bpToPercent(t.materialsMarkupBp),
      materialsTaxBp: bpToPercent(t.materialsTaxBp),
      permit: { feeCents: centsToDollars(t.permit.feeCents), handlingCents: centsToDollars(t.permit.handlingCents) },
      cardDepositBp: bpToPercent(t.cardDepositBp),
      quoteValidityDays: String(t.quoteValidityDays),
      visitCapacityMinutes: String(t.visitCapacityMinutes),
      warrantyText: t.warrantyText,
    };
  }
}
