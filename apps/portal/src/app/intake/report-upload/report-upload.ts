import { HttpEventType } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MAX_REPORT_BYTES, UploadResult } from '@cc/shared';
import { IntakeApi } from '../intake-api';
import { PasteReport } from '../paste-report/paste-report';
import { tooLarge, UploadFailure, uploadFailure } from './upload-failure';

/** Adds the inspection report to a request: a PDF or text file (chosen or dropped), or pasted text. */
@Component({
  selector: 'cc-report-upload',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, PasteReport],
  templateUrl: './report-upload.html',
  styleUrl: './report-upload.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReportUpload {
  private readonly api = inject(IntakeApi);

  readonly requestId = input.required<number>();
  /** The report was read; the result says how many items were proposed. */
  readonly parsed = output<UploadResult>();

  /** Percentage sent so far, or null when no upload is under way. */
  protected readonly progress = signal<number | null>(null);
  protected readonly isReading = signal(false);
  protected readonly fileName = signal<string | null>(null);
  protected readonly failure = signal<UploadFailure | null>(null);
  protected readonly isPasteOpen = signal(false);
  protected readonly isDragOver = signal(false);

  protected choose(event: Event): void {
    const input = event.target as HTMLInputElement;
    const file = input.files?.[0];
    input.value = '';
    if (file) this.upload(file);
  }

  protected dragOver(event: DragEvent): void {
    event.preventDefault();
    this.isDragOver.set(true);
  }

  protected drop(event: DragEvent): void {
    event.preventDefault();
    this.isDragOver.set(false);
    const file = event.dataTransfer?.files[0];
    if (file) this.upload(file);
  }

  protected togglePaste(): void {
    this.isPasteOpen.update((open) => !open);
  }

  protected pasted(result: UploadResult): void {
    this.failure.set(null);
    this.isPasteOpen.set(false);
    this.parsed.emit(result);
  }

  private upload(file: File): void {
    this.fileName.set(file.name);
    if (file.size > MAX_REPORT_BYTES) {
      this.fail(tooLarge());
      return;
    }
    this.failure.set(null);
    this.progress.set(0);
    this.isReading.set(false);
    this.api.upload(this.requestId(), file).subscribe({
      next: (event) => {
        if (event.type === HttpEventType.UploadProgress) {
          const total = event.total ?? file.size;
          this.progress.set(total ? Math.round((100 * event.loaded) / total) : 0);
          if (total && event.loaded >= total) this.isReading.set(true);
        } else if (event.type === HttpEventType.Response && event.body) {
          this.progress.set(null);
          this.isReading.set(false);
          this.parsed.emit(event.body);
        }
      },
      error: (err: unknown) => this.fail(uploadFailure(err)),
    });
  }

  private fail(failure: UploadFailure): void {
    this.progress.set(null);
    this.isReading.set(false);
    this.failure.set(failure);
    if (failure.offersPaste) this.isPasteOpen.set(true);
  }
}
