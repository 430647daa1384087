import { Router } from 'express';
import { ActivityQuerySchema } from '@cc/shared';
import type { RouterDeps } from '../http/router-deps';
import { requireUser, userOf } from '../http/require-user';
import { idParam } from '../http/params';

/** /api/requests/:id/activity: the request's timeline, newest first, filterable by kind. */
export function createActivityRouter({ services }: RouterDeps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser);

  router.get('/', async (req, res) => {
    const id = idParam(req);
    res.json(await services.activity.list(userOf(req), id, ActivityQuerySchema.parse(req.query)));
  });

  return router;
}
