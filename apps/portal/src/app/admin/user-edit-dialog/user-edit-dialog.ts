import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { UpdateUserSchema, User } from '@cc/shared';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { zodValidator } from '../../core/forms/zod-validator';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { AdminApi } from '../admin-api';

const field = UpdateUserSchema.shape;

/** Changes a person's name and e-mail address; closes with the saved account. */
@Component({
  selector: 'cc-user-edit-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, ErrorMessagePipe],
  template: `
    <h2 mat-dialog-title>Edit {{ user.name }}</h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate aria-label="Edit the person">
      <mat-dialog-content>
        @if (formError(); as message) {
          <p class="cc-form-error" role="alert">{{ message }}</p>
        }
        <mat-form-field class="wide">
          <mat-label>Full name</mat-label>
          <input matInput formControlName="name" data-testid="user-edit-name" />
          <mat-error>{{ form.controls.name | errorMessage }}</mat-error>
        </mat-form-field>
        <mat-form-field class="wide">
          <mat-label>E-mail address</mat-label>
          <input matInput type="email" formControlName="email" data-testid="user-edit-email" />
          <mat-error>{{ form.controls.email | errorMessage }}</mat-error>
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" [disabled]="isBusy()" data-testid="user-edit-save">Save changes</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: '.wide { width: 100%; }',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UserEditDialog {
  private readonly api = inject(AdminApi);
  private readonly dialogRef = inject<MatDialogRef<UserEditDialog, User>>(MatDialogRef);
  protected readonly user = inject<User>(MAT_DIALOG_DATA);
  protected readonly form = inject(FormBuilder).nonNullable.group({
    name: [this.user.name, zodValidator(field.name)],
    email: [this.user.email, zodValidator(field.email)],
  });
  protected readonly formError = signal<string | null>(null);
  protected readonly isBusy = signal(false);

  protected save(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.isBusy.set(true);
    this.api.updateUser(this.user.id, { ...UpdateUserSchema.parse({ ...this.form.getRawValue(), organisationId: this.user.organisationId }) }).subscribe({
      next: (saved) => this.dialogRef.close(saved),
      error: (err: unknown) => {
        this.isBusy.set(false);
        this.formError.set(applyServerErrors(this.form, err));
      },
    });
  }
}
