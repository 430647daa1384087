import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import { RepairRequestSummary } from '@cc/shared';
import { Notice } from '../../core/http/notice';
import { pagedList } from '../../core/http/paged-list';
import { DaysToClosing } from '../../ui/days-to-closing/days-to-closing';
import { PricingApi } from '../pricing-api';

/** The contractor's job queue: requests whose confirmed items wait for a price, soonest closing first. */
@Component({
  selector: 'cc-pricing-queue',
  imports: [DatePipe, RouterLink, MatTableModule, MatPaginatorModule, MatProgressBarModule, MatButtonModule, MatIconModule, DaysToClosing],
  templateUrl: './pricing-queue.html',
  styleUrl: './pricing-queue.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PricingQueue {
  private readonly api = inject(PricingApi);
  private readonly router = inject(Router);
  private readonly notice = inject(Notice);

  protected readonly columns = ['street', 'closingDate', 'itemCount', 'reference', 'action'];
  protected readonly list = pagedList<RepairRequestSummary>(
    ({ page, pageSize }) => this.api.queue(page, pageSize),
    (err) => this.notice.failure(err),
  );

  protected open(row: RepairRequestSummary): void {
    void this.router.navigate(['/requests', row.id, 'pricing']);
  }
}
