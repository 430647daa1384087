import { Routes } from '@angular/router';
import { hasRole } from '../core/auth/has-role-guard';
import { signedIn } from '../core/auth/signed-in-guard';

/** The contractor's job queue (`/pricing`). */
export const pricingRoutes: Routes = [
  {
    path: '',
    title: 'Job queue · Closing Circuit',
    canActivate: [hasRole('contractor')],
    loadComponent: () => import('./pricing-queue/pricing-queue').then((m) => m.PricingQueue),
  },
];

/**
 * Pages of one request, as full paths beside the request routes: its bulk pricing and its quote
 * versions. Each page loads lazily; only these few lines are in the first download.
 */
export const requestPricingRoutes: Routes = [
  {
    path: 'requests/:id/pricing',
    title: 'Price the request · Closing Circuit',
    canActivate: [signedIn, hasRole('contractor', 'admin')],
    loadComponent: () => import('./bulk-pricing/bulk-pricing').then((m) => m.BulkPricing),
  },
  {
    path: 'requests/:id/quotes',
    title: 'Quote · Closing Circuit',
    canActivate: [signedIn],
    loadComponent: () => import('../quotes/quote-view/quote-view').then((m) => m.QuoteView),
  },
  {
    path: 'requests/:id/approval',
    title: 'Approval and payment · Closing Circuit',
    canActivate: [signedIn],
    loadComponent: () => import('../approval/approval-page/approval-page').then((m) => m.ApprovalPage),
  },
  {
    path: 'requests/:id/quotes/:version',
    title: 'Quote · Closing Circuit',
    canActivate: [signedIn],
    loadComponent: () => import('../quotes/quote-view/quote-view').then((m) => m.QuoteView),
  },
];
