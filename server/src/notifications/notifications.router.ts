import { Router } from 'express';
import { MailboxQuerySchema, UpdatePreferencesSchema } from '@cc/shared';
import * as z from 'zod';
import type { RouterDeps } from '../http/router-deps';
import { requireRole, requireUser, userOf } from '../http/require-user';
import { NotFoundError } from '../errors';
import { idParam } from '../http/params';

const TokenSchema = z.string().min(1).max(100);

/** /api/notifications: a person's message preferences, and the digest's unsubscribe link (no sign-in). */
export function createNotificationsRouter({ services }: RouterDeps): Router {
  const { notifications } = services;
  const router = Router();

  router.get('/unsubscribe/:token', async (req, res) => {
    res.json(await notifications.unsubscribeLookup(TokenSchema.parse(req.params.token)));
  });

  router.post('/unsubscribe/:token', async (req, res) => {
    res.json(await notifications.unsubscribe(TokenSchema.parse(req.params.token)));
  });

  router.get('/preferences', requireUser, async (req, res) => {
    res.json(await notifications.preferencesOf(userOf(req)));
  });

  router.put('/preferences', requireUser, async (req, res) => {
    res.json(await notifications.updatePreferences(userOf(req), UpdatePreferencesSchema.parse(req.body)));
  });

  return router;
}

/** /api/mailbox: the development mailbox (administrators only, and only while mail goes to the local sink). */
export function createMailboxRouter({ services }: RouterDeps): Router {
  const router = Router();
  router.use(requireRole('admin'));
  router.use((_req, _res, next) => {
    if (!services.mailbox) throw new NotFoundError('The development mailbox is on only while e-mail goes to the local sink (no SMTP_HOST set).');
    next();
  });

  router.get('/', async (req, res) => {
    const { page, pageSize, to, requestId } = MailboxQuerySchema.parse(req.query);
    const [messages, outbox] = await Promise.all([services.mailbox!.list(page, pageSize, { to: to ?? null, requestId: requestId ?? null }), services.outbox.counts()]);
    res.json({ ...messages, outbox });
  });

  router.get('/:id', async (req, res) => {
    const mail = await services.mailbox!.find(idParam(req));
    if (!mail) throw new NotFoundError('No such message');
    res.json(mail);
  });

  return router;
}
