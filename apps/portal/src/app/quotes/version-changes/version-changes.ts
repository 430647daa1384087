import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { locationText, QuoteChanges } from '@cc/shared';
import { codeLabel } from '../../ui/code-label';
import { formatCentsDelta, MoneyPipe } from '../../ui/money/money';

/** What a quote version changed against the one before: lines added, taken off and re-priced, and the total. */
@Component({
  selector: 'cc-version-changes',
  imports: [MoneyPipe],
  templateUrl: './version-changes.html',
  styleUrl: './version-changes.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class VersionChanges {
  readonly changes = input.required<QuoteChanges>();

  protected readonly label = codeLabel;
  protected readonly where = locationText;
  protected readonly delta = formatCentsDelta;

  protected isEmpty(changes: QuoteChanges): boolean {
    return changes.added.length + changes.removed.length + changes.changed.length === 0;
  }
}
