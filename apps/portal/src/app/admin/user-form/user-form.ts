import { ChangeDetectionStrategy, Component, inject, output, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, FormGroupDirective, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { CreateUserSchema, Organisation, Role, ROLE_LABELS, ROLES, User } from '@cc/shared';
import { catchError, map, of } from 'rxjs';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { zodValidator } from '../../core/forms/zod-validator';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { Notice } from '../../core/http/notice';
import { AdminApi } from '../admin-api';

const field = CreateUserSchema.shape;

/** Makes an account with an initial password the person changes after signing in. */
@Component({
  selector: 'cc-user-form',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, ErrorMessagePipe],
  templateUrl: './user-form.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UserForm {
  private readonly api = inject(AdminApi);
  private readonly notice = inject(Notice);
  private readonly fb = inject(FormBuilder).nonNullable;

  readonly created = output<User>();

  protected readonly roles = ROLES.map((role) => ({ role, label: ROLE_LABELS[role] }));
  /** Organisations to attach the account to (the first hundred, enough for a pick list). */
  protected readonly organisations = toSignal(
    this.api.organisations({ page: 0, pageSize: 100 }).pipe(
      map((page) => page.items),
      catchError((err: unknown) => {
        this.notice.failure(err);
        return of<Organisation[]>([]);
      }),
    ),
    { initialValue: [] },
  );
  protected readonly form = this.fb.group({
    email: ['', zodValidator(field.email)],
    name: ['', zodValidator(field.name)],
    role: this.fb.control<Role | null>(null, zodValidator(field.role)),
    organisationId: this.fb.control<number | null>(null),
    password: ['', zodValidator(field.password)],
  });
  protected readonly formError = signal<string | null>(null);
  protected readonly isBusy = signal(false);

  protected create(formDirective: FormGroupDirective): void {
    this.formError.set(null);
    const parsed = CreateUserSchema.safeParse(this.form.getRawValue());
    if (this.form.invalid || !parsed.success) {
      this.form.markAllAsTouched();
      return;
    }
    this.isBusy.set(true);
    this.api.createUser(parsed.data).subscribe({
      next: (user) => {
        this.isBusy.set(false);
        formDirective.resetForm();
        this.created.emit(user);
      },
      error: (err: unknown) => {
        this.isBusy.set(false);
        this.formError.set(applyServerErrors(this.form, err));
      },
    });
  }
}
