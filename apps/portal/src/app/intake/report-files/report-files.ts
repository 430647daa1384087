import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { ReportFile, UploadResult } from '@cc/shared';
import { Notice } from '../../core/http/notice';
import { IntakeApi } from '../intake-api';

/** The reports added to a request, each of which the agent can have read again. */
@Component({
  selector: 'cc-report-files',
  imports: [DatePipe, MatButtonModule, MatIconModule],
  templateUrl: './report-files.html',
  styleUrl: './report-files.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReportFiles {
  private readonly api = inject(IntakeApi);
  private readonly notice = inject(Notice);

  readonly requestId = input.required<number>();
  readonly reports = input.required<ReportFile[]>();
  /** A report was read again; the items may have changed. */
  readonly reread = output<UploadResult>();

  protected readonly busyId = signal<number | null>(null);

  protected readAgain(report: ReportFile): void {
    this.busyId.set(report.id);
    this.api.reparse(this.requestId(), report.id).subscribe({
      next: (result) => {
        this.busyId.set(null);
        this.reread.emit(result);
      },
      error: (err: unknown) => {
        this.busyId.set(null);
        this.notice.failure(err);
      },
    });
  }
}
