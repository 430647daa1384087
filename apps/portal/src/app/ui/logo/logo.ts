import { ChangeDetectionStrategy, Component, input } from '@angular/core';

/**
 * The Closing Circuit mark: a house outline whose bottom edge is a switch about to close, with a check
 * inside. Decorative unless `label` is given.
 */
@Component({
  selector: 'cc-logo',
  templateUrl: './logo.html',
  styleUrl: './logo.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Logo {
  /** Pixel size of the square mark. */
  readonly size = input(32);
  /** Whether the name is written beside the mark. */
  readonly withName = input(true);
}
