import { Router } from 'express';
import { AutoPriceItemsSchema, BulkPriceItemsSchema, MarkOutOfScopeSchema, UpdatePricingVisitsSchema, UpdateSiteConditionsSchema } from '@cc/shared';
import type { RouterDeps } from '../http/router-deps';
import { requireUser, userOf } from '../http/require-user';
import { idParam } from '../http/params';

/** Bulk pricing, site conditions and the ballpark range of one request: /api/requests/:id/… */
export function createPricingRouter({ services }: RouterDeps): Router {
  const { pricing, ballpark } = services;
  const router = Router({ mergeParams: true });

  router.get('/pricing', requireUser, async (req, res) => {
    res.json(await pricing.view(userOf(req), idParam(req)));
  });

  router.patch('/pricing', requireUser, async (req, res) => {
    res.json(await pricing.bulkUpdate(userOf(req), idParam(req), BulkPriceItemsSchema.parse(req.body)));
  });

  router.post('/pricing/auto-price', requireUser, async (req, res) => {
    res.json(await pricing.autoPrice(userOf(req), idParam(req), AutoPriceItemsSchema.parse(req.body ?? {})));
  });

  router.post('/pricing/out-of-scope', requireUser, async (req, res) => {
    res.json(await pricing.markOutOfScope(userOf(req), idParam(req), MarkOutOfScopeSchema.parse(req.body)));
  });

  router.put('/pricing/visits', requireUser, async (req, res) => {
    res.json(await pricing.updateVisits(userOf(req), idParam(req), UpdatePricingVisitsSchema.parse(req.body).visits));
  });

  router.get('/site-conditions', requireUser, async (req, res) => {
    res.json(await ballpark.siteConditions(userOf(req), idParam(req)));
  });

  router.put('/site-conditions', requireUser, async (req, res) => {
    res.json(await ballpark.setSiteConditions(userOf(req), idParam(req), UpdateSiteConditionsSchema.parse(req.body).adderIds));
  });

  router.get('/ballpark', requireUser, async (req, res) => {
    res.json(await ballpark.ballpark(userOf(req), idParam(req)));
  });

  return router;
}
