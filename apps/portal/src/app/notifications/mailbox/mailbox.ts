import { DatePipe, DecimalPipe } from '@angular/common';
import { afterNextRender, ChangeDetectionStrategy, Component, computed, ElementRef, inject, Injector, signal, viewChild } from '@angular/core';
import { AbstractControl, FormControl, FormGroup, ReactiveFormsModule, ValidationErrors } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTabsModule } from '@angular/material/tabs';
import { CapturedMail, MailboxQuerySchema, parseRequestReference } from '@cc/shared';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { ZOD_ERROR, zodValidator } from '../../core/forms/zod-validator';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { Notice } from '../../core/http/notice';
import { MailboxFilters, MailboxPage, NotificationsApi } from '../notifications-api';

const OUTBOX_LABELS: Record<string, string> = {
  pending: 'waiting to be sent',
  sending: 'being sent',
  sent: 'sent',
  held: 'held for the digest',
  digested: 'folded into a digest',
  failed: 'failed',
  skipped: 'not sent (turned off)',
};

/** A typed request reference (`CC-00008`, `8`) or nothing; its id is checked by the shared schema. */
function requestReferenceValidator(control: AbstractControl<string>): ValidationErrors | null {
  const text = control.value.trim();
  if (!text) return null;
  const id = parseRequestReference(text);
  if (id === null) return { [ZOD_ERROR]: 'Type a request reference, such as CC-00008' };
  return zodValidator(MailboxQuerySchema.shape.requestId)({ value: id } as AbstractControl);
}

/**
 * Administrators' view of the e-mail the local sink caught instead of delivering (development only),
 * filtered by request and recipient on the server. On a phone the message opens in place of the list,
 * with a Back button; on a wide screen it sits beside the list.
 */
@Component({
  selector: 'cc-mailbox',
  imports: [DatePipe, DecimalPipe, ReactiveFormsModule, MatButtonModule, MatCardModule, MatFormFieldModule, MatIconModule, MatInputModule, MatPaginatorModule, MatProgressBarModule, MatTabsModule, ErrorMessagePipe],
  templateUrl: './mailbox.html',
  styleUrl: './mailbox.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Mailbox {
  private readonly api = inject(NotificationsApi);
  private readonly notice = inject(Notice);
  private readonly injector = inject(Injector);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly reader = viewChild<ElementRef<HTMLElement>>('reader');

  protected readonly page = signal<MailboxPage | null>(null);
  protected readonly open = signal<CapturedMail | null>(null);
  /** Whether a message was tapped to read (on a phone the list steps aside for it). */
  protected readonly isReading = signal(false);
  protected readonly pageSize = 20;
  protected readonly outbox = computed(() =>
    Object.entries(this.page()?.outbox ?? {}).map(([status, count]) => `${count} ${OUTBOX_LABELS[status] ?? status}`).join(' · '),
  );

  protected readonly filters = new FormGroup({
    requestId: new FormControl('', { nonNullable: true, validators: requestReferenceValidator }),
    to: new FormControl('', { nonNullable: true, validators: zodValidator(MailboxQuerySchema.shape.to, (v) => String(v ?? '').trim() || undefined) }),
  });
  /** The filters of the list shown. */
  private applied: MailboxFilters = {};
  protected readonly isFiltered = signal(false);

  constructor() {
    this.load(0);
  }

  protected load(index: number): void {
    this.api.mailbox(index, this.pageSize, this.applied).subscribe({
      next: (page) => {
        this.page.set(page);
        if (!this.open() && page.items.length) this.open.set(page.items[0]);
      },
      error: (err: unknown) => {
        const problem = applyServerErrors(this.filters, err);
        if (problem) this.notice.failure(err);
      },
    });
  }

  protected turn(event: PageEvent): void {
    this.open.set(null);
    this.isReading.set(false);
    this.load(event.pageIndex);
  }

  protected applyFilters(): void {
    this.filters.markAllAsTouched();
    if (this.filters.invalid) return;
    const { requestId, to } = this.filters.getRawValue();
    const id = requestId.trim() ? parseRequestReference(requestId) : null;
    this.applied = { ...(id !== null ? { requestId: id } : {}), ...(to.trim() ? { to: to.trim() } : {}) };
    this.isFiltered.set(Object.keys(this.applied).length > 0);
    this.open.set(null);
    this.isReading.set(false);
    this.load(0);
  }

  protected clearFilters(): void {
    this.filters.reset();
    this.applyFilters();
  }

  /** Opens a message and brings it into view at once (on a phone it takes the list's place). */
  protected read(mail: CapturedMail): void {
    this.open.set(mail);
    this.isReading.set(true);
    afterNextRender(
      () => {
        const card = this.reader()?.nativeElement;
        card?.scrollIntoView?.({ block: 'start' });
        card?.focus({ preventScroll: true });
      },
      { injector: this.injector },
    );
  }

  /** Back to the list (phone), at the message that was open. */
  protected back(): void {
    this.isReading.set(false);
    afterNextRender(
      () => {
        const item = this.host.nativeElement.querySelector<HTMLElement>('.item.selected');
        item?.scrollIntoView?.({ block: 'center' });
        item?.focus();
      },
      { injector: this.injector },
    );
  }
}
