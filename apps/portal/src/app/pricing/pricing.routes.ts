import { Routes } from '@angular/router';
import { hasRole } from '../core/auth/has-role-guard';

/** The contractor's job queue (`/pricing`). */
export const pricingRoutes: Routes = [
  {
    path: '',
    title: 'Job queue · Closing Circuit',
    canActivate: [hasRole('contractor')],
    loadComponent: () => import('./pricing-queue/pricing-queue').then((m) => m.PricingQueue),
  },
];
