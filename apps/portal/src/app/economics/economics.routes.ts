import { Routes } from '@angular/router';
import { provideCharts, withDefaultRegisterables } from 'ng2-charts';
import { hasRole } from '../core/auth/has-role-guard';

/** Day economics (`/economics`): a planned day's pick list and earnings, and a week or month with its chart. */
export const economicsRoutes: Routes = [
  {
    path: '',
    title: 'Day economics · Closing Circuit',
    canActivate: [hasRole('contractor')],
    loadComponent: () => import('./day-page/day-page').then((m) => m.DayPage),
  },
  {
    path: 'period',
    title: 'Weeks and months · Closing Circuit',
    canActivate: [hasRole('contractor')],
    providers: [provideCharts(withDefaultRegisterables())],
    loadComponent: () => import('./period-page/period-page').then((m) => m.PeriodPage),
  },
];
