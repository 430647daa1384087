import { Routes } from '@angular/router';
import { hasRole } from '../core/auth/has-role-guard';

/**
 * The request list, the new-request form, and every page of one request under `:id` (its detail,
 * the contractor's pricing, the quote versions, the seller's approval and payment, the visits and
 * proof). Each page loads lazily; the children read `:id` through input binding, inherited from
 * this parent (`paramsInheritanceStrategy: 'always'` in app.config.ts).
 */
export const requestsRoutes: Routes = [
  {
    path: '',
    title: 'Repair requests · Closing Circuit',
    loadComponent: () => import('./request-list/request-list').then((m) => m.RequestList),
  },
  {
    path: 'new',
    title: 'Start a repair request · Closing Circuit',
    canActivate: [hasRole('agent', 'admin')],
    loadComponent: () => import('./request-form/request-form').then((m) => m.RequestForm),
  },
  {
    path: ':id',
    children: [
      {
        path: '',
        title: 'Repair request · Closing Circuit',
        loadComponent: () => import('./request-detail/request-detail').then((m) => m.RequestDetail),
      },
      {
        path: 'pricing',
        title: 'Price the request · Closing Circuit',
        canActivate: [hasRole('contractor', 'admin')],
        loadComponent: () => import('../pricing/bulk-pricing/bulk-pricing').then((m) => m.BulkPricing),
      },
      {
        path: 'quotes',
        title: 'Quote · Closing Circuit',
        loadComponent: () => import('../quotes/quote-view/quote-view').then((m) => m.QuoteView),
      },
      {
        path: 'quotes/:version',
        title: 'Quote · Closing Circuit',
        loadComponent: () => import('../quotes/quote-view/quote-view').then((m) => m.QuoteView),
      },
      {
        path: 'approval',
        title: 'Approval and payment · Closing Circuit',
        loadComponent: () => import('../approval/approval-page/approval-page').then((m) => m.ApprovalPage),
      },
      {
        path: 'work',
        title: 'Visits and proof · Closing Circuit',
        loadComponent: () => import('../work/work-page/work-page').then((m) => m.WorkPage),
      },
      {
        path: 'work/items/:itemId',
        title: 'Record the outcome · Closing Circuit',
        canActivate: [hasRole('contractor')],
        loadComponent: () => import('../work/correction-form/correction-form').then((m) => m.CorrectionForm),
      },
    ],
  },
];
