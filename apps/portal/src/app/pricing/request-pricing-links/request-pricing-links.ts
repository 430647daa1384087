import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { actorsOf, mayMoveRequest, RepairRequestDetail, RequestStatus } from '@cc/shared';
import { Auth } from '../../core/auth/auth';
import { BallparkCard } from '../ballpark-card/ballpark-card';

/** States in which the assigned contractor prices the request. */
const PRICING_STATES: readonly RequestStatus[] = ['pricing', 'quoted'];
/** States before any price, when the ballpark range helps the agents and the contractor. */
const BALLPARK_STATES: readonly RequestStatus[] = ['intake', 'pricing'];

/**
 * The pricing side of a request on its detail page: a link to price it (assigned contractor), a link
 * to the quote once one was sent (every party), and the ballpark range before then (agents, contractor).
 */
@Component({
  selector: 'cc-request-pricing-links',
  imports: [RouterLink, MatButtonModule, MatIconModule, BallparkCard],
  templateUrl: './request-pricing-links.html',
  styleUrl: './request-pricing-links.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RequestPricingLinks {
  private readonly auth = inject(Auth);

  readonly request = input.required<RepairRequestDetail>();

  private readonly isAgent = computed(() => {
    const parts = this.request().myParts;
    return this.auth.role() === 'admin' || parts.includes('buyer-agent') || parts.includes('listing-agent');
  });
  private readonly isContractor = computed(() => this.auth.role() === 'contractor');

  protected readonly canPrice = computed(() => this.isContractor() && PRICING_STATES.includes(this.request().status));
  protected readonly hasQuote = computed(() => this.request().history.some((change) => change.to === 'quoted'));
  /** The seller's side decides and pays on the approval page; everyone else follows the decision there. */
  protected readonly decisionLinkLabel = computed(() => {
    const decides = this.request().status === 'quoted' && mayMoveRequest(actorsOf({ role: this.auth.role() ?? 'agent', myParts: this.request().myParts, isAssignedContractor: false }), 'approve', 'quoted');
    return decides ? 'Approve or decline the items' : 'Decision and payment';
  });
  protected readonly showsBallpark = computed(
    () =>
      (this.isAgent() || this.isContractor()) &&
      this.request().contractor !== null &&
      this.request().itemCount > 0 &&
      BALLPARK_STATES.includes(this.request().status),
  );
}
