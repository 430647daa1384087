import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatCardModule } from '@angular/material/card';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { AgentDashboard, CLOSING_RISK_LABELS, ITEM_STATUS_LABELS } from '@cc/shared';
import type { ChartConfiguration } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';
import { Notice } from '../../core/http/notice';
import { StatusChip } from '../../ui/status-chip/status-chip';
import { DashboardsApi } from '../dashboards-api';
import { FinishedRequests } from '../finished-requests/finished-requests';

/** An agent's open requests by closing date (days left, risk, who acts next), the finished ones page by page, and the open ones' items by status. */
@Component({
  selector: 'cc-agent-dashboard',
  imports: [DatePipe, RouterLink, MatCardModule, MatProgressBarModule, StatusChip, BaseChartDirective, FinishedRequests],
  templateUrl: './agent-dashboard.html',
  styleUrl: '../dashboard.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AgentDashboardView {
  private readonly notice = inject(Notice);
  protected readonly data = signal<AgentDashboard | null>(null);
  protected readonly riskLabels = CLOSING_RISK_LABELS;
  protected readonly itemCounts = computed(() => (this.data()?.itemsByStatus ?? []).map((i) => ({ label: ITEM_STATUS_LABELS[i.status], count: i.count })));
  protected readonly chart = computed<ChartConfiguration<'bar'>['data']>(() => ({
    labels: this.itemCounts().map((i) => i.label),
    datasets: [{ data: this.itemCounts().map((i) => i.count), label: 'Items', backgroundColor: '#1d4f91' }],
  }));
  protected readonly chartOptions: ChartConfiguration<'bar'>['options'] = {
    indexAxis: 'y',
    responsive: true,
    maintainAspectRatio: false,
    plugins: { legend: { display: false } },
    scales: { x: { beginAtZero: true, ticks: { precision: 0 } } },
  };

  constructor() {
    inject(DashboardsApi)
      .agent()
      .subscribe({ next: (d) => this.data.set(d), error: (err: unknown) => this.notice.failure(err) });
  }
}
