import { inject, Injectable } from '@angular/core';
import { MatSnackBar } from '@angular/material/snack-bar';
import { describeFailure } from './api-error-of';

/** Short notices at the bottom of the screen, for outcomes that belong to no form field. */
@Injectable({ providedIn: 'root' })
export class Notice {
  private readonly snackBar = inject(MatSnackBar);

  /** Tells the person a request failed, in plain words. */
  failure(err: unknown): void {
    this.snackBar.open(describeFailure(err), 'Close', { duration: 8000, politeness: 'assertive' });
  }

  /** Confirms that something worked. */
  success(message: string): void {
    this.snackBar.open(message, undefined, { duration: 4000 });
  }
}
