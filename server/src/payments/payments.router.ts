import { Router } from 'express';
import { CreateRefundSchema, RecordFundsSchema, StartPaymentSchema } from '@cc/shared';
import type { RouterDeps } from '../http/router-deps';
import { requireUser, userOf } from '../http/require-user';
import { idParam } from '../http/params';

/** Payments of one request: /api/requests/:id/payments */
export function createPaymentsRouter({ services }: RouterDeps): Router {
  const { payments, approvals } = services.sellerSide;
  const router = Router({ mergeParams: true });
  router.use(requireUser);

  /** Starts a card payment (answers with the payment page to go to) or an invoice payable at closing. */
  router.post('/', async (req, res) => {
    res.status(201).json(await payments.start(userOf(req), idParam(req), StartPaymentSchema.parse(req.body ?? {}), req.get('origin')));
  });

  router.post('/funds', async (req, res) => {
    const user = userOf(req);
    await payments.recordFunds(user, idParam(req), RecordFundsSchema.parse(req.body ?? {}));
    res.json(await approvals.view(user, idParam(req)));
  });

  router.post('/:paymentId/refunds', async (req, res) => {
    const user = userOf(req);
    await payments.refund(user, idParam(req), idParam(req, 'paymentId'), CreateRefundSchema.parse(req.body ?? {}));
    res.status(202).json(await approvals.view(user, idParam(req)));
  });

  return router;
}
