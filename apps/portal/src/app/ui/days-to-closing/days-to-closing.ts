import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { closingUrgency, daysToClosing } from '@cc/shared';
import { Clock } from '../../core/time/clock';
import { closingCountdown } from './closing-countdown';

/** How far away a closing date is, in words, marked by how pressing it is. */
@Component({
  selector: 'cc-days-to-closing',
  template: `@if (urgency() === 'passed' || urgency() === 'this-week') {
      <span class="flag" aria-hidden="true"></span>
    }{{ text() }}`,
  styleUrl: './days-to-closing.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { '[attr.data-urgency]': 'urgency()' },
})
export class DaysToClosing {
  private readonly clock = inject(Clock);

  /** The closing date as `YYYY-MM-DD`. */
  readonly closingDate = input.required<string>();

  protected readonly days = computed(() => daysToClosing(this.closingDate(), this.clock.today()));
  protected readonly urgency = computed(() => closingUrgency(this.days()));
  protected readonly text = computed(() => closingCountdown(this.days()));
}
