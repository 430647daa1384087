import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { AcceptedInvitation, AcceptInvitationSchema, Invitation, PARTY_ROLE_LABELS } from '@cc/shared';
import { catchError, map, Observable, of, startWith, switchMap } from 'rxjs';
import { Auth } from '../../core/auth/auth';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { zodValidator } from '../../core/forms/zod-validator';
import { describeFailure } from '../../core/http/api-error-of';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { InvitationsApi } from '../invitations-api';

type Loaded = { state: 'loading' } | { state: 'ready'; invitation: Invitation } | { state: 'failed'; message: string };

@Component({
  selector: 'cc-accept-invitation',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatCardModule,
    MatFormFieldModule,
    MatInputModule,
    MatButtonModule,
    MatProgressBarModule,
    ErrorMessagePipe,
  ],
  templateUrl: './accept-invitation.html',
  styleUrl: './accept-invitation.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AcceptInvitation {
  private readonly api = inject(InvitationsApi);
  private readonly auth = inject(Auth);
  private readonly router = inject(Router);

  /** The secret part of the invitation link (route parameter). */
  readonly token = input.required<string>();

  protected readonly loaded = toSignal(
    toObservable(this.token).pipe(
      switchMap((token) =>
        this.api.get(token).pipe(
          map((invitation): Loaded => ({ state: 'ready', invitation })),
          catchError((err: unknown) => of<Loaded>({ state: 'failed', message: describeFailure(err) })),
          startWith<Loaded>({ state: 'loading' }),
        ),
      ),
    ),
    { initialValue: { state: 'loading' } as Loaded },
  );
  protected readonly invitation = computed(() => {
    const loaded = this.loaded();
    return loaded.state === 'ready' ? loaded.invitation : null;
  });
  protected readonly failure = computed(() => {
    const loaded = this.loaded();
    return loaded.state === 'failed' ? loaded.message : null;
  });
  protected readonly partLabel = computed(() => {
    const invitation = this.invitation();
    return invitation ? PARTY_ROLE_LABELS[invitation.role] : '';
  });
  /** Whether the visitor is already signed in as the invited e-mail address. */
  protected readonly isSignedInAsInvitee = computed(() => {
    const invitation = this.invitation();
    return !!invitation && this.auth.user()?.email === invitation.email;
  });

  protected readonly form = inject(FormBuilder).nonNullable.group({
    name: ['', zodValidator(AcceptInvitationSchema.shape.name)],
    password: ['', zodValidator(AcceptInvitationSchema.shape.password)],
  });
  protected readonly formError = signal<string | null>(null);
  protected readonly isBusy = signal(false);

  protected createAccount(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.send(this.api.accept(this.token(), AcceptInvitationSchema.parse(this.form.getRawValue())));
  }

  protected acceptAsSignedIn(): void {
    this.send(this.api.accept(this.token(), {}));
  }

  private send(request: Observable<AcceptedInvitation>): void {
    this.formError.set(null);
    this.isBusy.set(true);
    request.subscribe({
      next: (accepted) => {
        this.isBusy.set(false);
        this.auth.useSession(accepted);
        // Straight to the request the invitation was for, not the list.
        void this.router.navigate(['/requests', accepted.requestId]);
      },
      error: (err: unknown) => {
        this.isBusy.set(false);
        this.formError.set(applyServerErrors(this.form, err));
      },
    });
  }
}
