import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { FormBuilder, FormGroupDirective, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { ChangePasswordSchema, ROLE_LABELS } from '@cc/shared';
import { Auth } from '../../core/auth/auth';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { zodValidator } from '../../core/forms/zod-validator';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { Notice } from '../../core/http/notice';
import { MessagePreferences } from '../../notifications/message-preferences/message-preferences';

@Component({
  selector: 'cc-my-account',
  imports: [ReactiveFormsModule, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule, ErrorMessagePipe, MessagePreferences],
  templateUrl: './my-account.html',
  styleUrl: './my-account.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MyAccount {
  private readonly auth = inject(Auth);
  private readonly notice = inject(Notice);

  protected readonly user = this.auth.user;
  protected readonly roleLabel = computed(() => {
    const role = this.auth.role();
    return role ? ROLE_LABELS[role] : '';
  });
  protected readonly form = inject(FormBuilder).nonNullable.group({
    currentPassword: ['', zodValidator(ChangePasswordSchema.shape.currentPassword)],
    newPassword: ['', zodValidator(ChangePasswordSchema.shape.newPassword)],
  });
  protected readonly formError = signal<string | null>(null);
  protected readonly isBusy = signal(false);

  protected changePassword(formDirective: FormGroupDirective): void {
    this.formError.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.isBusy.set(true);
    this.auth.changePassword(ChangePasswordSchema.parse(this.form.getRawValue())).subscribe({
      next: () => {
        this.isBusy.set(false);
        formDirective.resetForm();
        this.notice.success('Your password has been changed.');
      },
      error: (err: unknown) => {
        this.isBusy.set(false);
        this.formError.set(applyServerErrors(this.form, err));
      },
    });
  }
}
