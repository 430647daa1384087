import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCardModule } from '@angular/material/card';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ContractorDashboard, formatCents, PIPELINE_STAGE_LABELS } from '@cc/shared';
import type { ChartConfiguration } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';
import { Notice } from '../../core/http/notice';
import { MoneyPipe } from '../../ui/money/money';
import { DashboardsApi } from '../dashboards-api';

const monthLabel = (month: string) => new Date(`${month}-01T12:00:00Z`).toLocaleDateString('en-US', { month: 'short', year: 'numeric', timeZone: 'UTC' });

/** The contractor's pipeline, revenue quoted / approved / paid by month, and the agents who send work. */
@Component({
  selector: 'cc-contractor-dashboard',
  imports: [MatButtonToggleModule, MatCardModule, MatProgressBarModule, BaseChartDirective, MoneyPipe],
  templateUrl: './contractor-dashboard.html',
  styleUrl: '../dashboard.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ContractorDashboardView {
  private readonly api = inject(DashboardsApi);
  private readonly notice = inject(Notice);
  protected readonly data = signal<ContractorDashboard | null>(null);
  protected readonly months = signal(6);
  protected readonly stageLabels = PIPELINE_STAGE_LABELS;
  protected readonly monthLabel = monthLabel;
  protected readonly chart = computed<ChartConfiguration<'bar'>['data']>(() => {
    const revenue = this.data()?.revenue ?? [];
    return {
      labels: revenue.map((r) => monthLabel(r.month)),
      datasets: [
        { label: 'Quoted', data: revenue.map((r) => r.quotedCents / 100), backgroundColor: '#8fb3e0' },
        { label: 'Approved', data: revenue.map((r) => r.approvedCents / 100), backgroundColor: '#1d4f91' },
        { label: 'Paid', data: revenue.map((r) => r.paidCents / 100), backgroundColor: '#2e7d32' },
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
    this.load(6);
  }

  protected load(months: number): void {
    this.months.set(months);
    this.api.contractor(months).subscribe({ next: (d) => this.data.set(d), error: (err: unknown) => this.notice.failure(err) });
  }
}
