import { Router } from 'express';
import { BookSiteVisitSchema, CancelSiteVisitSchema } from '@cc/shared';
import type { RouterDeps } from '../http/router-deps';
import { requireUser, userOf } from '../http/require-user';
import { idParam } from '../http/params';

/** Site visits of one request: /api/requests/:id/visits */
export function createVisitsRouter({ services }: RouterDeps): Router {
  const { visits } = services;
  const router = Router({ mergeParams: true });
  router.use(requireUser);

  router.get('/electricians', async (req, res) => {
    res.json(await visits.electricians(userOf(req), idParam(req)));
  });

  router.post('/', async (req, res) => {
    res.status(201).json(await visits.book(userOf(req), idParam(req), BookSiteVisitSchema.parse(req.body ?? {})));
  });

  router.post('/:visitId/start', async (req, res) => {
    res.json(await visits.start(userOf(req), idParam(req), idParam(req, 'visitId')));
  });

  router.post('/:visitId/finish', async (req, res) => {
    res.json(await visits.finish(userOf(req), idParam(req), idParam(req, 'visitId')));
  });

  router.post('/:visitId/cancel', async (req, res) => {
    res.json(await visits.cancel(userOf(req), idParam(req), idParam(req, 'visitId'), CancelSiteVisitSchema.parse(req.body ?? {})));
  });

  return router;
}
