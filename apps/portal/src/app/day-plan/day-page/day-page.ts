import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import type { Subscription } from 'rxjs';
import { DayPlan, DayPlanStop, DayPlanSuggestion, Electrician, SITE_VISIT_STATUS_LABELS } from '@cc/shared';
import { Auth } from '../../core/auth/auth';
import { Notice } from '../../core/http/notice';
import { Clock } from '../../core/time/clock';
import { SafetyNotice } from '../../ui/safety-notice/safety-notice';
import { DayPlanApi } from '../day-plan-api';
import { openLocation } from '../location-dialog/location-dialog';
import { openMoveVisit } from '../move-visit-dialog/move-visit-dialog';
import { openCancelVisit } from '../../work/cancel-visit-dialog/cancel-visit-dialog';

/** One electrician's day: the visits in driving order with times, warnings, nearby jobs that fit, calendars. */
@Component({
  selector: 'cc-day-page',
  imports: [FormsModule, RouterLink, MatButtonModule, MatCardModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, SafetyNotice],
  templateUrl: './day-page.html',
  styleUrl: './day-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DayPage {
  private readonly api = inject(DayPlanApi);
  private readonly notice = inject(Notice);
  private readonly dialog = inject(MatDialog);
  private readonly route = inject(ActivatedRoute);
  private readonly router = inject(Router);
  private readonly auth = inject(Auth);

  protected readonly electricians = signal<Electrician[]>([]);
  protected readonly date = signal(this.route.snapshot.queryParamMap.get('date') ?? inject(Clock).today());
  protected readonly electricianId = signal<number | null>(Number(this.route.snapshot.queryParamMap.get('electricianId')) || null);
  protected readonly plan = signal<DayPlan | null>(null);
  protected readonly isLoading = signal(false);
  protected readonly bookingId = signal<number | null>(null);
  protected readonly feedUrl = signal<string | null>(null);
  private loading?: Subscription;
  protected readonly statusLabels = SITE_VISIT_STATUS_LABELS;
  protected readonly electricianName = computed(() => this.electricians().find((e) => e.id === this.electricianId())?.name ?? '');
  /** Warnings other than the overflow, which has its own box. */
  protected readonly otherWarnings = computed(() => (this.plan()?.warnings ?? []).filter((w) => !w.startsWith('The day runs')));

  constructor() {
    this.api.electricians().subscribe({
      next: (people) => {
        this.electricians.set(people);
        // The URL's choice first; else the signed-in person when they are one of the electricians; else the first.
        const me = people.find((e) => e.id === this.auth.user()?.id);
        if (this.electricianId() === null && people.length) this.electricianId.set((me ?? people[0]).id);
        this.load();
      },
      error: (err: unknown) => this.notice.failure(err),
    });
  }

  /**
   * A date chosen before the list of electricians has arrived is kept (it was dropped, and the day
   * then opened on today); the plan loads once both are known.
   */
  protected choose(date: string, electricianId: number | null): void {
    if (!/^\d{4}-\d{2}-\d{2}$/.test(date)) return;
    this.date.set(date);
    this.electricianId.set(electricianId);
    this.feedUrl.set(null);
    if (electricianId === null) return;
    void this.router.navigate([], { queryParams: { date, electricianId }, replaceUrl: true });
    this.load();
  }

  /** Only the latest choice's answer is shown: an earlier, slower answer is cancelled, never drawn over it. */
  protected load(): void {
    const id = this.electricianId();
    if (id === null) return;
    this.isLoading.set(true);
    this.loading?.unsubscribe();
    this.loading = this.api.day(this.date(), id).subscribe({
      next: (plan) => {
        this.plan.set(plan);
        this.isLoading.set(false);
      },
      error: (err: unknown) => {
        this.isLoading.set(false);
        this.notice.failure(err);
      },
    });
  }

  protected book(suggestion: DayPlanSuggestion): void {
    const id = this.electricianId();
    if (id === null) return;
    this.bookingId.set(suggestion.requestId);
    this.api.book({ requestId: suggestion.requestId, date: this.date(), electricianId: id }).subscribe({
      next: (plan) => {
        this.bookingId.set(null);
        this.plan.set(plan);
        this.notice.success(`Booked ${suggestion.address}, arrival ${suggestion.arrivalFrom}–${suggestion.arrivalTo}. The seller side is told the window.`);
      },
      error: (err: unknown) => {
        this.bookingId.set(null);
        this.notice.failure(err);
      },
    });
  }

  protected move(stop: DayPlanStop): void {
    const plan = this.plan();
    if (!plan) return;
    const data = { visitId: stop.visitId, address: stop.address, date: plan.date, electricianId: plan.electrician.id, arrivalFrom: stop.arrivalFrom, arrivalTo: stop.arrivalTo, electricians: this.electricians() };
    openMoveVisit(this.dialog, data).subscribe((result) => {
      if (!result) return;
      this.plan.set(result.from);
      this.notice.success(`Moved to ${result.to.electrician.name} on ${result.to.date}.`);
    });
  }

  /** Calls off a booked visit (the seller's side and the electrician are told); the day is planned again without it. */
  protected cancelVisit(stop: DayPlanStop): void {
    const plan = this.plan();
    if (!plan) return;
    const what = `${plan.date}, ${stop.arrivalFrom}–${stop.arrivalTo} · ${plan.electrician.name} · ${stop.address}`;
    openCancelVisit(this.dialog, { requestId: stop.requestId, visitId: stop.visitId, visitNumber: stop.visitNumber, version: stop.visitVersion, what }).subscribe((cancelled) => {
      if (!cancelled) return;
      this.notice.success(`Visit ${stop.visitNumber} to ${stop.address} cancelled. Its items wait for another visit.`);
      this.load();
    });
  }

  protected place(stop: DayPlanStop): void {
    openLocation(this.dialog, { requestId: stop.requestId, address: stop.address, place: stop.place }).subscribe((changed) => {
      if (changed) this.load();
    });
  }

  protected subscribeFeed(): void {
    const id = this.electricianId();
    if (id === null) return;
    this.api.renewFeed(id).subscribe({ next: (feed) => this.feedUrl.set(feed.url), error: (err: unknown) => this.notice.failure(err) });
  }

  protected calendarFileUrl(visitId: number): string {
    return this.api.calendarFileUrl(visitId);
  }

  protected hours(minutes: number): string {
    const h = Math.floor(minutes / 60);
    const m = minutes % 60;
    return h ? `${h} h ${m} min` : `${m} min`;
  }
}
