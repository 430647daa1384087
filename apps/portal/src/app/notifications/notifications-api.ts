import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { CapturedMail, NotificationKind, NotificationPreference, Page, Delivery } from '@cc/shared';
import { Observable } from 'rxjs';

export interface MailboxPage extends Page<CapturedMail> {
  /** Outbox messages by status (pending, sent, held ...). */
  outbox: Record<string, number>;
}

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

  mailbox(page: number, pageSize: number): Observable<MailboxPage> {
    return this.http.get<MailboxPage>('/api/mailbox', { params: new HttpParams().set('page', page).set('pageSize', pageSize) });
  }
}
