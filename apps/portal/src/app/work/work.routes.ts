import { Routes } from '@angular/router';
import { hasRole } from '../core/auth/has-role-guard';
import { signedIn } from '../core/auth/signed-in-guard';

/**
 * The proof side of a request (visits, corrections, letter) as full paths beside the request routes,
 * and the public letter verification, which needs no sign-in.
 */
export const workRoutes: Routes = [
  {
    path: 'requests/:id/work',
    title: 'Visits and proof · Closing Circuit',
    canActivate: [signedIn],
    loadComponent: () => import('./work-page/work-page').then((m) => m.WorkPage),
  },
  {
    path: 'requests/:id/work/items/:itemId',
    title: 'Record the outcome · Closing Circuit',
    canActivate: [signedIn, hasRole('contractor')],
    loadComponent: () => import('./correction-form/correction-form').then((m) => m.CorrectionForm),
  },
  {
    path: 'verify',
    title: 'Verify a completion letter · Closing Circuit',
    loadComponent: () => import('./verify-letter/verify-letter').then((m) => m.VerifyLetter),
  },
  {
    path: 'verify/:code',
    title: 'Verify a completion letter · Closing Circuit',
    loadComponent: () => import('./verify-letter/verify-letter').then((m) => m.VerifyLetter),
  },
];
