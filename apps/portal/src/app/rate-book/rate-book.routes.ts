import { Routes } from '@angular/router';
import { hasRole } from '../core/auth/has-role-guard';

/** The contractor organisation's rate book (`/rate-book`). */
export const rateBookRoutes: Routes = [
  {
    path: '',
    title: 'Rate book · Closing Circuit',
    canActivate: [hasRole('contractor')],
    loadComponent: () => import('./rate-book-editor/rate-book-editor').then((m) => m.RateBookEditor),
  },
];
