import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { Organisation } from '@cc/shared';
import { OrganisationForm } from '../organisation-form/organisation-form';

/** Edits an organisation's name, contact and licence in a dialog; closes with the saved record. */
@Component({
  selector: 'cc-organisation-edit-dialog',
  imports: [MatDialogModule, MatButtonModule, OrganisationForm],
  template: `
    <h2 mat-dialog-title>Edit {{ organisation.name }}</h2>
    <mat-dialog-content>
      <cc-organisation-form [organisation]="organisation" (created)="dialogRef.close($event)" />
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close>Cancel</button>
    </mat-dialog-actions>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OrganisationEditDialog {
  protected readonly organisation = inject<Organisation>(MAT_DIALOG_DATA);
  protected readonly dialogRef = inject<MatDialogRef<OrganisationEditDialog, Organisation>>(MatDialogRef);
}
