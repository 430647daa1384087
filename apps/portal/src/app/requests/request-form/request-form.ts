import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { provideNativeDateAdapter } from '@angular/material/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';
import {
  CreateRepairRequestSchema,
  defaultNecEdition,
  NEC_EDITIONS,
  NecEdition,
  Organisation,
  US_STATE_NAMES,
  US_STATES,
  UsState,
} from '@cc/shared';
import { catchError, of } from 'rxjs';
import { Auth } from '../../core/auth/auth';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { zodValidator } from '../../core/forms/zod-validator';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { Notice } from '../../core/http/notice';
import { dateFieldValidator } from '../../core/forms/date-validator';
import { toIsoDateOrEmpty } from '../../core/time/iso-date';
import { SafetyNotice } from '../../ui/safety-notice/safety-notice';
import { RequestsApi } from '../requests-api';

const field = CreateRepairRequestSchema.shape;

/** Starts a repair request for a sale: the property, the closing date, the parties and the contractor. */
@Component({
  selector: 'cc-request-form',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatDatepickerModule,
    MatButtonModule,
    ErrorMessagePipe,
    SafetyNotice,
  ],
  providers: [provideNativeDateAdapter()],
  templateUrl: './request-form.html',
  styleUrl: './request-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RequestForm {
  private readonly api = inject(RequestsApi);
  private readonly router = inject(Router);
  private readonly notice = inject(Notice);
  private readonly auth = inject(Auth);
  private readonly fb = inject(FormBuilder).nonNullable;

  protected readonly states = US_STATES;
  protected readonly stateNames = US_STATE_NAMES;
  protected readonly editions = NEC_EDITIONS;
  /** Whether the signed-in person names the buyer's agent (administrators do; agents are it). */
  protected readonly namesBuyerAgent = computed(() => this.auth.role() === 'admin');
  protected readonly contractors = toSignal(
    this.api.contractors().pipe(
      catchError((err: unknown) => {
        this.notice.failure(err);
        return of<Organisation[]>([]);
      }),
    ),
    { initialValue: [] },
  );

  protected readonly form = this.fb.group({
    street: ['', zodValidator(field.street)],
    city: ['', zodValidator(field.city)],
    state: this.fb.control<UsState | null>(null, zodValidator(field.state)),
    zip: ['', zodValidator(field.zip)],
    yearBuilt: this.fb.control<number | null>(null, zodValidator(field.yearBuilt)),
    closingDate: this.fb.control<Date | null>(null, dateFieldValidator(field.closingDate)),
    necEdition: this.fb.control<NecEdition | null>(null, zodValidator(field.necEdition)),
    buyerAgentEmail: ['', zodValidator(field.buyerAgentEmail)],
    listingAgentEmail: ['', zodValidator(field.listingAgentEmail)],
    sellerEmail: ['', zodValidator(field.sellerEmail)],
    inspectorEmail: ['', zodValidator(field.inspectorEmail)],
    contractorOrganisationId: this.fb.control<number | null>(null),
  });
  protected readonly formError = signal<string | null>(null);
  protected readonly isBusy = signal(false);

  /** A new state brings its usual NEC edition; the agent can still change it. */
  protected prefillEdition(state: UsState | null): void {
    this.form.controls.necEdition.setValue(defaultNecEdition(state));
  }

  protected create(): void {
    this.formError.set(null);
    const { closingDate, buyerAgentEmail, ...rest } = this.form.getRawValue();
    const parsed = CreateRepairRequestSchema.safeParse({
      ...rest,
      closingDate: toIsoDateOrEmpty(closingDate),
      buyerAgentEmail: this.namesBuyerAgent() ? buyerAgentEmail : null,
    });
    if (this.form.invalid || !parsed.success) {
      this.form.markAllAsTouched();
      this.formError.set('Some fields need attention.');
      return;
    }
    this.isBusy.set(true);
    this.api.create(parsed.data).subscribe({
      next: (created) => {
        this.isBusy.set(false);
        this.notice.success(`Request ${created.reference} started.`);
        void this.router.navigate(['/requests', created.id]);
      },
      error: (err: unknown) => {
        this.isBusy.set(false);
        this.formError.set(applyServerErrors(this.form, err) ?? 'Some fields need attention.');
      },
    });
  }
}
