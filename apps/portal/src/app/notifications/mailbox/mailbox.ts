import { DatePipe, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTabsModule } from '@angular/material/tabs';
import { CapturedMail } from '@cc/shared';
import { Notice } from '../../core/http/notice';
import { MailboxPage, NotificationsApi } from '../notifications-api';

const OUTBOX_LABELS: Record<string, string> = {
  pending: 'waiting to be sent',
  sending: 'being sent',
  sent: 'sent',
  held: 'held for the digest',
  digested: 'folded into a digest',
  failed: 'failed',
  skipped: 'not sent (turned off)',
};

/** Administrators' view of the e-mail the local sink caught instead of delivering (development only). */
@Component({
  selector: 'cc-mailbox',
  imports: [DatePipe, DecimalPipe, MatButtonModule, MatCardModule, MatIconModule, MatPaginatorModule, MatProgressBarModule, MatTabsModule],
  templateUrl: './mailbox.html',
  styleUrl: './mailbox.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Mailbox {
  private readonly api = inject(NotificationsApi);
  private readonly notice = inject(Notice);

  protected readonly page = signal<MailboxPage | null>(null);
  protected readonly open = signal<CapturedMail | null>(null);
  protected readonly pageSize = 20;
  protected readonly outbox = computed(() =>
    Object.entries(this.page()?.outbox ?? {}).map(([status, count]) => `${count} ${OUTBOX_LABELS[status] ?? status}`).join(' · '),
  );

  constructor() {
    this.load(0);
  }

  protected load(index: number): void {
    this.api.mailbox(index, this.pageSize).subscribe({
      next: (page) => {
        this.page.set(page);
        if (!this.open() && page.items.length) this.open.set(page.items[0]);
      },
      error: (err: unknown) => this.notice.failure(err),
    });
  }

  protected turn(event: PageEvent): void {
    this.open.set(null);
    this.load(event.pageIndex);
  }
}
