import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import {
  AssignContractorSchema,
  CreateRepairRequest,
  InviteParty,
  Organisation,
  Page,
  RepairRequestDetail,
  RepairRequestListQuery,
  RepairRequestSummary,
} from '@cc/shared';
import type { z } from 'zod';
import { Observable } from 'rxjs';

export type AssignContractor = z.infer<typeof AssignContractorSchema>;

/** The repair-request routes of the API. */
@Injectable({ providedIn: 'root' })
export class RequestsApi {
  private readonly http = inject(HttpClient);

  list(query: RepairRequestListQuery): Observable<Page<RepairRequestSummary>> {
    let params = new HttpParams();
    for (const [key, value] of Object.entries(query)) {
      if (value !== undefined && value !== null && value !== '') params = params.set(key, String(value));
    }
    return this.http.get<Page<RepairRequestSummary>>('/api/requests', { params });
  }

  get(id: number): Observable<RepairRequestDetail> {
    return this.http.get<RepairRequestDetail>(`/api/requests/${id}`);
  }

  create(dto: CreateRepairRequest): Observable<RepairRequestDetail> {
    return this.http.post<RepairRequestDetail>('/api/requests', dto);
  }

  inviteParty(id: number, dto: InviteParty): Observable<RepairRequestDetail> {
    return this.http.post<RepairRequestDetail>(`/api/requests/${id}/parties`, dto);
  }

  assignContractor(id: number, dto: AssignContractor): Observable<RepairRequestDetail> {
    return this.http.put<RepairRequestDetail>(`/api/requests/${id}/contractor`, dto);
  }

  /** Contractor organisations an agent can choose from. */
  contractors(): Observable<Organisation[]> {
    return this.http.get<Organisation[]>('/api/contractors');
  }
}
