import { NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { HttpErrorResponse } from '@angular/common/http';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router } from '@angular/router';
import { NOT_A_PDF_MESSAGE, PdfCheck } from '@cc/shared';
import { of } from 'rxjs';
import { apiErrorOf, describeFailure } from '../../core/http/api-error-of';
import { WorkApi } from '../work-api';

const MAX_PDF_BYTES = 20 * 1024 * 1024;
/** Whether a chosen file says it is a PDF (by type or name; the server checks the bytes). */
const looksLikePdf = (file: File): boolean => file.type === 'application/pdf' || /\.pdf$/i.test(file.name);

/**
 * The public page a completion letter's QR code opens: no sign-in, no personal data. It confirms the
 * letter's number, revision, issue date, item count and hash, and tells whether an uploaded PDF is the
 * genuine, current letter.
 */
@Component({
  selector: 'cc-verify-letter',
  imports: [FormsModule, NgTemplateOutlet, MatButtonModule, MatCardModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule],
  templateUrl: './verify-letter.html',
  styleUrl: './verify-letter.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class VerifyLetter {
  private readonly api = inject(WorkApi);
  private readonly router = inject(Router);

  /** The verification code (route parameter), if the page was opened from a letter. */
  readonly code = input<string | undefined>(undefined);

  protected readonly letter = rxResource({
    params: () => this.code()?.trim().toUpperCase() || null,
    stream: ({ params }) => (params ? this.api.verify(params) : of(null)),
  });
  /** The letter found, read only once the lookup succeeded (a resource in error throws on value()). */
  protected readonly found = computed(() => (this.letter.hasValue() ? this.letter.value() : null));
  /** Whether the code names no letter (404), as opposed to a lookup that failed for another reason. */
  protected readonly isUnknownCode = computed(() => {
    const err = this.letter.error();
    return err instanceof HttpErrorResponse && err.status === 404;
  });
  protected readonly lookupError = computed(() => (this.letter.error() && !this.isUnknownCode() ? describeFailure(this.letter.error()) : null));
  protected typedCode = '';

  protected readonly check = signal<PdfCheck | null>(null);
  protected readonly checkError = signal<string | null>(null);
  /** The problem with the chosen file itself (not a PDF, too large), shown under the file picker. */
  protected readonly fileError = signal<string | null>(null);
  protected readonly isChecking = signal(false);

  /** Said when "Look up" is pressed with no code typed. */
  protected readonly codeError = signal<string | null>(null);

  protected lookUp(): void {
    const code = this.typedCode.trim().toUpperCase();
    if (!code) {
      this.codeError.set('Enter the verification code printed on the letter.');
      return;
    }
    void this.router.navigate(['/verify', code]);
  }

  protected checkFile(picker: HTMLInputElement): void {
    const file = picker.files?.[0];
    picker.value = '';
    this.check.set(null);
    this.checkError.set(null);
    this.fileError.set(null);
    if (!file) return;
    if (!looksLikePdf(file)) {
      this.fileError.set(NOT_A_PDF_MESSAGE);
      return;
    }
    if (file.size > MAX_PDF_BYTES) {
      this.fileError.set('That file is larger than any letter we issue (20 MB).');
      return;
    }
    this.isChecking.set(true);
    this.api.checkPdf(file, this.code()?.trim().toUpperCase() || null).subscribe({
      next: (result) => {
        this.isChecking.set(false);
        this.check.set(result);
      },
      error: (err: unknown) => {
        this.isChecking.set(false);
        const onFile = apiErrorOf(err)?.details.find((d) => d.path === 'file');
        if (onFile) this.fileError.set(onFile.message);
        else this.checkError.set(describeFailure(err));
      },
    });
  }
}
