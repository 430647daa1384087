import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { Electrician, MoveVisitResult, MoveVisitSchema } from '@cc/shared';
import { Observable } from 'rxjs';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { zodValidator } from '../../core/forms/zod-validator';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { DayPlanApi } from '../day-plan-api';

export interface MoveVisitData {
  visitId: number;
  address: string;
  date: string;
  electricianId: number;
  arrivalFrom: string;
  arrivalTo: string;
  electricians: Electrician[];
}

const clock = MoveVisitSchema.shape;

/** Moves a booked visit to another day, electrician or arrival window; the seller side is told the new window. */
@Component({
  selector: 'cc-move-visit-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule, ErrorMessagePipe],
  template: `
    <h2 mat-dialog-title>Move the visit</h2>
    <form [formGroup]="form" (ngSubmit)="move()" novalidate aria-label="Move the visit">
      <mat-dialog-content>
        <p class="what">{{ data.address }}</p>
        @if (formError(); as message) {
          <p class="cc-form-error" role="alert">{{ message }}</p>
        }
        <mat-form-field>
          <mat-label>Date</mat-label>
          <input matInput type="date" formControlName="date" data-testid="move-date" />
          <mat-error>{{ form.controls.date | errorMessage }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Electrician</mat-label>
          <mat-select formControlName="electricianId" data-testid="move-electrician">
            @for (person of data.electricians; track person.id) {
              <mat-option [value]="person.id">{{ person.name }}</mat-option>
            }
          </mat-select>
          <mat-error>{{ form.controls.electricianId | errorMessage }}</mat-error>
        </mat-form-field>
        <div class="times">
          <mat-form-field>
            <mat-label>Arrival from</mat-label>
            <input matInput type="time" formControlName="arrivalFrom" data-testid="move-from" />
            <mat-error>{{ form.controls.arrivalFrom | errorMessage }}</mat-error>
          </mat-form-field>
          <mat-form-field>
            <mat-label>Arrival until</mat-label>
            <input matInput type="time" formControlName="arrivalTo" data-testid="move-to" />
            <mat-error>{{ form.controls.arrivalTo | errorMessage }}</mat-error>
          </mat-form-field>
        </div>
        <p class="aside">The seller and the listing agent are told the new arrival window. Both days are planned again.</p>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close data-testid="move-cancel">Cancel</button>
        <button mat-flat-button type="submit" [disabled]="isBusy()" data-testid="move-go">Move the visit</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    form mat-form-field { width: 100%; }
    .times { display: flex; gap: 8px; }
    .times mat-form-field { flex: 1; min-width: 0; }
    .what { font-weight: 600; margin-top: 0; }
    .aside { color: var(--mat-sys-on-surface-variant); margin: 0; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MoveVisitDialog {
  protected readonly data = inject<MoveVisitData>(MAT_DIALOG_DATA);
  private readonly ref = inject<MatDialogRef<MoveVisitDialog, MoveVisitResult>>(MatDialogRef);
  private readonly api = inject(DayPlanApi);
  private readonly fb = inject(FormBuilder).nonNullable;

  protected readonly form = this.fb.group({
    date: [this.data.date, zodValidator(clock.date)],
    electricianId: [this.data.electricianId, zodValidator(clock.electricianId)],
    arrivalFrom: [this.data.arrivalFrom, zodValidator(clock.arrivalFrom)],
    arrivalTo: [this.data.arrivalTo, zodValidator(clock.arrivalTo)],
  });
  protected readonly formError = signal<string | null>(null);
  protected readonly isBusy = signal(false);

  protected move(): void {
    this.formError.set(null);
    const parsed = MoveVisitSchema.safeParse(this.form.getRawValue());
    if (!parsed.success) {
      this.form.markAllAsTouched();
      this.formError.set(parsed.error.issues[0]?.message ?? null);
      return;
    }
    this.isBusy.set(true);
    this.api.move(this.data.visitId, parsed.data).subscribe({
      next: (result) => this.ref.close(result),
      error: (err: unknown) => {
        this.isBusy.set(false);
        this.formError.set(applyServerErrors(this.form, err));
      },
    });
  }
}

/** Opens the move dialog; emits both days planned again when the visit moved (nothing when cancelled). */
export function openMoveVisit(dialog: MatDialog, data: MoveVisitData): Observable<MoveVisitResult | undefined> {
  return dialog.open<MoveVisitDialog, MoveVisitData, MoveVisitResult>(MoveVisitDialog, { data, width: '440px', maxWidth: '95vw' }).afterClosed();
}
