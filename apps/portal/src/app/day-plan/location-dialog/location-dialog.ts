import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { LatitudeSchema, LongitudeSchema, Place, SetPropertyLocationSchema } from '@cc/shared';
import { Observable } from 'rxjs';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { zodValidator } from '../../core/forms/zod-validator';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { DayPlanApi } from '../day-plan-api';

export interface LocationData {
  requestId: number;
  address: string;
  place: Place | null;
}

/** Coordinates for a property, typed in or copied from a map pin; clearing them goes back to the ZIP code's centre. */
@Component({
  selector: 'cc-location-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, ErrorMessagePipe],
  template: `
    <h2 mat-dialog-title>Place the property</h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate aria-label="Coordinates of the property">
      <mat-dialog-content>
        <p class="what">{{ data.address }}</p>
        <p class="aside">
          @if (data.place?.source === 'pin') {
            Placed at the coordinates entered for it.
          } @else if (data.place) {
            Placed at the centre of its ZIP code area. Enter coordinates (decimal degrees) for a closer drive estimate.
          } @else {
            Its ZIP code is not in the ZIP-code list: enter coordinates (decimal degrees) so its drive can be counted.
          }
        </p>
        @if (formError(); as message) {
          <p class="cc-form-error" role="alert">{{ message }}</p>
        }
        <div class="pair">
          <mat-form-field>
            <mat-label>Latitude</mat-label>
            <input matInput type="number" step="any" formControlName="latitude" data-testid="location-latitude" />
            <mat-error>{{ form.controls.latitude | errorMessage }}</mat-error>
          </mat-form-field>
          <mat-form-field>
            <mat-label>Longitude</mat-label>
            <input matInput type="number" step="any" formControlName="longitude" data-testid="location-longitude" />
            <mat-error>{{ form.controls.longitude | errorMessage }}</mat-error>
          </mat-form-field>
        </div>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        @if (data.place?.source === 'pin') {
          <button mat-stroked-button type="button" (click)="send(null, null)" [disabled]="isBusy()">Use the ZIP code</button>
        }
        <button mat-flat-button type="submit" [disabled]="isBusy()" data-testid="location-save">Save the place</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .pair { display: flex; gap: 8px; }
    .pair mat-form-field { flex: 1; min-width: 0; }
    .what { font-weight: 600; margin-top: 0; }
    .aside { color: var(--mat-sys-on-surface-variant); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LocationDialog {
  protected readonly data = inject<LocationData>(MAT_DIALOG_DATA);
  private readonly ref = inject<MatDialogRef<LocationDialog, boolean>>(MatDialogRef);
  private readonly api = inject(DayPlanApi);
  private readonly fb = inject(FormBuilder);

  protected readonly form = this.fb.group({
    latitude: this.fb.control<number | null>(this.data.place?.source === 'pin' ? this.data.place.latitude : null, zodValidator(LatitudeSchema)),
    longitude: this.fb.control<number | null>(this.data.place?.source === 'pin' ? this.data.place.longitude : null, zodValidator(LongitudeSchema)),
  });
  protected readonly formError = signal<string | null>(null);
  protected readonly isBusy = signal(false);

  protected save(): void {
    const parsed = SetPropertyLocationSchema.safeParse(this.form.getRawValue());
    if (!parsed.success || parsed.data.latitude === null) {
      this.form.markAllAsTouched();
      return;
    }
    this.send(parsed.data.latitude, parsed.data.longitude);
  }

  protected send(latitude: number | null, longitude: number | null): void {
    this.isBusy.set(true);
    this.formError.set(null);
    this.api.setLocation(this.data.requestId, { latitude, longitude }).subscribe({
      next: () => this.ref.close(true),
      error: (err: unknown) => {
        this.isBusy.set(false);
        this.formError.set(applyServerErrors(this.form, err));
      },
    });
  }
}

/** Opens the dialog; emits true when the place changed. */
export function openLocation(dialog: MatDialog, data: LocationData): Observable<boolean | undefined> {
  return dialog.open<LocationDialog, LocationData, boolean>(LocationDialog, { data, width: '440px', maxWidth: '95vw' }).afterClosed();
}
