import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { BookSuggestion, CalendarFeed, DayPlan, DayPlanSettings, Electrician, MoveVisit, MoveVisitResult, SetPropertyLocation, UpdateDayPlanSettings, WeekPlan } from '@cc/shared';
import { Observable } from 'rxjs';

/** The day plan of the contractor office: days, the week, moves, settings, locations, calendars. */
@Injectable({ providedIn: 'root' })
export class DayPlanApi {
  private readonly http = inject(HttpClient);

  day(date: string, electricianId: number): Observable<DayPlan> {
    return this.http.get<DayPlan>('/api/day-plan', { params: { date, electricianId } });
  }

  electricians(): Observable<Electrician[]> {
    return this.http.get<Electrician[]>('/api/day-plan/electricians');
  }

  week(start: string): Observable<WeekPlan> {
    return this.http.get<WeekPlan>('/api/day-plan/week', { params: { start } });
  }

  book(body: BookSuggestion): Observable<DayPlan> {
    return this.http.post<DayPlan>('/api/day-plan/book', body);
  }

  move(visitId: number, body: MoveVisit): Observable<MoveVisitResult> {
    return this.http.post<MoveVisitResult>(`/api/day-plan/visits/${visitId}/move`, body);
  }

  settings(): Observable<DayPlanSettings> {
    return this.http.get<DayPlanSettings>('/api/day-plan/settings');
  }

  saveSettings(body: UpdateDayPlanSettings): Observable<DayPlanSettings> {
    return this.http.put<DayPlanSettings>('/api/day-plan/settings', body);
  }

  setLocation(requestId: number, body: SetPropertyLocation): Observable<void> {
    return this.http.put<void>(`/api/day-plan/locations/${requestId}`, body);
  }

  renewFeed(electricianId: number): Observable<CalendarFeed> {
    return this.http.post<CalendarFeed>(`/api/day-plan/feeds/${electricianId}`, {});
  }

  /** The address of one visit's calendar file (a plain download link). */
  calendarFileUrl(visitId: number): string {
    return `/api/day-plan/visits/${visitId}.ics`;
  }
}
