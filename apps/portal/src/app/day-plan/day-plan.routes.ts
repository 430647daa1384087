import { Routes } from '@angular/router';
import { hasRole } from '../core/auth/has-role-guard';

/** The contractor office's planning: one electrician's day, the week, and the settings (`/day-plan`). */
export const dayPlanRoutes: Routes = [
  {
    path: '',
    title: 'Day plan · Closing Circuit',
    canActivate: [hasRole('contractor')],
    loadComponent: () => import('./day-page/day-page').then((m) => m.DayPage),
  },
  {
    path: 'week',
    title: 'Week of visits · Closing Circuit',
    canActivate: [hasRole('contractor')],
    loadComponent: () => import('./week-page/week-page').then((m) => m.WeekPage),
  },
  {
    path: 'settings',
    title: 'Day-plan settings · Closing Circuit',
    canActivate: [hasRole('contractor')],
    loadComponent: () => import('./settings-page/settings-page').then((m) => m.SettingsPage),
  },
];
