import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { FLOW_ACTOR_LABELS, FlowActor, StatusChange } from '@cc/shared';
import { StatusChip } from '../../ui/status-chip/status-chip';

/** Every change of state of a request, newest first, as a vertical timeline. */
@Component({
  selector: 'cc-status-history',
  imports: [DatePipe, StatusChip],
  templateUrl: './status-history.html',
  styleUrl: './status-history.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StatusHistory {
  readonly history = input.required<StatusChange[]>();

  protected readonly newestFirst = computed(() => [...this.history()].sort((a, b) => b.at.localeCompare(a.at)));

  /** The part the person played in a change ("as the seller"), when the history recorded it. */
  protected partOf(change: StatusChange): string | null {
    return change.actor && change.actor in FLOW_ACTOR_LABELS ? `as ${FLOW_ACTOR_LABELS[change.actor as FlowActor]}` : null;
  }
}
