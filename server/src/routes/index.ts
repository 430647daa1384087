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
import { createCorrectionsRouter } from '../corrections/corrections.router';
import { createLettersRouter, createVerificationRouter } from '../letters/letters.router';
import { createVisitsRouter } from '../visits/visits.router';
import { createWorkRouter } from '../work/work.router';

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
  api.use('/requests/:id/visits', createVisitsRouter(deps));
  api.use('/requests/:id/work', createWorkRouter(deps));
  api.use('/requests/:id', createCorrectionsRouter(deps));
  api.use('/requests/:id', createLettersRouter(deps));
  api.use('/verify', createVerificationRouter(deps));
  api.use('/requests/:id', createPricingRouter(deps));
  api.use('/requests', createRequestsRouter(deps));
  api.use('/admin', createAdminRouter(deps));
  api.use('/contractors', createContractorsRouter(deps));
  api.use('/rate-book', createRateBookRouter(deps));
  return api;
}
