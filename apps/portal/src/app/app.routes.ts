import { Routes } from '@angular/router';
import { hasRole } from './core/auth/has-role-guard';
import { signedIn } from './core/auth/signed-in-guard';
import { letterVerificationRoutes } from './work/work.routes';

export const routes: Routes = [
  { path: '', pathMatch: 'full', redirectTo: 'requests' },
  {
    path: 'sign-in',
    title: 'Sign in · Closing Circuit',
    loadComponent: () => import('./auth/sign-in/sign-in').then((m) => m.SignIn),
  },
  {
    path: 'invite/:token',
    title: 'Invitation · Closing Circuit',
    loadComponent: () => import('./auth/accept-invitation/accept-invitation').then((m) => m.AcceptInvitation),
  },
  {
    path: 'unsubscribe/:token',
    title: 'Stop the daily digest · Closing Circuit',
    loadComponent: () => import('./notifications/unsubscribe/unsubscribe').then((m) => m.Unsubscribe),
  },
  ...letterVerificationRoutes,
  {
    path: 'dashboard',
    canActivate: [signedIn],
    loadChildren: () => import('./dashboards/dashboards.routes').then((m) => m.dashboardRoutes),
  },
  {
    path: 'mailbox',
    title: 'Development mailbox · Closing Circuit',
    canActivate: [signedIn, hasRole('admin')],
    loadComponent: () => import('./notifications/mailbox/mailbox').then((m) => m.Mailbox),
  },
  {
    path: 'requests',
    canActivate: [signedIn],
    loadChildren: () => import('./requests/requests.routes').then((m) => m.requestsRoutes),
  },
  {
    path: 'pricing',
    canActivate: [signedIn],
    loadChildren: () => import('./pricing/pricing.routes').then((m) => m.pricingRoutes),
  },
  {
    path: 'day-plan',
    canActivate: [signedIn],
    loadChildren: () => import('./day-plan/day-plan.routes').then((m) => m.dayPlanRoutes),
  },
  {
    path: 'rate-book',
    canActivate: [signedIn],
    loadChildren: () => import('./rate-book/rate-book.routes').then((m) => m.rateBookRoutes),
  },
  {
    path: 'economics',
    canActivate: [signedIn],
    loadChildren: () => import('./economics/economics.routes').then((m) => m.economicsRoutes),
  },
  {
    path: 'account',
    title: 'My account · Closing Circuit',
    canActivate: [signedIn],
    loadComponent: () => import('./account/my-account/my-account').then((m) => m.MyAccount),
  },
  {
    path: 'admin',
    title: 'People and organisations · Closing Circuit',
    canActivate: [signedIn, hasRole('admin')],
    loadComponent: () =>
      import('./admin/people-and-organisations/people-and-organisations').then((m) => m.PeopleAndOrganisations),
  },
  {
    path: 'not-for-your-role',
    title: 'Not part of your account · Closing Circuit',
    loadComponent: () => import('./not-for-role/not-for-role').then((m) => m.NotForRole),
  },
  {
    path: '**',
    title: 'Page not found · Closing Circuit',
    loadComponent: () => import('./not-found/not-found').then((m) => m.NotFound),
  },
];
