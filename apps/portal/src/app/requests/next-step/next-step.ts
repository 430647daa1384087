import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { PartyRole, RequestStatus } from '@cc/shared';
import { Auth } from '../../core/auth/auth';
import { nextStepOf } from './next-step-text';

/** What the request waits for and who acts next, in every state, for the person looking at it. */
@Component({
  selector: 'cc-next-step',
  imports: [RouterLink, MatButtonModule, MatIconModule],
  templateUrl: './next-step.html',
  styleUrl: './next-step.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { 'data-testid': 'next-step' },
})
export class NextStepPanel {
  private readonly auth = inject(Auth);

  readonly requestId = input.required<number>();
  readonly status = input.required<RequestStatus>();
  readonly myParts = input.required<readonly PartyRole[]>();
  /** Whether to hide the link to the page the viewer is already on. */
  readonly isOnRequestPage = input(false);

  protected readonly step = computed(() => nextStepOf(this.status(), { role: this.auth.role() ?? 'seller', myParts: this.myParts() }));
  /** Moves made on the same page as the move before them share that move's link (one button, not two alike). */
  protected readonly sharesLinkAbove = computed(() => this.step().moves.map((m, i) => i > 0 && !!m.place && this.step().moves[i - 1].place?.text === m.place.text));
}
