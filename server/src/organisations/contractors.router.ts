import { Router } from 'express';
import type { RouterDeps } from '../http/router-deps';
import { requireRole } from '../http/require-user';

/** The electrical contractors an agent can assign to a request. */
export function createContractorsRouter({ services }: RouterDeps): Router {
  const router = Router();
  router.get('/', requireRole('agent', 'admin'), async (_req, res) => {
    res.json(await services.repositories.organisations.listByKind('contractor'));
  });
  return router;
}
