import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { CapturedMail, MailboxQuery, NotificationKind, NotificationPreference, Page, Delivery } from '@cc/shared';
import { Observable } from 'rxjs';

export interface MailboxPage extends Page<CapturedMail> {
  /** Outbox messages by status (pending, sent, held ...). */
  outbox: Record<string, number>;
}

/** The development mailbox's filters (shared `MailboxQuerySchema`). */
export type MailboxFilters = Pick<MailboxQuery, 'requestId' | 'to'> & { requestId?: number };

/** Message preferences, the digest's unsubscribe link, and the development mailbox. */
@Injectable({ providedIn: 'root' })
export class NotificationsApi {
  private readonly http = inject(HttpClient);

  preferences(): Observable<NotificationPreference[]> {
    return this.http.get<NotificationPreference[]>('/api/notifications/preferences');
  }

  savePreferences(preferences: { kind: NotificationKind; delivery: Delivery }[]): Observable<NotificationPreference[]> {
    return this.http.put<NotificationPreference[]>('/api/notifications/preferences', { preferences });
  }

  unsubscribeLookup(token: string): Observable<{ email: string }> {
    return this.http.get<{ email: string }>(`/api/notifications/unsubscribe/${encodeURIComponent(token)}`);
  }

  unsubscribe(token: string): Observable<{ email: string; turnedOff: NotificationKind[] }> {
    return this.http.post<{ email: string; turnedOff: NotificationKind[] }>(`/api/notifications/unsubscribe/${encodeURIComponent(token)}`, {});
  }

  /** A page of captured messages, newest first, of one request and/or to one address when given. */
  mailbox(page: number, pageSize: number, filters: MailboxFilters = {}): Observable<MailboxPage> {
    let params = new HttpParams().set('page', page).set('pageSize', pageSize);
    if (filters.requestId !== undefined) params = params.set('requestId', filters.requestId);
    if (filters.to) params = params.set('to', filters.to);
    return this.http.get<MailboxPage>('/api/mailbox', { params });
  }
}
