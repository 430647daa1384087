import { Router, type Request } from 'express';
import { SendQuoteSchema } from '@cc/shared';
import type { RouterDeps } from '../http/router-deps';
import { requireUser, userOf } from '../http/require-user';
import { NotFoundError } from '../errors';
import { idParam } from '../http/params';

/** A quote version number from the path; anything else names no version, so 404. */
function versionParam(req: Request): number {
  const raw = req.params.version;
  const version = typeof raw === 'string' && /^\d{1,6}$/.test(raw) ? Number(raw) : 0;
  if (version < 1) throw new NotFoundError('No such quote version');
  return version;
}

/** Quote versions of one request: /api/requests/:id/quotes */
export function createQuotesRouter({ services }: RouterDeps): Router {
  const { quotes } = services;
  const router = Router({ mergeParams: true });
  router.use(requireUser);

  router.get('/', async (req, res) => {
    res.json(await quotes.list(userOf(req), idParam(req)));
  });

  router.post('/', async (req, res) => {
    res.status(201).json(await quotes.send(userOf(req), idParam(req), SendQuoteSchema.parse(req.body ?? {})));
  });

  router.get('/current', async (req, res) => {
    res.json(await quotes.current(userOf(req), idParam(req)));
  });

  router.get('/:version.pdf', async (req, res) => {
    const { fileName, pdf } = await quotes.pdf(userOf(req), idParam(req), versionParam(req));
    res.type('application/pdf').attachment(fileName).send(pdf);
  });

  router.get('/:version', async (req, res) => {
    res.json(await quotes.get(userOf(req), idParam(req), versionParam(req)));
  });

  return router;
}
