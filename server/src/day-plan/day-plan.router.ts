import { Router } from 'express';
import { BookSuggestionSchema, DayPlanQuerySchema, MoveVisitSchema, SetPropertyLocationSchema, UpdateDayPlanSettingsSchema, WeekQuerySchema } from '@cc/shared';
import type { RouterDeps } from '../http/router-deps';
import { requireUser, userOf } from '../http/require-user';
import { idParam } from '../http/params';

/** The office's day plan: /api/day-plan */
export function createDayPlanRouter({ services }: RouterDeps): Router {
  const { dayPlan } = services;
  const router = Router();
  router.use(requireUser);

  router.get('/', async (req, res) => {
    const { date, electricianId } = DayPlanQuerySchema.parse(req.query);
    res.json(await dayPlan.day(userOf(req), date, electricianId));
  });

  router.get('/electricians', async (req, res) => {
    res.json(await dayPlan.electricians(userOf(req)));
  });

  router.get('/week', async (req, res) => {
    res.json(await dayPlan.week(userOf(req), WeekQuerySchema.parse(req.query).start));
  });

  router.post('/book', async (req, res) => {
    res.status(201).json(await dayPlan.bookSuggestion(userOf(req), BookSuggestionSchema.parse(req.body ?? {})));
  });

  router.post('/visits/:visitId/move', async (req, res) => {
    res.json(await dayPlan.move(userOf(req), idParam(req, 'visitId'), MoveVisitSchema.parse(req.body ?? {})));
  });

  router.get('/visits/:visitId.ics', async (req, res) => {
    const calendar = await dayPlan.visitCalendar(userOf(req), idParam(req, 'visitId'));
    res.type('text/calendar; charset=utf-8').attachment(`site-visit-${req.params.visitId}.ics`).send(calendar);
  });

  router.get('/settings', async (req, res) => {
    res.json(await dayPlan.settings(userOf(req)));
  });

  router.put('/settings', async (req, res) => {
    res.json(await dayPlan.saveSettings(userOf(req), UpdateDayPlanSettingsSchema.parse(req.body ?? {})));
  });

  router.put('/locations/:requestId', async (req, res) => {
    await dayPlan.setLocation(userOf(req), idParam(req, 'requestId'), SetPropertyLocationSchema.parse(req.body ?? {}));
    res.status(204).end();
  });

  router.post('/feeds/:electricianId', async (req, res) => {
    res.json(await dayPlan.renewFeed(userOf(req), idParam(req, 'electricianId')));
  });

  return router;
}

/** The subscribable calendar feeds: /api/calendar/:token.ics, no sign-in (the secret address is the key). */
export function createCalendarFeedRouter({ services }: RouterDeps): Router {
  const router = Router();
  router.get('/:token.ics', async (req, res) => {
    const calendar = await services.dayPlan.feed(String(req.params.token));
    res.type('text/calendar; charset=utf-8').set('Cache-Control', 'private, max-age=300').send(calendar);
  });
  return router;
}
