import { Router, type Request } from 'express';
import { SendClosingInvoiceSchema } from '@cc/shared';
import type { RouterDeps } from '../http/router-deps';
import { requireUser, userOf } from '../http/require-user';
import { idParam } from '../http/params';
import { NotFoundError } from '../errors';

function invoiceIdParam(req: Request): number {
  const raw = req.params.invoiceId;
  if (typeof raw !== 'string' || !/^\d{1,9}$/.test(raw) || Number(raw) < 1) throw new NotFoundError('No such invoice');
  return Number(raw);
}

/** Invoices and receipts of one request: /api/requests/:id/invoices */
export function createInvoicesRouter({ services }: RouterDeps): Router {
  const { invoices } = services.sellerSide;
  const router = Router({ mergeParams: true });
  router.use(requireUser);

  router.get('/', async (req, res) => {
    res.json(await invoices.list(userOf(req), idParam(req)));
  });

  router.post('/', async (req, res) => {
    res.status(201).json(await invoices.issue(userOf(req), idParam(req)));
  });

  router.post('/:invoiceId/send', async (req, res) => {
    const user = userOf(req);
    await services.sellerSide.payments.sendClosingInvoice(user, idParam(req), invoiceIdParam(req), SendClosingInvoiceSchema.parse(req.body ?? {}));
    res.json(await services.sellerSide.approvals.view(user, idParam(req)));
  });

  router.get('/:invoiceId.pdf', async (req, res) => {
    const { fileName, pdf } = await invoices.pdf(userOf(req), idParam(req), invoiceIdParam(req));
    res.type('application/pdf').attachment(fileName).send(pdf);
  });

  return router;
}
