import { Router } from 'express';
import { ConfirmItemsSchema, CreateLineItemSchema, MergeLineItemsSchema, SplitLineItemSchema, UpdateLineItemSchema, VersionQuerySchema } from '@cc/shared';
import type { RouterDeps } from '../http/router-deps';
import { requireUser, userOf } from '../http/require-user';
import { idParam } from '../http/params';
import { sendJsonText } from '../http/json-text';


/** Line items of one request: /api/requests/:id/items */
export function createLineItemsRouter({ services }: RouterDeps): Router {
  const { lineItems } = services;
  const router = Router({ mergeParams: true });
  router.use(requireUser);

  router.get('/', async (req, res) => {
    sendJsonText(res, await lineItems.list(userOf(req), idParam(req)));
  });

  router.post('/', async (req, res) => {
    res.status(201).json(await lineItems.add(userOf(req), idParam(req), CreateLineItemSchema.parse(req.body)));
  });

  router.post('/merge', async (req, res) => {
    res.json(await lineItems.merge(userOf(req), idParam(req), MergeLineItemsSchema.parse(req.body)));
  });

  router.post('/confirm', async (req, res) => {
    res.json(await lineItems.confirm(userOf(req), idParam(req), ConfirmItemsSchema.parse(req.body)));
  });

  router.patch('/:itemId', async (req, res) => {
    res.json(await lineItems.update(userOf(req), idParam(req), idParam(req, 'itemId'), UpdateLineItemSchema.parse(req.body)));
  });

  router.delete('/:itemId', async (req, res) => {
    const { version } = VersionQuerySchema.parse(req.query);
    await lineItems.remove(userOf(req), idParam(req), idParam(req, 'itemId'), version);
    res.status(204).end();
  });

  router.post('/:itemId/split', async (req, res) => {
    res.json(await lineItems.split(userOf(req), idParam(req), idParam(req, 'itemId'), SplitLineItemSchema.parse(req.body)));
  });

  return router;
}
