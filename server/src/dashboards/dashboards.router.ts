import { Router } from 'express';
import { DashboardQuerySchema } from '@cc/shared';
import type { RouterDeps } from '../http/router-deps';
import { requireRole, requireUser, userOf } from '../http/require-user';

/** /api/dashboards: the agent's and the contractor's figures. */
export function createDashboardsRouter({ services }: RouterDeps): Router {
  const router = Router();
  router.use(requireUser);

  router.get('/agent', requireRole('agent', 'admin'), async (req, res) => {
    res.json(await services.dashboards.agent(userOf(req)));
  });

  router.get('/contractor', requireRole('contractor'), async (req, res) => {
    const { months } = DashboardQuerySchema.parse(req.query);
    res.json(await services.dashboards.contractor(userOf(req), months));
  });

  return router;
}
