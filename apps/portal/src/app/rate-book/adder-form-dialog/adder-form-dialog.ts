import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { AdderEffectSchema, AdderKind, CreateSiteAdderSchema, SiteAdderRecord, SiteAdderSchema } from '@cc/shared';
import { Observable } from 'rxjs';
import { applyIssues } from '../../core/forms/apply-issues';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { issuesOf } from '../../core/forms/issues-of';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { RateBookApi } from '../rate-book-api';
import { bpToFactor, factorToBp, toWholeNumber } from '../units';
import { textValidator, unitValidator, WHOLE } from '../field-validators';

export interface AdderFormData {
  adder: SiteAdderRecord | null;
}

export const ADDER_KINDS: { kind: AdderKind; label: string }[] = [
  { kind: 'minutes-per-unit', label: 'Extra minutes for each unit' },
  { kind: 'labour-multiplier', label: 'Multiplies the labour minutes' },
  { kind: 'minutes-per-visit', label: 'Extra minutes once per visit' },
];

/** Adds or changes a site condition of the contractor's own naming, and what it does to labour. */
@Component({
  selector: 'cc-adder-form-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, ErrorMessagePipe],
  templateUrl: './adder-form-dialog.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AdderFormDialog {
  private readonly api = inject(RateBookApi);
  private readonly dialogRef = inject<MatDialogRef<AdderFormDialog, SiteAdderRecord>>(MatDialogRef);
  private readonly fb = inject(FormBuilder).nonNullable;
  protected readonly data = inject<AdderFormData>(MAT_DIALOG_DATA);
  protected readonly kinds = ADDER_KINDS;

  private readonly adder = this.data.adder;
  private readonly effect = this.adder?.effect;
  protected readonly form = this.fb.group({
    name: [this.adder?.name ?? '', textValidator(SiteAdderSchema.shape.name, 'Name the condition')],
    kind: this.fb.control<AdderKind>(this.effect?.kind ?? 'minutes-per-unit'),
    amount: [this.effect ? (this.effect.kind === 'labour-multiplier' ? bpToFactor(this.effect.multiplierBp) : String(this.effect.minutes)) : ''],
    builtBefore: [this.adder?.appliesWhenBuiltBefore === null || !this.adder ? '' : String(this.adder.appliesWhenBuiltBefore), unitValidator(WHOLE, SiteAdderSchema.shape.appliesWhenBuiltBefore, true)],
  });
  protected readonly kind = toSignal(this.form.controls.kind.valueChanges, { initialValue: this.form.controls.kind.value });
  protected readonly formError = signal<string | null>(null);
  protected readonly isBusy = signal(false);

  protected save(): void {
    this.formError.set(null);
    const { name, kind, amount, builtBefore } = this.form.getRawValue();
    const effect = kind === 'labour-multiplier' ? { kind, multiplierBp: factorToBp(amount) } : { kind, minutes: toWholeNumber(amount) };
    const checkedEffect = AdderEffectSchema.safeParse(effect);
    if (!checkedEffect.success) {
      const typed = kind === 'labour-multiplier' ? 'Enter a factor from 1 to 4, such as 1.3' : 'Enter whole minutes, 1 or more';
      this.form.controls.amount.setErrors({ zod: typed });
      this.form.controls.amount.markAsTouched();
    }
    if (this.form.invalid || !checkedEffect.success) {
      this.form.markAllAsTouched();
      return;
    }
    const checked = CreateSiteAdderSchema.safeParse({ name, effect: checkedEffect.data, appliesWhenBuiltBefore: builtBefore.trim() ? toWholeNumber(builtBefore) : null });
    if (!checked.success) {
      applyIssues(this.form, issuesOf(checked.error));
      return;
    }
    const { effect: saved, appliesWhenBuiltBefore } = checked.data;
    const request: Observable<SiteAdderRecord> = this.adder
      ? this.api.updateAdder(this.adder.id, { version: this.adder.version, name: checked.data.name, effect: saved, appliesWhenBuiltBefore })
      : this.api.createAdder(checked.data);
    this.isBusy.set(true);
    request.subscribe({
      next: (record) => this.dialogRef.close(record),
      error: (err: unknown) => {
        this.isBusy.set(false);
        const isStale = err instanceof HttpErrorResponse && err.status === 409;
        this.formError.set(isStale ? 'Someone changed this condition meanwhile. Close this form and reload.' : applyServerErrors(this.form, err));
      },
    });
  }
}
