import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MarkOutOfScopeSchema } from '@cc/shared';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { zodValidator } from '../../core/forms/zod-validator';

export interface OutOfScopeData {
  count: number;
}

/** Asks why the selected items are not the contractor's work; the seller reads the reason on the quote. */
@Component({
  selector: 'cc-out-of-scope-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatButtonModule, ErrorMessagePipe],
  template: `
    <h2 mat-dialog-title>Not our scope</h2>
    <form [formGroup]="form" (ngSubmit)="confirm()" novalidate aria-label="Leave items out of the quote">
      <mat-dialog-content>
        <p>
          {{ data.count === 1 ? 'The selected item is' : 'The ' + data.count + ' selected items are' }} left out of the quote and
          marked as declined by you. The seller sees your reason.
        </p>
        <mat-form-field class="reason">
          <mat-label>Reason</mat-label>
          <textarea matInput rows="3" [formControl]="reason" data-testid="out-of-scope-reason"></textarea>
          <mat-error>{{ reason | errorMessage }}</mat-error>
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" data-testid="out-of-scope-confirm">Leave out</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: '.reason { width: 100%; }',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OutOfScopeDialog {
  private readonly dialogRef = inject<MatDialogRef<OutOfScopeDialog, string>>(MatDialogRef);
  protected readonly data = inject<OutOfScopeData>(MAT_DIALOG_DATA);
  protected readonly reason = new FormControl('', { nonNullable: true, validators: zodValidator(MarkOutOfScopeSchema.shape.reason) });
  /** The form directive handles the submit; without it the browser would submit the page itself. */
  protected readonly form = new FormGroup({ reason: this.reason });

  protected confirm(): void {
    if (this.reason.invalid) {
      this.reason.markAsTouched();
      return;
    }
    this.dialogRef.close(this.reason.value.trim());
  }
}
