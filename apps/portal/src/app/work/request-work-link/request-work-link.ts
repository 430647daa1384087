import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { RepairRequestDetail } from '@cc/shared';

/** On a request's page, the way to its visits and proof once the seller approved work. */
@Component({
  selector: 'cc-request-work-link',
  imports: [RouterLink, MatButtonModule, MatIconModule],
  template: `
    @if (hasWork()) {
      <a mat-flat-button [routerLink]="['/requests', request().id, 'work']" data-testid="request-work-link">
        <mat-icon aria-hidden="true">construction</mat-icon>Visits and proof
      </a>
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'work-link' },
})
export class RequestWorkLink {
  readonly request = input.required<RepairRequestDetail>();

  /** Whether the request reached approved work (it shows the visits, corrections and letter from then on). */
  protected readonly hasWork = computed(() => this.request().history.some((change) => change.to === 'approved'));
}
