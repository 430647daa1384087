import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';
import { DayEconomics, Electrician, PICK_KIND_LABELS, PICK_KINDS, PickList, PickListLine, spareNote } from '@cc/shared';
import { forkJoin } from 'rxjs';
import { Notice } from '../../core/http/notice';
import { MoneyPipe } from '../../ui/money/money';
import { WorkCaution } from '../../work/work-caution/work-caution';
import { EconomicsApi, PlannedDay, type DayRef } from '../economics-api';
import { SpareSettings } from '../spare-settings/spare-settings';

const isoDay = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);

/**
 * A planned day of one electrician: the pick list to load (ticked off on the phone, printable as a
 * PDF) and what each visit and the day earned. The date and electrician are in the address
 * (`?date=2026-12-03&electricianId=7`), so the office can send the link to the electrician.
 */
@Component({
  selector: 'cc-day-page',
  imports: [DatePipe, RouterLink, MatButtonModule, MatCardModule, MatCheckboxModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, MatSelectModule, MoneyPipe, WorkCaution, SpareSettings],
  templateUrl: './day-page.html',
  styleUrl: './day-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DayPage {
  private readonly api = inject(EconomicsApi);
  private readonly notice = inject(Notice);
  private readonly router = inject(Router);

  /** From the address. */
  readonly date = input<string | undefined>(undefined);
  readonly electricianId = input<string | undefined>(undefined);
  readonly visit = input<string | undefined>(undefined);

  protected readonly electricians = signal<Electrician[]>([]);
  protected readonly plannedDays = signal<PlannedDay[]>([]);
  protected readonly busyLine = signal<string | null>(null);
  protected readonly kindLabels = PICK_KIND_LABELS;
  protected readonly spareNote = spareNote;

  protected readonly day = computed<DayRef | null>(() => {
    const date = this.date();
    const id = Number(this.electricianId());
    if (!date || !/^\d{4}-\d{2}-\d{2}$/.test(date) || !Number.isInteger(id) || id <= 0) return null;
    const visit = Number(this.visit());
    return { date, electricianId: id, siteVisitId: Number.isInteger(visit) && visit > 0 ? visit : null };
  });
  /** The chosen day's pick list and economics, read again when the day (or visit) changes; none without a day. */
  private readonly dayData = rxResource({
    params: () => this.day() ?? undefined,
    stream: ({ params }) => forkJoin([this.api.pickList(params), this.api.day(params)]),
  });
  protected readonly pickList = computed<PickList | null>(() => (this.dayData.hasValue() ? this.dayData.value()[0] : null));
  protected readonly economics = computed<DayEconomics | null>(() => (this.dayData.hasValue() ? this.dayData.value()[1] : null));
  protected readonly isLoading = computed(() => this.dayData.isLoading());
  protected readonly groups = computed(() => {
    const lines = this.pickList()?.lines ?? [];
    return PICK_KINDS.map((kind) => ({ kind, label: PICK_KIND_LABELS[kind], lines: lines.filter((l) => l.kind === kind) })).filter((g) => g.lines.length);
  });
  protected readonly pdfPath = computed(() => {
    const day = this.day();
    return day ? this.api.pickListPdfPath(day) : null;
  });
  protected readonly electricianName = computed(() => this.electricians().find((e) => e.id === this.day()?.electricianId)?.name ?? '');

  constructor() {
    forkJoin([this.api.electricians(), this.api.plannedDays(isoDay(-7), isoDay(30))]).subscribe({
      next: ([people, days]) => {
        this.electricians.set(people);
        this.plannedDays.set(days);
      },
      error: (err: unknown) => this.notice.failure(err),
    });
    effect(() => {
      const failure = this.dayData.error();
      if (failure) this.notice.failure(failure);
    });
  }

  /** The spare allowance changed: the list is counted again. */
  protected reloadList(): void {
    this.dayData.reload();
  }

  /** Opens another day (or electrician) by changing the address. */
  protected open(date: string, electricianId: number | null): void {
    void this.router.navigate([], { queryParams: { date: date || null, electricianId: electricianId ?? null, visit: null } });
  }

  protected openVisit(siteVisitId: number | null): void {
    void this.router.navigate([], { queryParams: { visit: siteVisitId }, queryParamsHandling: 'merge' });
  }

  protected toggle(line: PickListLine, isTicked: boolean): void {
    const day = this.day();
    if (!day) return;
    this.busyLine.set(line.key);
    this.api.tick(day, line.key, isTicked).subscribe({
      next: (list) => {
        this.busyLine.set(null);
        // A one-visit list keeps its own lines; the ticks are the day's.
        const current = this.pickList();
        const next = current && current.siteVisitId !== null ? { ...current, lines: current.lines.map((l) => ({ ...l, isTicked: list.lines.find((x) => x.key === l.key)?.isTicked ?? l.isTicked })), tickedCount: current.lines.filter((l) => list.lines.find((x) => x.key === l.key)?.isTicked ?? l.isTicked).length } : list;
        this.dayData.value.update((data) => (data ? [next, data[1]] : data));
      },
      error: (err: unknown) => {
        this.busyLine.set(null);
        this.notice.failure(err);
      },
    });
  }

  protected minutes(value: number | null): string {
    return value === null ? '—' : `${value} min`;
  }
}
