import { Router } from 'express';
import type { RouterDeps } from '../http/router-deps';
import { requireUser, userOf } from '../http/require-user';
import { idParam } from '../http/params';

/** The proof side of one request at a glance: /api/requests/:id/work */
export function createWorkRouter({ services }: RouterDeps): Router {
  const { work, letters } = services;
  const router = Router({ mergeParams: true });
  router.use(requireUser);

  router.get('/', async (req, res) => {
    res.json(await work.overview(userOf(req), idParam(req)));
  });

  router.post('/resume', async (req, res) => {
    await letters.resume(userOf(req), idParam(req));
    res.json(await work.overview(userOf(req), idParam(req)));
  });

  return router;
}
