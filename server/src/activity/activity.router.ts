import { Router } from 'express';
import { ActivityQuerySchema } from '@cc/shared';
import type { RouterDeps } from '../routes';
import { requireUser, userOf } from '../middleware/require-user';
import { idParam } from '../routes/params';

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
