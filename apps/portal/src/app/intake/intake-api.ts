import { HttpClient, HttpEvent } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import {
  ConfirmItems,
  CreateLineItem,
  itemsWithNotes,
  LineItem,
  LineItemList,
  MergeLineItems,
  PasteReport,
  ReportFile,
  ReportText,
  SplitLineItem,
  UpdateLineItem,
  UploadResult,
} from '@cc/shared';
import { map, Observable } from 'rxjs';

/** The report-intake and item-review routes of one repair request. */
@Injectable({ providedIn: 'root' })
export class IntakeApi {
  private readonly http = inject(HttpClient);

  reports(requestId: number): Observable<ReportFile[]> {
    return this.http.get<ReportFile[]>(`/api/requests/${requestId}/reports`);
  }

  /** The text of one report, page by page (lists carry summaries only). */
  reportText(requestId: number, reportId: number): Observable<ReportText> {
    return this.http.get<ReportText>(`/api/requests/${requestId}/reports/${reportId}/text`);
  }

  /** Uploads a PDF or text file; the events carry the upload progress and then the parse result. */
  upload(requestId: number, file: File): Observable<HttpEvent<UploadResult>> {
    const body = new FormData();
    body.append('file', file, file.name);
    return this.http.post<UploadResult>(`/api/requests/${requestId}/reports`, body, { reportProgress: true, observe: 'events' });
  }

  paste(requestId: number, dto: PasteReport): Observable<UploadResult> {
    return this.http.post<UploadResult>(`/api/requests/${requestId}/reports/paste`, dto);
  }

  /** Reads a stored report again; edited, confirmed and removed items stay as they are. */
  reparse(requestId: number, reportId: number): Observable<UploadResult> {
    return this.http.post<UploadResult>(`/api/requests/${requestId}/reports/${reportId}/reparse`, {});
  }

  /** The request's items with their edition notes in place (the answer sends each note once). */
  items(requestId: number): Observable<LineItem[]> {
    return this.http.get<LineItemList>(`/api/requests/${requestId}/items`).pipe(map(itemsWithNotes));
  }

  add(requestId: number, dto: CreateLineItem): Observable<LineItem> {
    return this.http.post<LineItem>(`/api/requests/${requestId}/items`, dto);
  }

  update(requestId: number, itemId: number, dto: UpdateLineItem): Observable<LineItem> {
    return this.http.patch<LineItem>(`/api/requests/${requestId}/items/${itemId}`, dto);
  }

  remove(requestId: number, item: Pick<LineItem, 'id' | 'version'>): Observable<void> {
    return this.http.delete<void>(`/api/requests/${requestId}/items/${item.id}`, { params: { version: item.version } });
  }

  merge(requestId: number, dto: MergeLineItems): Observable<LineItem> {
    return this.http.post<LineItem>(`/api/requests/${requestId}/items/merge`, dto);
  }

  split(requestId: number, itemId: number, dto: SplitLineItem): Observable<LineItem[]> {
    return this.http.post<LineItem[]>(`/api/requests/${requestId}/items/${itemId}/split`, dto);
  }

  /** Confirms the review: the proposals become the request's line items and pricing begins. */
  confirm(requestId: number, dto: ConfirmItems): Observable<LineItem[]> {
    return this.http.post<LineItem[]>(`/api/requests/${requestId}/items/confirm`, dto);
  }
}
