import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { QuoteVersion, QuoteVersionSchema, QuoteVersionSummary, SendQuote } from '@cc/shared';
import { map, Observable } from 'rxjs';

/** The quote versions of a request: sending one, listing them, reading one. */
@Injectable({ providedIn: 'root' })
export class QuotesApi {
  private readonly http = inject(HttpClient);

  list(requestId: number): Observable<QuoteVersionSummary[]> {
    return this.http.get<QuoteVersionSummary[]>(`/api/requests/${requestId}/quotes`);
  }

  /** One version (parsed: it is what the seller decides on), or the current one when none is named. */
  get(requestId: number, version: number | null): Observable<QuoteVersion> {
    const path = version === null ? 'current' : String(version);
    return this.http.get<unknown>(`/api/requests/${requestId}/quotes/${path}`).pipe(map((body) => QuoteVersionSchema.parse(body)));
  }

  send(requestId: number, body: SendQuote): Observable<QuoteVersion> {
    return this.http.post<unknown>(`/api/requests/${requestId}/quotes`, body).pipe(map((answer) => QuoteVersionSchema.parse(answer)));
  }
}
