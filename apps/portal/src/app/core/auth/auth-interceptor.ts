import { HttpErrorResponse, HttpInterceptorFn, HttpRequest } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, map, Observable, of, switchMap, throwError } from 'rxjs';
import { Auth } from './auth';
import { HANDLES_UNAUTHORISED } from './handles-unauthorised';

const SAFE_METHODS = ['GET', 'HEAD', 'OPTIONS'];

/**
 * Sends the session's CSRF token with every request that changes something (fetching one first when
 * the visitor has none yet), and sends the visitor to sign in when the server answers 401.
 */
export const authInterceptor: HttpInterceptorFn = (req, next) => {
  const auth = inject(Auth);
  const router = inject(Router);

  const withToken = (token: string): HttpRequest<unknown> =>
    req.clone({ setHeaders: { 'x-csrf-token': token } });

  let sent: Observable<HttpRequest<unknown>>;
  if (SAFE_METHODS.includes(req.method)) {
    sent = of(req);
  } else {
    const token = auth.csrfToken();
    sent = token ? of(withToken(token)) : auth.fetchCsrfToken().pipe(map(withToken));
  }

  return sent.pipe(
    switchMap((request) => next(request)),
    catchError((err: unknown) => {
      if (err instanceof HttpErrorResponse && err.status === 401 && !req.context.get(HANDLES_UNAUTHORISED)) {
        auth.clear();
        if (!router.url.startsWith('/sign-in')) {
          void router.navigate(['/sign-in'], { queryParams: { returnUrl: router.url } });
        }
      }
      return throwError(() => err);
    }),
  );
};
