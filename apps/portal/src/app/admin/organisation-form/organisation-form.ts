import { ChangeDetectionStrategy, Component, computed, effect, inject, input, output, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, FormGroupDirective, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import {
  CreateOrganisationSchema,
  Organisation,
  ORGANISATION_KIND_LABELS,
  ORGANISATION_KINDS,
  OrganisationKind,
  US_STATES,
  UsState,
} from '@cc/shared';
import { applyIssues } from '../../core/forms/apply-issues';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { issuesOf } from '../../core/forms/issues-of';
import { zodValidator } from '../../core/forms/zod-validator';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { AdminApi } from '../admin-api';

const field = CreateOrganisationSchema.shape;

/** Adds an organisation; contractors also need their electrical licence. */
@Component({
  selector: 'cc-organisation-form',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, ErrorMessagePipe],
  templateUrl: './organisation-form.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OrganisationForm {
  private readonly api = inject(AdminApi);
  private readonly fb = inject(FormBuilder).nonNullable;

  readonly created = output<Organisation>();
  /** When given, the form edits this organisation (its kind stays) instead of adding one. */
  readonly organisation = input<Organisation | null>(null);

  protected readonly kinds = ORGANISATION_KINDS.map((kind) => ({ kind, label: ORGANISATION_KIND_LABELS[kind] }));
  protected readonly states = US_STATES;
  protected readonly form = this.fb.group({
    name: ['', zodValidator(field.name)],
    kind: this.fb.control<OrganisationKind | null>(null, zodValidator(field.kind)),
    phone: ['', zodValidator(field.phone)],
    address: ['', zodValidator(field.address)],
    licenceNumber: ['', zodValidator(field.licenceNumber)],
    licenceState: this.fb.control<UsState | null>(null),
    licenceClass: ['', zodValidator(field.licenceClass)],
  });
  private readonly kind = toSignal(this.form.controls.kind.valueChanges, { initialValue: null });
  private readonly fillForEdit = effect(() => {
    const org = this.organisation();
    if (!org) return;
    this.form.patchValue({ ...org, phone: org.phone ?? '', address: org.address ?? '', licenceNumber: org.licenceNumber ?? '', licenceState: org.licenceState as UsState | null, licenceClass: org.licenceClass ?? '' });
    this.form.controls.kind.disable();
  });
  /** Whether the licence fields apply (contractors only). */
  protected readonly isContractor = computed(() => this.kind() === 'contractor');
  protected readonly formError = signal<string | null>(null);
  protected readonly isBusy = signal(false);

  protected create(formDirective: FormGroupDirective): void {
    this.formError.set(null);
    const value = this.form.getRawValue();
    const parsed = CreateOrganisationSchema.safeParse(
      this.isContractor() ? value : { ...value, licenceNumber: null, licenceState: null, licenceClass: null },
    );
    if (this.form.invalid || !parsed.success) {
      if (!parsed.success) applyIssues(this.form, issuesOf(parsed.error));
      this.form.markAllAsTouched();
      return;
    }
    this.isBusy.set(true);
    const editing = this.organisation();
    (editing ? this.api.updateOrganisation(editing.id, parsed.data) : this.api.createOrganisation(parsed.data)).subscribe({
      next: (organisation) => {
        this.isBusy.set(false);
        formDirective.resetForm();
        this.created.emit(organisation);
      },
      error: (err: unknown) => {
        this.isBusy.set(false);
        this.formError.set(applyServerErrors(this.form, err));
      },
    });
  }
}
