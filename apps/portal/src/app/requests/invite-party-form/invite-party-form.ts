import { ClipboardModule } from '@angular/cdk/clipboard';
import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { FormBuilder, FormGroupDirective, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { InviteParty, InvitePartySchema, PARTY_ROLE_LABELS, RepairRequestDetail } from '@cc/shared';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { zodValidator } from '../../core/forms/zod-validator';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { RequestsApi } from '../requests-api';

type InvitableRole = InviteParty['role'];

/** Invites one more person (listing agent, seller or inspector) to a request. */
@Component({
  selector: 'cc-invite-party-form',
  imports: [ReactiveFormsModule, ClipboardModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, MatIconModule, ErrorMessagePipe],
  templateUrl: './invite-party-form.html',
  styleUrl: './invite-party-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InvitePartyForm {
  private readonly api = inject(RequestsApi);
  private readonly fb = inject(FormBuilder).nonNullable;

  readonly requestId = input.required<number>();
  /** The request as the server answered after the invitation. */
  readonly invited = output<RepairRequestDetail>();

  protected readonly roles = InvitePartySchema.shape.role.options.map((role) => ({ role, label: PARTY_ROLE_LABELS[role] }));
  protected readonly form = this.fb.group({
    role: this.fb.control<InvitableRole | null>(null, zodValidator(InvitePartySchema.shape.role)),
    email: ['', zodValidator(InvitePartySchema.shape.email)],
  });
  protected readonly formError = signal<string | null>(null);
  protected readonly isBusy = signal(false);
  /** The invitation just made: no e-mail goes out yet, so its link is shown to pass on by hand. */
  protected readonly made = signal<{ email: string; role: string; url: string | null } | null>(null);
  protected readonly isCopied = signal(false);

  protected invite(formDirective: FormGroupDirective): void {
    this.formError.set(null);
    const parsed = InvitePartySchema.safeParse(this.form.getRawValue());
    if (!parsed.success) {
      this.form.markAllAsTouched();
      return;
    }
    this.isBusy.set(true);
    this.made.set(null);
    this.isCopied.set(false);
    this.api.inviteParty(this.requestId(), parsed.data).subscribe({
      next: (detail) => {
        this.isBusy.set(false);
        formDirective.resetForm();
        const party = detail.parties.find((p) => p.email === parsed.data.email && p.role === parsed.data.role);
        this.made.set({ email: parsed.data.email, role: PARTY_ROLE_LABELS[parsed.data.role], url: party?.inviteUrl ?? null });
        this.invited.emit(detail);
      },
      error: (err: unknown) => {
        this.isBusy.set(false);
        this.formError.set(applyServerErrors(this.form, err));
      },
    });
  }
}
