import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, linkedSignal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { mayAct, RepairRequestDetail, REQUEST_ACTIONS } from '@cc/shared';
import { catchError, map, of, switchMap } from 'rxjs';
import { Auth } from '../../core/auth/auth';
import { describeFailure } from '../../core/http/api-error-of';
import { Notice } from '../../core/http/notice';
import { ActivityTimeline } from '../../activity/activity-timeline/activity-timeline';
import { IntakePanel } from '../../intake/intake-panel/intake-panel';
import { RequestPricingLinks } from '../../pricing/request-pricing-links/request-pricing-links';
import { RequestWorkLink } from '../../work/request-work-link/request-work-link';
import { DaysToClosing } from '../../ui/days-to-closing/days-to-closing';
import { SafetyNotice } from '../../ui/safety-notice/safety-notice';
import { StatusChip } from '../../ui/status-chip/status-chip';
import { ContractorPicker } from '../contractor-picker/contractor-picker';
import { InvitePartyForm } from '../invite-party-form/invite-party-form';
import { NextStepPanel } from '../next-step/next-step';
import { PartyList } from '../party-list/party-list';
import { RequestsApi } from '../requests-api';
import { StatusHistory } from '../status-history/status-history';
import { VisitPrep } from '../../economics/visit-prep/visit-prep';
import { AtRiskFlag } from '../at-risk-flag/at-risk-flag';

type Loaded = { detail: RepairRequestDetail; error?: undefined } | { detail?: undefined; error: string };

/** One repair request: the property, the sale, the people, the contractor and what happened so far. */
@Component({
  selector: 'cc-request-detail',
  imports: [
    AtRiskFlag,
    DatePipe,
    RouterLink,
    MatCardModule,
    MatIconModule,
    MatProgressBarModule,
    StatusChip,
    DaysToClosing,
    SafetyNotice,
    StatusHistory,
    PartyList,
    InvitePartyForm,
    ContractorPicker,
    IntakePanel,
    RequestPricingLinks,
    NextStepPanel,
    RequestWorkLink,
    ActivityTimeline,
    VisitPrep,
  ],
  templateUrl: './request-detail.html',
  styleUrl: './request-detail.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RequestDetail {
  private readonly api = inject(RequestsApi);
  private readonly auth = inject(Auth);
  private readonly notice = inject(Notice);

  /** The request id (route parameter). */
  readonly id = input.required<string>();

  private readonly loaded = toSignal(
    toObservable(this.id).pipe(
      switchMap((id) =>
        this.api.get(Number(id)).pipe(
          map((detail): Loaded => ({ detail })),
          catchError((err: unknown) => of<Loaded>({ error: describeFailure(err) })),
        ),
      ),
    ),
  );
  /** The request as last answered by the server (replaced after an invitation). */
  protected readonly detail = linkedSignal(() => this.loaded()?.detail ?? null);
  protected readonly loadError = computed(() => this.loaded()?.error ?? null);
  private readonly actors = computed(() => {
    const detail = this.detail();
    return detail ? this.auth.actorsOn(detail) : [];
  });
  /** Whether the signed-in person invites parties here now (the request's agents, an administrator). */
  protected readonly canInvite = computed(() => mayAct(this.actors(), 'invite-party', this.detail()?.status ?? 'draft'));
  /** Whether they see the invitation links: those who invite, whatever the state. */
  protected readonly seesInviteLinks = computed(() => this.actors().some((a) => REQUEST_ACTIONS['invite-party'].by.includes(a)));
  /** Whether the contractor may still be chosen or changed by them (until a quote is sent). */
  protected readonly canChangeContractor = computed(() => mayAct(this.actors(), 'change-contractor', this.detail()?.status ?? 'draft'));

  /** Loads the request again after its state moved on (a report added, the items confirmed). */
  protected refresh(id: number): void {
    this.api.get(id).subscribe({ next: (detail) => this.detail.set(detail), error: (err: unknown) => this.notice.failure(err) });
  }

  protected showContractor(detail: RepairRequestDetail): void {
    this.detail.set(detail);
    this.notice.success(`${detail.contractor?.name ?? 'The contractor'} is now the request's contractor.`);
  }

  /** The form also shows the link, to pass on by hand if the e-mail does not arrive. */
  protected showInvited(detail: RepairRequestDetail): void {
    this.detail.set(detail);
    this.notice.success('Invitation e-mailed. The link is also shown beside their name, to pass on if the e-mail does not arrive.');
  }
}
