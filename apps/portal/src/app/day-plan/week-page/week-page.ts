import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { WeekDay, WeekPlan, WeekVisit } from '@cc/shared';
import { Notice } from '../../core/http/notice';
import { Clock } from '../../core/time/clock';
import { SafetyNotice } from '../../ui/safety-notice/safety-notice';
import { DayPlanApi } from '../day-plan-api';
import { openMoveVisit } from '../move-visit-dialog/move-visit-dialog';

/** The office's week: each day's visits per electrician, with drive, on-site time and overflow; visits move between days and people. */
@Component({
  selector: 'cc-week-page',
  imports: [DatePipe, FormsModule, RouterLink, MatButtonModule, MatCardModule, MatFormFieldModule, MatIconModule, MatInputModule, SafetyNotice],
  templateUrl: './week-page.html',
  styleUrl: './week-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WeekPage {
  private readonly api = inject(DayPlanApi);
  private readonly notice = inject(Notice);
  private readonly dialog = inject(MatDialog);
  private readonly route = inject(ActivatedRoute);
  private readonly router = inject(Router);

  protected readonly start = signal(this.route.snapshot.queryParamMap.get('start') ?? inject(Clock).today());
  protected readonly week = signal<WeekPlan | null>(null);
  /** Per date, the electricians' days. */
  protected readonly columns = computed(() => {
    const w = this.week();
    if (!w) return [];
    return w.dates.map((date) => ({
      date,
      people: w.electricians.map((person) => ({ person, day: w.days.find((d) => d.date === date && d.electricianId === person.id)! })),
    }));
  });

  constructor() {
    this.load();
  }

  protected choose(start: string): void {
    if (!/^\d{4}-\d{2}-\d{2}$/.test(start)) return;
    this.start.set(start);
    void this.router.navigate([], { queryParams: { start }, replaceUrl: true });
    this.load();
  }

  protected shift(days: number): void {
    const next = new Date(Date.parse(`${this.start()}T12:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
    this.choose(next);
  }

  protected load(): void {
    this.api.week(this.start()).subscribe({ next: (w) => this.week.set(w), error: (err: unknown) => this.notice.failure(err) });
  }

  protected move(visit: WeekVisit, day: WeekDay): void {
    const electricians = this.week()?.electricians ?? [];
    openMoveVisit(this.dialog, { visitId: visit.visitId, address: visit.address, date: day.date, electricianId: day.electricianId, arrivalFrom: visit.arrivalFrom, arrivalTo: visit.arrivalTo, electricians }).subscribe((result) => {
      if (!result) return;
      this.notice.success(`Moved to ${result.to.electrician.name} on ${result.to.date}.`);
      this.load();
    });
  }
}
