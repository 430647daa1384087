import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/** Reminds everyone that the electrical work itself belongs to licensed people working under permit. */
@Component({
  selector: 'cc-safety-notice',
  imports: [MatIconModule],
  templateUrl: './safety-notice.html',
  styleUrl: './safety-notice.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { '[class.is-boxed]': 'isBoxed()', role: 'note', 'aria-label': 'Safety notice' },
})
export class SafetyNotice {
  /** Whether the notice stands out as a box (on a page) rather than a line of small print. */
  readonly isBoxed = input(false);
}
