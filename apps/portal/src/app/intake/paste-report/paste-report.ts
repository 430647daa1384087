import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { FormBuilder, FormGroupDirective, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { PasteReportSchema, UploadResult } from '@cc/shared';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { zodValidator } from '../../core/forms/zod-validator';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { IntakeApi } from '../intake-api';

/** The second way in: the report's electrical findings pasted as text. */
@Component({
  selector: 'cc-paste-report',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule, ErrorMessagePipe],
  templateUrl: './paste-report.html',
  styleUrl: './paste-report.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PasteReport {
  private readonly api = inject(IntakeApi);
  private readonly fb = inject(FormBuilder).nonNullable;

  readonly requestId = input.required<number>();
  readonly parsed = output<UploadResult>();

  protected readonly form = this.fb.group({
    text: ['', zodValidator(PasteReportSchema.shape.text)],
    name: ['', zodValidator(PasteReportSchema.shape.name)],
  });
  protected readonly formError = signal<string | null>(null);
  protected readonly isBusy = signal(false);

  protected send(formDirective: FormGroupDirective): void {
    this.formError.set(null);
    const { text, name } = this.form.getRawValue();
    const parsed = PasteReportSchema.safeParse({ text, name: name.trim() || undefined });
    if (!parsed.success) {
      this.form.markAllAsTouched();
      return;
    }
    this.isBusy.set(true);
    this.api.paste(this.requestId(), parsed.data).subscribe({
      next: (result) => {
        this.isBusy.set(false);
        formDirective.resetForm();
        this.parsed.emit(result);
      },
      error: (err: unknown) => {
        this.isBusy.set(false);
        this.formError.set(applyServerErrors(this.form, err));
      },
    });
  }
}
