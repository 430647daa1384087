import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { CANCEL_REASON_MAX, CancelSiteVisitSchema, SiteVisit } from '@cc/shared';
import { Observable } from 'rxjs';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { zodValidator } from '../../core/forms/zod-validator';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { WorkApi } from '../work-api';

export interface CancelVisitData {
  requestId: number;
  visitId: number;
  visitNumber: number;
  /** The version shown: a visit started or moved since answers 409. */
  version: number;
  /** What is being called off, in words ("Tue, Feb 9, 08:00–10:00 · 14 Elm Street"). */
  what: string;
}

/**
 * Calls off a booked visit (the request page and the day plan open it): the reason is required and
 * told to the seller's side and the electrician; the visit stays in the history as cancelled.
 */
@Component({
  selector: 'cc-cancel-visit-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, ErrorMessagePipe],
  template: `
    <h2 mat-dialog-title>Cancel visit {{ data.visitNumber }}</h2>
    <form [formGroup]="form" (ngSubmit)="cancel()" novalidate aria-label="Cancel the visit">
      <mat-dialog-content>
        <p class="what">{{ data.what }}</p>
        @if (formError(); as message) {
          <p class="cc-form-error" role="alert" data-testid="cancel-visit-error">{{ message }}</p>
        }
        <mat-form-field>
          <mat-label>Why is the visit cancelled?</mat-label>
          <textarea matInput formControlName="reason" rows="3" [attr.maxlength]="max" cdkFocusInitial data-testid="cancel-visit-reason"></textarea>
          <mat-hint>The seller, both agents and the electrician are told, with this reason.</mat-hint>
          <mat-error data-testid="cancel-visit-reason-error">{{ form.controls.reason | errorMessage }}</mat-error>
        </mat-form-field>
        <p class="aside">The visit stays in the history as cancelled. Its items wait for another visit; if it was the last visit booked, the request goes back to “Approved”.</p>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close data-testid="cancel-visit-keep">Keep the visit</button>
        <button mat-flat-button type="submit" [disabled]="isBusy()" data-testid="cancel-visit-go">Cancel the visit</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    form mat-form-field { width: 100%; }
    .what { font-weight: 600; margin-top: 0; }
    .aside { color: var(--mat-sys-on-surface-variant); margin: 8px 0 0; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CancelVisitDialog {
  protected readonly data = inject<CancelVisitData>(MAT_DIALOG_DATA);
  private readonly ref = inject<MatDialogRef<CancelVisitDialog, SiteVisit>>(MatDialogRef);
  private readonly api = inject(WorkApi);
  protected readonly max = CANCEL_REASON_MAX;

  protected readonly form = inject(FormBuilder).nonNullable.group({
    reason: ['', zodValidator(CancelSiteVisitSchema.shape.reason)],
  });
  protected readonly formError = signal<string | null>(null);
  protected readonly isBusy = signal(false);

  protected cancel(): void {
    this.formError.set(null);
    const parsed = CancelSiteVisitSchema.safeParse({ reason: this.form.controls.reason.value, version: this.data.version });
    if (!parsed.success) {
      this.form.markAllAsTouched();
      return;
    }
    this.isBusy.set(true);
    this.api.cancelVisit(this.data.requestId, this.data.visitId, parsed.data).subscribe({
      next: (visit) => this.ref.close(visit),
      error: (err: unknown) => {
        this.isBusy.set(false);
        this.formError.set(applyServerErrors(this.form, err));
      },
    });
  }
}

/** Opens the cancel dialog; emits the cancelled visit (nothing when the person kept it). */
export function openCancelVisit(dialog: MatDialog, data: CancelVisitData): Observable<SiteVisit | undefined> {
  return dialog.open<CancelVisitDialog, CancelVisitData, SiteVisit>(CancelVisitDialog, { data, width: '480px', maxWidth: '95vw' }).afterClosed();
}
