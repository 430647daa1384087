import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import { Role } from '@cc/shared';
import { Auth } from './auth';

/**
 * Hides pages a role has no use for. A convenience only: the server decides what each role may do.
 */
export function hasRole(...roles: Role[]): CanActivateFn {
  return () => {
    const role = inject(Auth).role();
    if (role && roles.includes(role)) return true;
    return inject(Router).createUrlTree(['/requests']);
  };
}
