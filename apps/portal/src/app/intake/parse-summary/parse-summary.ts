import { ChangeDetectionStrategy, Component, input } from '@angular/core';
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
}
