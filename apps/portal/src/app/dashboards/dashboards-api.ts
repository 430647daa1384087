import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { AgentDashboard, ContractorDashboard } from '@cc/shared';
import { Observable } from 'rxjs';

@Injectable({ providedIn: 'root' })
export class DashboardsApi {
  private readonly http = inject(HttpClient);

  agent(): Observable<AgentDashboard> {
    return this.http.get<AgentDashboard>('/api/dashboards/agent');
  }

  contractor(months: number): Observable<ContractorDashboard> {
    return this.http.get<ContractorDashboard>('/api/dashboards/contractor', { params: new HttpParams().set('months', months) });
  }
}
