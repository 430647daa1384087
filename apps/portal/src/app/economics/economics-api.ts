import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { DayEconomics, Electrician, IntakePhoto, PeriodEconomics, PickList, SpareSettings, SpareSettingsView, VisitPrep } from '@cc/shared';
import { Observable } from 'rxjs';

export interface DayRef {
  date: string;
  electricianId: number;
  siteVisitId?: number | null;
}

export interface PlannedDay {
  date: string;
  electrician: Electrician;
  visitCount: number;
}

const dayParams = (day: DayRef) => {
  let params = new HttpParams().set('date', day.date).set('electricianId', day.electricianId);
  if (day.siteVisitId) params = params.set('siteVisitId', day.siteVisitId);
  return params;
};

/** The day economics API: pick lists, the day's and a period's earnings; intake photos and evidence of a request. */
@Injectable({ providedIn: 'root' })
export class EconomicsApi {
  private readonly http = inject(HttpClient);

  electricians(): Observable<Electrician[]> {
    return this.http.get<Electrician[]>('/api/economics/electricians');
  }

  plannedDays(from: string, to: string): Observable<PlannedDay[]> {
    return this.http.get<PlannedDay[]>('/api/economics/days', { params: new HttpParams().set('from', from).set('to', to) });
  }

  pickList(day: DayRef): Observable<PickList> {
    return this.http.get<PickList>('/api/economics/pick-list', { params: dayParams(day) });
  }

  pickListPdfPath(day: DayRef): string {
    return `/api/economics/pick-list.pdf?${dayParams(day).toString()}`;
  }

  tick(day: DayRef, lineKey: string, isTicked: boolean): Observable<PickList> {
    return this.http.put<PickList>('/api/economics/pick-list/ticks', { date: day.date, electricianId: day.electricianId, lineKey, isTicked });
  }

  spares(): Observable<SpareSettingsView> {
    return this.http.get<SpareSettingsView>('/api/economics/spares');
  }

  saveSpares(settings: SpareSettings): Observable<SpareSettingsView> {
    return this.http.put<SpareSettingsView>('/api/economics/spares', settings);
  }

  day(day: DayRef): Observable<DayEconomics> {
    return this.http.get<DayEconomics>('/api/economics/day', { params: dayParams(day) });
  }

  period(from: string, to: string): Observable<PeriodEconomics> {
    return this.http.get<PeriodEconomics>('/api/economics/period', { params: new HttpParams().set('from', from).set('to', to) });
  }

  periodCsvPath(from: string, to: string): string {
    return `/api/economics/period.csv?${new HttpParams().set('from', from).set('to', to).toString()}`;
  }

  visitPrep(requestId: number): Observable<VisitPrep> {
    return this.http.get<VisitPrep>(`/api/requests/${requestId}/visit-prep`);
  }

  addIntakePhotos(requestId: number, files: readonly File[], itemId: number | null, caption: string): Observable<IntakePhoto[]> {
    const body = new FormData();
    if (itemId !== null) body.append('itemId', String(itemId));
    body.append('caption', caption);
    for (const f of files) body.append('photo', f, f.name);
    return this.http.post<IntakePhoto[]>(`/api/requests/${requestId}/intake-photos`, body);
  }
}
