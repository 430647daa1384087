import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { UploadResult } from '@cc/shared';

/** What the reader made of the report just added. */
@Component({
  selector: 'cc-parse-summary',
  imports: [MatIconModule],
  templateUrl: './parse-summary.html',
  styleUrl: './parse-summary.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { role: 'status', 'data-testid': 'parse-result' },
})
export class ParseSummary {
  readonly result = input.required<UploadResult>();
  /** How many items the review list holds to confirm now (null while it loads). */
  readonly toConfirm = input<number | null>(null);

  /** Items in the list the reader did not propose this time: edited, added by hand or from another report. */
  protected readonly keptCount = computed(() => {
    const total = this.toConfirm();
    return total === null ? 0 : Math.max(0, total - this.result().proposedCount);
  });
}
