import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { Router } from '@angular/router';
import { SignInSchema } from '@cc/shared';
import { Auth } from '../../core/auth/auth';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { zodValidator } from '../../core/forms/zod-validator';

@Component({
  selector: 'cc-sign-in',
  imports: [ReactiveFormsModule, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule, ErrorMessagePipe],
  templateUrl: './sign-in.html',
  styleUrl: './sign-in.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignIn {
  private readonly auth = inject(Auth);
  private readonly router = inject(Router);

  /** Where to go after signing in (set by the guards as a query parameter). */
  readonly returnUrl = input<string>();

  protected readonly form = inject(FormBuilder).nonNullable.group({
    email: ['', zodValidator(SignInSchema.shape.email)],
    password: ['', zodValidator(SignInSchema.shape.password)],
  });
  protected readonly formError = signal<string | null>(null);
  protected readonly isBusy = signal(false);

  protected signIn(): void {
    this.formError.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.isBusy.set(true);
    this.auth.signIn(SignInSchema.parse(this.form.getRawValue())).subscribe({
      next: () => {
        this.isBusy.set(false);
        void this.router.navigateByUrl(this.safeReturnUrl());
      },
      error: (err: unknown) => {
        this.isBusy.set(false);
        this.formError.set(this.describe(err));
      },
    });
  }

  private describe(err: unknown): string | null {
    if (err instanceof HttpErrorResponse && err.status === 401) {
      return 'That e-mail address or password was not recognised.';
    }
    if (err instanceof HttpErrorResponse && err.status === 429) {
      return 'Too many sign-in attempts. Wait a few minutes, then try again.';
    }
    return applyServerErrors(this.form, err);
  }

  /** Only paths inside the portal, never another site. */
  private safeReturnUrl(): string {
    const url = this.returnUrl();
    return url && url.startsWith('/') && !url.startsWith('//') && !url.startsWith('/sign-in') ? url : '/requests';
  }
}
