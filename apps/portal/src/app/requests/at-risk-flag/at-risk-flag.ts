import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { RepairRequestSummary } from '@cc/shared';

/**
 * The at-risk flag of a request (approved work still open close to closing), read from the DTO's
 * `isAtRisk` that the server sets by the shared closing rule; nothing when the request is not at risk.
 * In a list the count is read out to screen readers only; on the request page it is shown.
 */
@Component({
  selector: 'cc-at-risk-flag',
  template: `
    @if (request().isAtRisk) {
      <span class="at-risk" data-testid="request-at-risk"
        >At risk<span [class.cdk-visually-hidden]="isCompact()">: {{ request().openWorkCount }} approved {{ request().openWorkCount === 1 ? 'item' : 'items' }} still open close to closing</span></span
      >
    }
  `,
  styles: `
    .at-risk {
      display: inline-block;
      margin-left: 6px;
      padding: 0 8px;
      border-radius: 10px;
      font: var(--mat-sys-label-medium);
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AtRiskFlag {
  readonly request = input.required<Pick<RepairRequestSummary, 'isAtRisk' | 'openWorkCount'>>();
  /** Whether only "At risk" shows (the count is still read out). */
  readonly isCompact = input(false);
}
