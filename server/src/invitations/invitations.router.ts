import { Router } from 'express';
import { AcceptInvitationSchema } from '@cc/shared';
import type { RouterDeps } from '../http/router-deps';
import { signInAs } from '../auth/auth.router';

export function createInvitationsRouter(deps: RouterDeps): Router {
  const { invitations } = deps.services;
  const router = Router();

  router.get('/:token', async (req, res) => {
    res.json(await invitations.lookup(req.params.token));
  });

  router.post('/:token/accept', async (req, res) => {
    const hasBody = req.body && Object.keys(req.body).length > 0;
    const input = hasBody ? AcceptInvitationSchema.parse(req.body) : null;
    const { user, requestId } = await invitations.accept(req.params.token, req.user, input);
    res.json({ ...(await signInAs(req, user, deps)), requestId });
  });

  return router;
}
