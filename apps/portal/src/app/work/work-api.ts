import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import {
  BookSiteVisit,
  CancelSiteVisit,
  CompletionLetter,
  Correction,
  IssueLetter,
  LetterVerification,
  PdfCheck,
  PhotoKind,
  ProofReview,
  RecordCorrection,
  SiteVisit,
  WorkOverview,
  WorkOverviewSchema,
} from '@cc/shared';
import { map, Observable } from 'rxjs';

/** A photo chosen on the correction form, with the slot it goes in. */
export interface ChosenPhoto {
  kind: PhotoKind;
  file: Blob;
  name: string;
}

/** The proof side of a request: visits, correction records, letters, the review, and the public check. */
@Injectable({ providedIn: 'root' })
export class WorkApi {
  private readonly http = inject(HttpClient);

  /** Everything the work page shows (parsed: it decides what the person may do). */
  overview(requestId: number): Observable<WorkOverview> {
    return this.http.get<unknown>(`/api/requests/${requestId}/work`).pipe(map((body) => WorkOverviewSchema.parse(body)));
  }

  bookVisit(requestId: number, body: BookSiteVisit): Observable<SiteVisit> {
    return this.http.post<SiteVisit>(`/api/requests/${requestId}/visits`, body);
  }

  markVisit(requestId: number, visitId: number, step: 'start' | 'finish'): Observable<SiteVisit> {
    return this.http.post<SiteVisit>(`/api/requests/${requestId}/visits/${visitId}/${step}`, {});
  }

  /** Calls off a booked visit with the reason and the version shown (409 when it was started or moved meanwhile). */
  cancelVisit(requestId: number, visitId: number, body: CancelSiteVisit): Observable<SiteVisit> {
    return this.http.post<SiteVisit>(`/api/requests/${requestId}/visits/${visitId}/cancel`, body);
  }

  /** The record goes as JSON in a multipart form beside the photos. */
  recordCorrection(requestId: number, itemId: number, record: RecordCorrection, photos: readonly ChosenPhoto[]): Observable<Correction> {
    const form = new FormData();
    form.append('record', JSON.stringify(record));
    for (const photo of photos) form.append(photo.kind, photo.file, photo.name);
    return this.http.post<Correction>(`/api/requests/${requestId}/items/${itemId}/correction`, form);
  }

  issueLetter(requestId: number, body: IssueLetter): Observable<CompletionLetter> {
    return this.http.post<CompletionLetter>(`/api/requests/${requestId}/letters`, body);
  }

  review(requestId: number, body: ProofReview): Observable<void> {
    return this.http.post<void>(`/api/requests/${requestId}/proof-review`, body);
  }

  resume(requestId: number): Observable<WorkOverview> {
    return this.http.post<unknown>(`/api/requests/${requestId}/work/resume`, {}).pipe(map((body) => WorkOverviewSchema.parse(body)));
  }

  verify(code: string): Observable<LetterVerification> {
    return this.http.get<LetterVerification>(`/api/verify/${encodeURIComponent(code)}`);
  }

  checkPdf(file: Blob, code: string | null): Observable<PdfCheck> {
    const form = new FormData();
    form.append('file', file, 'letter.pdf');
    if (code) form.append('code', code);
    return this.http.post<PdfCheck>('/api/verify', form);
  }
}
