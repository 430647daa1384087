import { DatePipe, formatDate } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatDialog } from '@angular/material/dialog';
import { RouterLink } from '@angular/router';
import {
  CORRECTION_OUTCOME_LABELS,
  FLOW_ACTOR_LABELS,
  ITEM_STATUS_LABELS,
  nextStepLines,
  placeLabel,
  SITE_VISIT_STATUS_LABELS,
  SiteVisit,
  WorkItem,
  WorkOverview,
  RETURN_CAUSE_LABELS,
} from '@cc/shared';
import { VisitPrep } from '../../economics/visit-prep/visit-prep';
import { describeFailure } from '../../core/http/api-error-of';
import { Clock } from '../../core/time/clock';
import { Notice } from '../../core/http/notice';
import { codeLabel } from '../../ui/code-label';
import { StatusChip } from '../../ui/status-chip/status-chip';
import { LetterPanel } from '../letter-panel/letter-panel';
import { endedSummary } from '../../requests/next-step/next-step-text';
import { ReadingList } from '../reading-list/reading-list';
import { VisitBooking } from '../visit-booking/visit-booking';
import { openCancelVisit } from '../cancel-visit-dialog/cancel-visit-dialog';
import { WorkApi } from '../work-api';
import { WorkCaution } from '../work-caution/work-caution';

/**
 * The proof side of one request: progress against closing, the site visits, each approved item's
 * outcome with its readings and photos, and the completion letter with its review.
 */
@Component({
  selector: 'cc-work-page',
  imports: [DatePipe, RouterLink, MatButtonModule, MatCardModule, MatIconModule, MatProgressBarModule, StatusChip, WorkCaution, ReadingList, VisitBooking, LetterPanel, VisitPrep],
  templateUrl: './work-page.html',
  styleUrl: './work-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WorkPage {
  private readonly api = inject(WorkApi);
  private readonly notice = inject(Notice);
  private readonly clock = inject(Clock);
  private readonly dialog = inject(MatDialog);

  /** The request id (route parameter). */
  readonly id = input.required<string>();

  protected readonly work = rxResource({ params: () => Number(this.id()), stream: ({ params }) => this.api.overview(params) });
  protected readonly overview = computed(() => (this.work.hasValue() ? this.work.value() : null));
  protected readonly loadError = computed(() => (this.work.error() ? describeFailure(this.work.error()) : null));

  protected readonly codeLabel = codeLabel;
  protected readonly place = placeLabel;
  protected readonly itemStatusLabels = ITEM_STATUS_LABELS;
  protected readonly outcomeLabels = CORRECTION_OUTCOME_LABELS;
  protected readonly visitStatusLabels = SITE_VISIT_STATUS_LABELS;
  protected readonly returnCauseLabels = RETURN_CAUSE_LABELS;
  /** The items as the visit preparation names them. */
  protected readonly prepItems = computed(() => (this.overview()?.items ?? []).map((i) => ({ id: i.id, label: `${codeLabel(i.code)} — ${i.location}` })));

  /**
   * What happens next and who acts, from the flow table (detours such as a change order only where one
   * applies); first, a visit still marked on site, which the contractor finishes when the electrician left.
   */
  protected readonly nextSteps = computed(() => {
    const o = this.overview();
    if (!o) return [];
    const onSite = o.visits.filter((v) => v.status === 'started').map((v) => `Finish visit ${v.number} (on site): ${FLOW_ACTOR_LABELS.contractor}`);
    return [...onSite, ...nextStepLines(o.status, { resolved: o.closing.resolvedCount, approved: o.closing.approvedCount })];
  });
  /** An ended request: what is left of it (money may still come in at closing), as the request page says. */
  protected readonly ended = computed(() => {
    const o = this.overview();
    return o ? endedSummary(o.status) : '';
  });
  protected readonly progressPercent = computed(() => {
    const c = this.overview()?.closing;
    return c && c.approvedCount ? Math.round((100 * c.resolvedCount) / c.approvedCount) : 0;
  });

  protected itemsOf(o: WorkOverview, visit: SiteVisit): WorkItem[] {
    return o.items.filter((i) => visit.itemIds.includes(i.id));
  }

  protected visitNumberOf(o: WorkOverview, item: WorkItem): number | null {
    return o.visits.find((v) => v.id === item.siteVisitId)?.number ?? null;
  }

  /** A booked visit whose day has not come: starting it moves it to today (the server tells the seller's side). */
  protected isEarly(visit: SiteVisit): boolean {
    return visit.status === 'booked' && visit.date > this.clock.today();
  }

  /** What the person may do on one visit now: start or finish it (as before), or call off a booked one. */
  protected visitActions(o: WorkOverview, visit: SiteVisit): { start: boolean; finish: boolean; cancel: boolean } {
    const isOpen = visit.status === 'booked' || visit.status === 'started';
    return {
      start: visit.status === 'booked' && o.can.recordCorrections,
      finish: o.can.finishVisit && isOpen,
      cancel: visit.status === 'booked' && o.can.cancelVisit,
    };
  }

  protected cancelVisit(o: WorkOverview, visit: SiteVisit): void {
    const what = `${formatDate(visit.date, 'EEE, MMM d', 'en-US')}, ${visit.arrivalFrom}–${visit.arrivalTo} · ${visit.electrician.name} · ${o.street}`;
    openCancelVisit(this.dialog, { requestId: o.requestId, visitId: visit.id, visitNumber: visit.number, version: visit.version, what }).subscribe((cancelled) => {
      if (cancelled) this.reload(`Visit ${visit.number} cancelled. Its items wait for another visit.`);
    });
  }

  protected markVisit(o: WorkOverview, visit: SiteVisit, step: 'start' | 'finish'): void {
    this.api.markVisit(o.requestId, visit.id, step).subscribe({
      next: () => {
        this.notice.success(step === 'start' ? `Visit ${visit.number} started.` : `Visit ${visit.number} finished.`);
        this.work.reload();
      },
      error: (err: unknown) => this.notice.failure(err),
    });
  }

  protected resume(o: WorkOverview): void {
    this.api.resume(o.requestId).subscribe({
      next: (next) => {
        this.work.set(next);
        this.notice.success('The items not accepted are back in hand: book a visit for them.');
      },
      error: (err: unknown) => this.notice.failure(err),
    });
  }

  protected reload(message: string): void {
    this.notice.success(message);
    this.work.reload();
  }
}
