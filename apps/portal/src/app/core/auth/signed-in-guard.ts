import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import { Auth } from './auth';

/** Lets signed-in people through; others go to the sign-in page and come back afterwards. */
export const signedIn: CanActivateFn = (_route, state) => {
  const auth = inject(Auth);
  if (auth.isSignedIn()) return true;
  return inject(Router).createUrlTree(['/sign-in'], { queryParams: { returnUrl: state.url } });
};
