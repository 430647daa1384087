import { Router } from 'express';
import { SignApprovalSchema } from '@cc/shared';
import type { RouterDeps } from '../http/router-deps';
import { requireUser, userOf } from '../http/require-user';
import { idParam } from '../http/params';
import { signingContextOf } from './signing-context';

/** The seller's decision on the quote: /api/requests/:id/approval */
export function createApprovalsRouter({ services }: RouterDeps): Router {
  const { approvals } = services.sellerSide;
  const router = Router({ mergeParams: true });
  router.use(requireUser);

  router.get('/', async (req, res) => {
    res.json(await approvals.view(userOf(req), idParam(req)));
  });

  router.post('/', async (req, res) => {
    res.status(201).json(await approvals.sign(userOf(req), idParam(req), SignApprovalSchema.parse(req.body ?? {}), signingContextOf(req)));
  });

  return router;
}
