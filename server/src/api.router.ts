import { Router } from 'express';
import type { RouterDeps } from './http/router-deps';
import { createAdminRouter } from './admin/admin.router';
import { createAuthRouter } from './auth/auth.router';
import { createContractorsRouter } from './organisations/contractors.router';
import { createHealthRouter } from './health/health.router';
import { createInvitationsRouter } from './invitations/invitations.router';
import { createLineItemsRouter } from './intake/line-items.router';
import { createPricingRouter } from './pricing/pricing.router';
import { createQuotesRouter } from './quotes/quotes.router';
import { createRateBookRouter } from './rate-book/rate-book.router';
import { createReportsRouter } from './intake/reports.router';
import { createRequestsRouter } from './requests/requests.router';
import { createCorrectionsRouter } from './corrections/corrections.router';
import { createLettersRouter, createVerificationRouter } from './letters/letters.router';
import { createVisitsRouter } from './visits/visits.router';
import { createWorkRouter } from './work/work.router';
import { createActivityRouter } from './activity/activity.router';
import { createDashboardsRouter } from './dashboards/dashboards.router';
import { createMailboxRouter, createNotificationsRouter } from './notifications/notifications.router';

/** Mounts every API router under /api. CSRF protection covers every state-changing route. */
export function createApiRouter(deps: RouterDeps): Router {
  const api = Router();
  api.use(createHealthRouter(deps));
  api.use(deps.csrf.csrfSynchronisedProtection);
  api.use('/auth', createAuthRouter(deps));
  api.use('/invitations', createInvitationsRouter(deps));
  api.use('/requests/:id/reports', createReportsRouter(deps));
  api.use('/requests/:id/items', createLineItemsRouter(deps));
  api.use('/requests/:id/quotes', createQuotesRouter(deps));
  api.use('/requests/:id/visits', createVisitsRouter(deps));
  api.use('/requests/:id/work', createWorkRouter(deps));
  api.use('/requests/:id', createCorrectionsRouter(deps));
  api.use('/requests/:id', createLettersRouter(deps));
  api.use('/verify', createVerificationRouter(deps));
  api.use('/requests/:id/activity', createActivityRouter(deps));
  api.use('/requests/:id', createPricingRouter(deps));
  api.use('/requests', createRequestsRouter(deps));
  api.use('/admin', createAdminRouter(deps));
  api.use('/contractors', createContractorsRouter(deps));
  api.use('/rate-book', createRateBookRouter(deps));
  api.use('/notifications', createNotificationsRouter(deps));
  api.use('/mailbox', createMailboxRouter(deps));
  api.use('/dashboards', createDashboardsRouter(deps));
  return api;
}
