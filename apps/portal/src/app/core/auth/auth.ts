import { HttpClient, HttpContext } from '@angular/common/http';
import { computed, inject, Injectable, signal } from '@angular/core';
import type { ChangePassword, CurrentUser, FlowActor, PartyRole, Role, Session, SessionState, SignIn } from '@cc/shared';
// The flow table by its own path: the whole shared barrel (every zod schema) stays out of the first load.
import { actorsOnRequest } from '@cc/shared/requests/request-flow';
import { firstValueFrom, map, Observable, tap } from 'rxjs';
import { HANDLES_UNAUTHORISED } from './handles-unauthorised';

/** Who is signed in, and the CSRF token bound to their session. */
@Injectable({ providedIn: 'root' })
export class Auth {
  private readonly http = inject(HttpClient);
  private readonly userState = signal<CurrentUser | null>(null);
  private readonly csrfState = signal<string | null>(null);

  /** The signed-in person, or null. */
  readonly user = this.userState.asReadonly();
  /** The token to send as `x-csrf-token` on every request that changes something. */
  readonly csrfToken = this.csrfState.asReadonly();
  readonly isSignedIn = computed(() => this.userState() !== null);
  readonly role = computed<Role | null>(() => this.userState()?.role ?? null);

  /**
   * The parts the signed-in person plays on a request (flow actors: buyer's agent, contractor…), by
   * the shared flow table's rule; screens ask the table what these actors may do.
   */
  actorsOn(request: { myParts: readonly PartyRole[]; contractor: { id: number } | null }): FlowActor[] {
    const user = this.userState();
    return user ? actorsOnRequest(user, request) : [];
  }

  /**
   * Reads the current session at start-up. The server answers 200 with `user: null` for a visitor,
   * so a signed-out page load logs no failed request.
   */
  async loadMe(): Promise<void> {
    try {
      const state = await firstValueFrom(this.http.get<SessionState>('/api/auth/session'));
      this.userState.set(state.user);
      this.csrfState.set(state.csrfToken);
    } catch (err: unknown) {
      // The server is unreachable or failing: start signed out, pages will report their own errors.
      console.error('Could not read the session', err);
      this.clear();
    }
  }

  signIn(credentials: SignIn): Observable<CurrentUser> {
    return this.http
      .post<Session>('/api/auth/sign-in', credentials, {
        context: new HttpContext().set(HANDLES_UNAUTHORISED, true),
      })
      .pipe(
        tap((session) => this.useSession(session)),
        map((session) => session.user),
      );
  }

  signOut(): Observable<void> {
    return this.http.post<void>('/api/auth/sign-out', {}).pipe(tap(() => this.clear()));
  }

  changePassword(dto: ChangePassword): Observable<void> {
    return this.http.post<void>('/api/auth/password', dto);
  }

  /** Fetches a CSRF token for a visitor who is not signed in yet (sign-in, accepting an invitation). */
  fetchCsrfToken(): Observable<string> {
    return this.http.get<{ csrfToken: string }>('/api/auth/csrf').pipe(
      map((answer) => answer.csrfToken),
      tap((token) => this.csrfState.set(token)),
    );
  }

  /** Adopts a session answered by the server (sign-in, invitation acceptance, GET /me). */
  useSession(session: Session): void {
    this.userState.set(session.user);
    this.csrfState.set(session.csrfToken);
  }

  /** Forgets the session locally, e.g. after the server answered 401. */
  clear(): void {
    this.userState.set(null);
    this.csrfState.set(null);
  }
}
