import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { formatCents, MinutesVsBookRow, PeriodEconomics, RETURN_CAUSE_LABELS } from '@cc/shared';
import type { ChartConfiguration } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';
import { Notice } from '../../core/http/notice';
import { codeLabel } from '../../ui/code-label';
import { MoneyPipe } from '../../ui/money/money';
import { EconomicsApi } from '../economics-api';

type Span = 'week' | 'month';

/** The week (Monday to Sunday) or the calendar month around `anchor`, as YYYY-MM-DD dates. */
export function periodAround(anchor: string, span: Span): { from: string; to: string } {
  const d = new Date(`${anchor}T12:00:00Z`);
  if (span === 'month') {
    const from = new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth(), 1));
    const to = new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth() + 1, 0));
    return { from: from.toISOString().slice(0, 10), to: to.toISOString().slice(0, 10) };
  }
  const monday = new Date(d.getTime() - ((d.getUTCDay() + 6) % 7) * 86_400_000);
  return { from: monday.toISOString().slice(0, 10), to: new Date(monday.getTime() + 6 * 86_400_000).toISOString().slice(0, 10) };
}

const VERDICT_LABELS: Record<MinutesVsBookRow['verdict'], string> = {
  'priced-low': 'Takes longer than priced: priced too low',
  'priced-high': 'Quicker than priced: priced high',
  'about-right': 'About as priced',
  'no-book-minutes': 'Flat rate: the entry names no minutes',
};

/** A week or a month of visits: earnings by day (chart), the single-visit completion rate, minutes against the rate book, CSV. */
@Component({
  selector: 'cc-period-page',
  imports: [DatePipe, RouterLink, MatButtonModule, MatButtonToggleModule, MatCardModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, BaseChartDirective, MoneyPipe],
  templateUrl: './period-page.html',
  styleUrls: ['../day-page/day-page.scss', './period-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PeriodPage {
  private readonly api = inject(EconomicsApi);
  private readonly notice = inject(Notice);

  protected readonly span = signal<Span>('week');
  protected readonly anchor = signal(new Date().toISOString().slice(0, 10));
  protected readonly range = computed(() => periodAround(this.anchor(), this.span()));
  protected readonly data = signal<PeriodEconomics | null>(null);
  protected readonly csvPath = computed(() => this.api.periodCsvPath(this.range().from, this.range().to));
  protected readonly causeLabels = RETURN_CAUSE_LABELS;
  protected readonly verdictLabels = VERDICT_LABELS;
  protected readonly codeLabel = codeLabel;
  protected readonly chart = computed<ChartConfiguration<'bar'>['data']>(() => {
    const days = this.data()?.days ?? [];
    return {
      labels: days.map((d) => new Date(`${d.date}T12:00:00Z`).toLocaleDateString('en-US', { weekday: 'short', month: 'short', day: 'numeric', timeZone: 'UTC' })),
      datasets: [
        { label: 'Billed', data: days.map((d) => d.totals.billedCents / 100), backgroundColor: '#8fb3e0' },
        { label: 'Earned', data: days.map((d) => d.totals.earningsCents / 100), backgroundColor: '#1d4f91' },
      ],
    };
  });
  protected readonly chartOptions: ChartConfiguration<'bar'>['options'] = {
    responsive: true,
    maintainAspectRatio: false,
    scales: { y: { beginAtZero: true, ticks: { callback: (v) => formatCents(Number(v) * 100) } } },
    plugins: { tooltip: { callbacks: { label: (c) => `${c.dataset.label}: ${formatCents(Math.round(Number(c.parsed.y) * 100))}` } } },
  };

  constructor() {
    this.load();
  }

  protected setSpan(span: Span): void {
    this.span.set(span);
    this.load();
  }

  protected setAnchor(date: string): void {
    if (!/^\d{4}-\d{2}-\d{2}$/.test(date)) return;
    this.anchor.set(date);
    this.load();
  }

  protected step(direction: -1 | 1): void {
    const { from, to } = this.range();
    const base = direction < 0 ? new Date(`${from}T12:00:00Z`).getTime() - 86_400_000 : new Date(`${to}T12:00:00Z`).getTime() + 86_400_000;
    this.setAnchor(new Date(base).toISOString().slice(0, 10));
  }

  private load(): void {
    const { from, to } = this.range();
    this.data.set(null);
    this.api.period(from, to).subscribe({ next: (d) => this.data.set(d), error: (err: unknown) => this.notice.failure(err) });
  }

  protected percent(bp: number): string {
    return `${(bp / 100).toFixed(bp % 100 === 0 ? 0 : 1)} %`;
  }

  protected minutes(value: number | null): string {
    return value === null ? '—' : `${value} min`;
  }
}
