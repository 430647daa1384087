import { Router } from 'express';
import type { csrfSync } from 'csrf-sync';
import type { PassportInstance } from '../auth/passport';
import type { Config } from '../config/config';
import type { Db } from '../db/knex';
import type { Services } from '../services';
import { createAdminRouter } from './admin.router';
import { createAuthRouter } from './auth.router';
import { createContractorsRouter } from './contractors.router';
import { createHealthRouter } from './health.router';
import { createInvitationsRouter } from './invitations.router';
import { createLineItemsRouter } from './line-items.router';
import { createPricingRouter } from './pricing.router';
import { createQuotesRouter } from './quotes.router';
import { createRateBookRouter } from './rate-book.router';
import { createReportsRouter } from './reports.router';
import { createRequestsRouter } from './requests.router';
import { createActivityRouter } from '../activity/activity.router';
import { createDashboardsRouter } from '../dashboards/dashboards.router';
import { createMailboxRouter, createNotificationsRouter } from '../notifications/notifications.router';

export interface RouterDeps {
  config: Config;
  db: Db;
  services: Services;
  passport: PassportInstance;
  csrf: ReturnType<typeof csrfSync>;
}

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
