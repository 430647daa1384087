import { Router } from 'express';
import { CreateChangeOrderSchema, DecideChangeOrderSchema } from '@cc/shared';
import type { RouterDeps } from '../http/router-deps';
import { requireUser, userOf } from '../http/require-user';
import { idParam } from '../http/params';
import { signingContextOf } from '../approvals/signing-context';

/** Change orders of one request: /api/requests/:id/change-orders (answers with the approval page). */
export function createChangeOrdersRouter({ services }: RouterDeps): Router {
  const { changeOrders, approvals } = services.sellerSide;
  const router = Router({ mergeParams: true });
  router.use(requireUser);

  router.post('/', async (req, res) => {
    const user = userOf(req);
    await changeOrders.create(user, idParam(req), CreateChangeOrderSchema.parse(req.body ?? {}));
    res.status(201).json(await approvals.view(user, idParam(req)));
  });

  router.post('/:changeOrderId/decision', async (req, res) => {
    const user = userOf(req);
    await changeOrders.decide(user, idParam(req), idParam(req, 'changeOrderId'), DecideChangeOrderSchema.parse(req.body ?? {}), signingContextOf(req));
    res.json(await approvals.view(user, idParam(req)));
  });

  return router;
}
