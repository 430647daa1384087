import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { ApprovalView, ApprovalViewSchema, CreateChangeOrder, CreateRefund, DecideChangeOrder, InvoiceSummary, RecordFunds, SendClosingInvoice, SignApproval, StartedPayment, StartedPaymentSchema, StartPayment } from '@cc/shared';
import { map, Observable } from 'rxjs';

/** The seller's side of one request: the decision page, signing, paying, change orders and invoices. */
@Injectable({ providedIn: 'root' })
export class ApprovalApi {
  private readonly http = inject(HttpClient);

  /** The page's data (parsed: it carries the money the seller signs and pays). */
  view(requestId: number): Observable<ApprovalView> {
    return this.http.get<unknown>(this.path(requestId, 'approval')).pipe(map((body) => ApprovalViewSchema.parse(body)));
  }

  sign(requestId: number, body: SignApproval): Observable<ApprovalView> {
    return this.http.post<unknown>(this.path(requestId, 'approval'), body).pipe(map((b) => ApprovalViewSchema.parse(b)));
  }

  startPayment(requestId: number, body: StartPayment): Observable<StartedPayment> {
    return this.http.post<unknown>(this.path(requestId, 'payments'), body).pipe(map((b) => StartedPaymentSchema.parse(b)));
  }

  recordFunds(requestId: number, body: RecordFunds): Observable<ApprovalView> {
    return this.http.post<unknown>(this.path(requestId, 'payments/funds'), body).pipe(map((b) => ApprovalViewSchema.parse(b)));
  }

  refund(requestId: number, paymentId: number, body: CreateRefund): Observable<ApprovalView> {
    return this.http.post<unknown>(this.path(requestId, `payments/${paymentId}/refunds`), body).pipe(map((b) => ApprovalViewSchema.parse(b)));
  }

  sendChangeOrder(requestId: number, body: CreateChangeOrder): Observable<ApprovalView> {
    return this.http.post<unknown>(this.path(requestId, 'change-orders'), body).pipe(map((b) => ApprovalViewSchema.parse(b)));
  }

  decideChangeOrder(requestId: number, changeOrderId: number, body: DecideChangeOrder): Observable<ApprovalView> {
    return this.http.post<unknown>(this.path(requestId, `change-orders/${changeOrderId}/decision`), body).pipe(map((b) => ApprovalViewSchema.parse(b)));
  }

  /** E-mails the invoice payable at closing again (to the same or a corrected address); the page as it now stands. */
  sendClosingInvoice(requestId: number, invoiceId: number, body: SendClosingInvoice): Observable<ApprovalView> {
    return this.http.post<unknown>(this.path(requestId, `invoices/${invoiceId}/send`), body).pipe(map((b) => ApprovalViewSchema.parse(b)));
  }

  issueInvoice(requestId: number): Observable<InvoiceSummary> {
    return this.http.post<InvoiceSummary>(this.path(requestId, 'invoices'), {});
  }

  private path(requestId: number, rest: string): string {
    return `/api/requests/${requestId}/${rest}`;
  }
}

/** A key made once per attempt, sent with a payment or refund so a double submit makes one. */
export function newIdempotencyKey(): string {
  const random = globalThis.crypto?.randomUUID?.() ?? `${Date.now().toString(36)}-${Math.random().toString(36).slice(2)}-${Math.random().toString(36).slice(2)}`;
  return `web-${random}`;
}
