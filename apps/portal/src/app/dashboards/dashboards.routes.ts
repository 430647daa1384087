import { Routes } from '@angular/router';
import { provideCharts, withDefaultRegisterables } from 'ng2-charts';
import { hasRole } from '../core/auth/has-role-guard';

/** The dashboards, loaded (with the chart library) only when opened. */
export const dashboardRoutes: Routes = [
  {
    path: '',
    title: 'Dashboard · Closing Circuit',
    canActivate: [hasRole('agent', 'admin', 'contractor')],
    providers: [provideCharts(withDefaultRegisterables())],
    loadComponent: () => import('./dashboard-page/dashboard-page').then((m) => m.DashboardPage),
  },
];
