import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { REQUEST_STATUS_LABELS, RequestStatus } from '@cc/shared';
import { statusTone } from './status-tone';

/** A request's state as a small labelled pill, toned by how far along the request is. */
@Component({
  selector: 'cc-status-chip',
  template: '<span class="dot" aria-hidden="true"></span>{{ label() }}',
  styleUrl: './status-chip.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { '[attr.data-tone]': 'tone()', '[attr.data-status]': 'status()' },
})
export class StatusChip {
  readonly status = input.required<RequestStatus>();

  protected readonly label = computed(() => REQUEST_STATUS_LABELS[this.status()]);
  protected readonly tone = computed(() => statusTone(this.status()));
}
