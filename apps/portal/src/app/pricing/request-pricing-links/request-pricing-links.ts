import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { mayAct, RepairRequestDetail } from '@cc/shared';
import { Auth } from '../../core/auth/auth';
import { BallparkCard } from '../ballpark-card/ballpark-card';

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

  private readonly actors = computed(() => this.auth.actorsOn(this.request()));

  protected readonly canPrice = computed(() => mayAct(this.actors(), 'price', this.request().status));
  protected readonly hasQuote = computed(() => this.request().history.some((change) => change.to === 'quoted'));
  /** The ballpark range, before any price, for the agents and the contractor (the flow table's `estimate`). */
  protected readonly showsBallpark = computed(
    () => mayAct(this.actors(), 'estimate', this.request().status) && this.request().contractor !== null && this.request().itemCount > 0,
  );
}
