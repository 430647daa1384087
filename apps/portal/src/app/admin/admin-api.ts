import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { CreateOrganisation, CreateUser, Organisation, Page, PasswordReset, UpdateUser, User } from '@cc/shared';
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

  updateOrganisation(id: number, dto: CreateOrganisation): Observable<Organisation> {
    return this.http.put<Organisation>(`/api/admin/organisations/${id}`, dto);
  }

  updateUser(id: number, dto: UpdateUser): Observable<User> {
    return this.http.patch<User>(`/api/admin/users/${id}`, dto);
  }

  setUserActive(id: number, isActive: boolean): Observable<User> {
    return this.http.put<User>(`/api/admin/users/${id}/active`, { isActive });
  }

  resetPassword(id: number): Observable<PasswordReset> {
    return this.http.post<PasswordReset>(`/api/admin/users/${id}/password-reset`, {});
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
