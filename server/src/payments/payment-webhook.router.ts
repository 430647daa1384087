import express, { Router } from 'express';
import type { ApiError } from '@cc/shared';
import type { Services } from '../services';
import { WebhookSignatureError } from './payments.service';

/**
 * The payment service's events: POST /api/payments/webhook. Mounted before the JSON parser, the
 * session and CSRF: the signature over the raw body is the only credential.
 */
export function createPaymentWebhookRouter(services: Services): Router {
  const router = Router();
  router.post('/', express.raw({ type: () => true, limit: '256kb' }), async (req, res) => {
    try {
      const body = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
      const outcome = await services.sellerSide.payments.handleEvent(body, req.headers['stripe-signature'] as string | undefined);
      res.json({ received: true, outcome });
    } catch (err) {
      if (!(err instanceof WebhookSignatureError)) throw err;
      res.status(400).json({ error: 'The event signature does not verify', details: [] } satisfies ApiError);
    }
  });
  return router;
}
