import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule } from '@angular/material/dialog';
import { Observable, map } from 'rxjs';

export interface ConfirmData {
  title: string;
  /** What will happen, and whether it can be undone. */
  message: string;
  /** The verb on the button that goes ahead, e.g. "Remove item". */
  confirmLabel: string;
}

/** Asks once before something that cannot be taken back; "Cancel" comes first, so it has the focus. */
@Component({
  selector: 'cc-confirm-dialog',
  imports: [MatDialogModule, MatButtonModule],
  template: `
    <h2 mat-dialog-title>{{ data.title }}</h2>
    <mat-dialog-content>
      <p data-testid="confirm-message">{{ data.message }}</p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false" data-testid="confirm-cancel">Cancel</button>
      <button mat-flat-button type="button" [mat-dialog-close]="true" data-testid="confirm-go">{{ data.confirmLabel }}</button>
    </mat-dialog-actions>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ConfirmDialog {
  protected readonly data = inject<ConfirmData>(MAT_DIALOG_DATA);
}

/** Opens the confirmation; emits true only when the person chose to go ahead. */
export function askToConfirm(dialog: MatDialog, data: ConfirmData): Observable<boolean> {
  return dialog
    .open<ConfirmDialog, ConfirmData, boolean>(ConfirmDialog, { data, width: '440px', maxWidth: '95vw' })
    .afterClosed()
    .pipe(map((answer) => answer === true));
}
