import { Router } from 'express';
import * as z from 'zod';
import { BoundedDateSchema, DayQuerySchema, PeriodQuerySchema, SpareSettingsSchema, TickPickLineSchema } from '@cc/shared';
import type { RouterDeps } from '../http/router-deps';
import { requireRole, requireUser, userOf } from '../http/require-user';
import { renderPickListPdf } from './pick-list-pdf';
import { periodToCsv } from './economics-csv';

const DaysQuerySchema = z
  .object({ from: BoundedDateSchema, to: BoundedDateSchema })
  .refine((q) => q.to >= q.from && Date.parse(q.to) - Date.parse(q.from) <= 92 * 86_400_000, { error: 'Choose a period of at most 93 days', path: ['to'] });

/** /api/economics: pick lists, day and period economics of the signed-in contractor's organisation. */
export function createEconomicsRouter({ services }: RouterDeps): Router {
  const { economics } = services;
  const router = Router();
  router.use(requireUser, requireRole('contractor'));

  router.get('/electricians', async (req, res) => {
    res.json(await economics.electricians(userOf(req)));
  });

  router.get('/days', async (req, res) => {
    const { from, to } = DaysQuerySchema.parse(req.query);
    res.json(await economics.plannedDays(userOf(req), from, to));
  });

  router.get('/pick-list', async (req, res) => {
    res.json(await economics.pickList(userOf(req), DayQuerySchema.parse(req.query)));
  });

  router.get('/pick-list.pdf', async (req, res) => {
    const user = userOf(req);
    const query = DayQuerySchema.parse(req.query);
    const list = await economics.pickList(user, query);
    const pdf = await renderPickListPdf(list, await economics.organisationName(user));
    res.type('application/pdf').attachment(`pick-list-${query.date}-${list.electrician.id}${query.siteVisitId ? `-visit-${query.siteVisitId}` : ''}.pdf`).send(pdf);
  });

  router.put('/pick-list/ticks', async (req, res) => {
    res.json(await economics.tick(userOf(req), TickPickLineSchema.parse(req.body ?? {})));
  });

  router.get('/spares', async (req, res) => {
    res.json(await economics.spares(userOf(req)));
  });

  router.put('/spares', async (req, res) => {
    res.json(await economics.saveSpares(userOf(req), SpareSettingsSchema.parse(req.body ?? {})));
  });

  router.get('/day', async (req, res) => {
    res.json(await economics.day(userOf(req), DayQuerySchema.parse(req.query)));
  });

  router.get('/period', async (req, res) => {
    res.json(await economics.period(userOf(req), PeriodQuerySchema.parse(req.query)));
  });

  router.get('/period.csv', async (req, res) => {
    const query = PeriodQuerySchema.parse(req.query);
    const period = await economics.period(userOf(req), query);
    res.type('text/csv').attachment(`day-economics-${query.from}-to-${query.to}.csv`).send(periodToCsv(period));
  });

  return router;
}
