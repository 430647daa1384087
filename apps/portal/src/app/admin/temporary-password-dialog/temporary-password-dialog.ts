import { ClipboardModule } from '@angular/cdk/clipboard';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';

export interface TemporaryPasswordData {
  name: string;
  email: string;
  temporaryPassword: string;
}

/** Shows a reset password once, plainly, with what to do with it (no e-mail is sent yet). */
@Component({
  selector: 'cc-temporary-password-dialog',
  imports: [MatDialogModule, MatButtonModule, MatIconModule, ClipboardModule],
  template: `
    <h2 mat-dialog-title>Temporary password for {{ data.name }}</h2>
    <mat-dialog-content>
      <p>
        <strong>Shown only now.</strong> No e-mail is sent yet: give it to {{ data.name }} ({{ data.email }}) yourself, by phone or
        in person. They sign in with it and choose their own under “My account”. Their open sessions have ended.
      </p>
      <p class="password"><code data-testid="temporary-password">{{ data.temporaryPassword }}</code></p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-stroked-button type="button" [cdkCopyToClipboard]="data.temporaryPassword" (cdkCopyToClipboardCopied)="isCopied.set($event)">
        <mat-icon aria-hidden="true">content_copy</mat-icon>{{ isCopied() ? 'Copied' : 'Copy' }}
      </button>
      <button mat-flat-button type="button" mat-dialog-close data-testid="temporary-password-done">Done</button>
    </mat-dialog-actions>
  `,
  styles: '.password code { font-size: 1.4rem; letter-spacing: 0.08em; padding: 8px 12px; display: inline-block; background: var(--mat-sys-surface-container); border-radius: 8px; }',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TemporaryPasswordDialog {
  protected readonly data = inject<TemporaryPasswordData>(MAT_DIALOG_DATA);
  protected readonly isCopied = signal(false);
}
