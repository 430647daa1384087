import { Routes } from '@angular/router';

/** The public verification of a completion letter, which needs no sign-in. (A request's visits and proof pages are under requests/:id: requests.routes.ts.) */
export const letterVerificationRoutes: Routes = [
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
