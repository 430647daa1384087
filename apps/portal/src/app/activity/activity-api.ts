import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { ActivityEntry, ActivityKind, Page } from '@cc/shared';
import { Observable } from 'rxjs';

/** The activity timeline of a request. */
@Injectable({ providedIn: 'root' })
export class ActivityApi {
  private readonly http = inject(HttpClient);

  list(requestId: number, kinds: ActivityKind[], page: number, pageSize: number): Observable<Page<ActivityEntry>> {
    let params = new HttpParams().set('page', page).set('pageSize', pageSize);
    if (kinds.length) params = params.set('kind', kinds.join(','));
    return this.http.get<Page<ActivityEntry>>(`/api/requests/${requestId}/activity`, { params });
  }
}
