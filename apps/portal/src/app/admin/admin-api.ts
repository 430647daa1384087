import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { CreateOrganisation, CreateUser, Organisation, Page, User } from '@cc/shared';
import { Observable } from 'rxjs';
import { PageRequest } from '../core/http/paged-list';

/** The administrator's routes: organisations and user accounts. */
@Injectable({ providedIn: 'root' })
export class AdminApi {
  private readonly http = inject(HttpClient);

  organisations(request: PageRequest): Observable<Page<Organisation>> {
    return this.http.get<Page<Organisation>>('/api/admin/organisations', { params: pageParams(request) });
  }

  createOrganisation(dto: CreateOrganisation): Observable<Organisation> {
    return this.http.post<Organisation>('/api/admin/organisations', dto);
  }

  users(request: PageRequest): Observable<Page<User>> {
    return this.http.get<Page<User>>('/api/admin/users', { params: pageParams(request) });
  }

  createUser(dto: CreateUser): Observable<User> {
    return this.http.post<User>('/api/admin/users', dto);
  }
}

function pageParams({ page, pageSize }: PageRequest): HttpParams {
  return new HttpParams().set('page', page).set('pageSize', pageSize);
}
