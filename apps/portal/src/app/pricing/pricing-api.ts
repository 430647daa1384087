import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import {
  AutoPriceItems,
  AutoPriceResult,
  AutoPriceResultSchema,
  BulkPriceItems,
  MarkOutOfScope,
  Page,
  PricingVisit,
  RepairRequestSummary,
  RequestBallpark,
  RequestBallparkSchema,
  RequestPricing,
  RequestPricingSchema,
  SiteConditions,
  SiteConditionsSchema,
} from '@cc/shared';
import { map, Observable } from 'rxjs';

/** The pricing routes of one request and the contractor's queue of requests awaiting a price. */
@Injectable({ providedIn: 'root' })
export class PricingApi {
  private readonly http = inject(HttpClient);

  /** Requests assigned to the contractor's firm that wait for its prices, soonest closing first. */
  queue(page: number, pageSize: number): Observable<Page<RepairRequestSummary>> {
    const params = new HttpParams({
      fromObject: { status: 'pricing', sort: 'closingDate', direction: 'asc', page: String(page), pageSize: String(pageSize) },
    });
    return this.http.get<Page<RepairRequestSummary>>('/api/requests', { params });
  }

  /** The items with their prices and the rate book to recompute them live (parsed: it is money). */
  view(requestId: number): Observable<RequestPricing> {
    return this.http.get<unknown>(`/api/requests/${requestId}/pricing`).pipe(map((body) => RequestPricingSchema.parse(body)));
  }

  bulkUpdate(requestId: number, change: BulkPriceItems): Observable<RequestPricing> {
    return this.http.patch<unknown>(`/api/requests/${requestId}/pricing`, change).pipe(map((body) => RequestPricingSchema.parse(body)));
  }

  autoPrice(requestId: number, body: AutoPriceItems = {}): Observable<AutoPriceResult> {
    return this.http
      .post<unknown>(`/api/requests/${requestId}/pricing/auto-price`, body)
      .pipe(map((answer) => AutoPriceResultSchema.parse(answer)));
  }

  markOutOfScope(requestId: number, body: MarkOutOfScope): Observable<RequestPricing> {
    return this.http
      .post<unknown>(`/api/requests/${requestId}/pricing/out-of-scope`, body)
      .pipe(map((answer) => RequestPricingSchema.parse(answer)));
  }

  updateVisits(requestId: number, visits: PricingVisit[]): Observable<RequestPricing> {
    return this.http
      .put<unknown>(`/api/requests/${requestId}/pricing/visits`, { visits })
      .pipe(map((answer) => RequestPricingSchema.parse(answer)));
  }

  siteConditions(requestId: number): Observable<SiteConditions> {
    return this.http.get<unknown>(`/api/requests/${requestId}/site-conditions`).pipe(map((body) => SiteConditionsSchema.parse(body)));
  }

  setSiteConditions(requestId: number, adderIds: number[]): Observable<SiteConditions> {
    return this.http
      .put<unknown>(`/api/requests/${requestId}/site-conditions`, { adderIds })
      .pipe(map((body) => SiteConditionsSchema.parse(body)));
  }

  /** The low–high range of the whole request: an estimate, not a quote. */
  ballpark(requestId: number): Observable<RequestBallpark> {
    return this.http.get<unknown>(`/api/requests/${requestId}/ballpark`).pipe(map((body) => RequestBallparkSchema.parse(body)));
  }
}
