import { Routes } from '@angular/router';
import { hasRole } from '../core/auth/has-role-guard';

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
    title: 'Repair request · Closing Circuit',
    loadComponent: () => import('./request-detail/request-detail').then((m) => m.RequestDetail),
  },
];
