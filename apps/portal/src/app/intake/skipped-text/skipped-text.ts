import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatExpansionModule } from '@angular/material/expansion';
import { ReportFile } from '@cc/shared';
import { SKIP_REASON_LABELS } from './skip-reason-labels';

/** The passages of the reports that gave no item (roof, plumbing, negations…), for a second look. */
@Component({
  selector: 'cc-skipped-text',
  imports: [MatExpansionModule],
  templateUrl: './skipped-text.html',
  styleUrl: './skipped-text.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SkippedText {
  readonly reports = input.required<ReportFile[]>();

  protected readonly reasonLabels = SKIP_REASON_LABELS;
  protected readonly passages = computed(() =>
    this.reports().flatMap((report) => report.skipped.map((passage) => ({ ...passage, reportName: report.originalName, reportId: report.id }))),
  );
  protected readonly isSeveralReports = computed(() => this.reports().length > 1);
}
