import { inject } from '@angular/core';
import { CanActivateFn, RedirectCommand, Router } from '@angular/router';
import type { Role } from '@cc/shared';
import { Auth } from './auth';

/** What the "not for your role" page is told: which page was asked for and whom it serves. */
export interface WrongRoleInfo {
  page: string;
  roles: Role[];
}

/**
 * Keeps pages to the roles that use them. Anyone else sees, at the same address, a page that says
 * whom it is for and links home; never a silent redirect. A convenience only: the server decides what
 * each role may do.
 */
export function hasRole(...roles: Role[]): CanActivateFn {
  return (route) => {
    const role = inject(Auth).role();
    if (role && roles.includes(role)) return true;
    const router = inject(Router);
    const title = typeof route.routeConfig?.title === 'string' ? route.routeConfig.title.replace(/ · Closing Circuit$/, '') : 'This page';
    const info: WrongRoleInfo = { page: title, roles };
    return new RedirectCommand(router.parseUrl('/not-for-your-role'), { skipLocationChange: true, info });
  };
}
