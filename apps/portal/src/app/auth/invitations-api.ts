import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { AcceptedInvitation, AcceptInvitation, Invitation } from '@cc/shared';
import { Observable } from 'rxjs';

/** Invitation links sent to the parties of a sale. */
@Injectable({ providedIn: 'root' })
export class InvitationsApi {
  private readonly http = inject(HttpClient);

  get(token: string): Observable<Invitation> {
    return this.http.get<Invitation>(`/api/invitations/${encodeURIComponent(token)}`);
  }

  /** New account: name and password. Already signed in as the invited e-mail: no body fields. */
  accept(token: string, dto: AcceptInvitation | Record<string, never>): Observable<AcceptedInvitation> {
    return this.http.post<AcceptedInvitation>(`/api/invitations/${encodeURIComponent(token)}/accept`, dto);
  }
}
