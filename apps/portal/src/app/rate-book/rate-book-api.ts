import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import {
  ContractorRateBook,
  ContractorRateBookSchema,
  CreateRateBookEntry,
  CreateSiteAdder,
  Page,
  RateBookChange,
  RateBookEntryRecord,
  RateBookEntryRecordSchema,
  RateBookImportResult,
  RateBookTermsRecord,
  RateBookTermsRecordSchema,
  SiteAdderRecord,
  UpdateRateBookEntry,
  UpdateRateBookTerms,
  UpdateSiteAdder,
} from '@cc/shared';
import { map, Observable } from 'rxjs';

/** Where the CSV of the rate book's entries downloads from. */
export const RATE_BOOK_CSV_PATH = '/api/rate-book/entries.csv';

/** The signed-in contractor organisation's rate book: terms, entries, site conditions, changes, CSV. */
@Injectable({ providedIn: 'root' })
export class RateBookApi {
  private readonly http = inject(HttpClient);

  /** The whole rate book (parsed: every price is computed from it). */
  get(): Observable<ContractorRateBook> {
    return this.http.get<unknown>('/api/rate-book').pipe(map((body) => ContractorRateBookSchema.parse(body)));
  }

  saveTerms(dto: UpdateRateBookTerms): Observable<RateBookTermsRecord> {
    return this.http.put<unknown>('/api/rate-book/terms', dto).pipe(map((body) => RateBookTermsRecordSchema.parse(body)));
  }

  createEntry(dto: CreateRateBookEntry): Observable<RateBookEntryRecord> {
    return this.http.post<unknown>('/api/rate-book/entries', dto).pipe(map((body) => RateBookEntryRecordSchema.parse(body)));
  }

  updateEntry(id: number, dto: UpdateRateBookEntry): Observable<RateBookEntryRecord> {
    return this.http.patch<unknown>(`/api/rate-book/entries/${id}`, dto).pipe(map((body) => RateBookEntryRecordSchema.parse(body)));
  }

  deleteEntry(id: number, version: number): Observable<void> {
    return this.http.delete<void>(`/api/rate-book/entries/${id}`, { params: { version } });
  }

  createAdder(dto: CreateSiteAdder): Observable<SiteAdderRecord> {
    return this.http.post<SiteAdderRecord>('/api/rate-book/adders', dto);
  }

  updateAdder(id: number, dto: UpdateSiteAdder): Observable<SiteAdderRecord> {
    return this.http.patch<SiteAdderRecord>(`/api/rate-book/adders/${id}`, dto);
  }

  deleteAdder(id: number, version: number): Observable<void> {
    return this.http.delete<void>(`/api/rate-book/adders/${id}`, { params: { version } });
  }

  changes(page: number, pageSize: number): Observable<Page<RateBookChange>> {
    return this.http.get<Page<RateBookChange>>('/api/rate-book/changes', { params: new HttpParams({ fromObject: { page, pageSize } }) });
  }

  /** Imports entries from a CSV file; rows match entries by key, and nothing is imported if a row is wrong. */
  importCsv(file: File): Observable<RateBookImportResult> {
    const body = new FormData();
    body.append('file', file, file.name);
    return this.http.post<RateBookImportResult>('/api/rate-book/entries/import', body);
  }
}
