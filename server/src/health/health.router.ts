import { Router } from 'express';
import type { RouterDeps } from '../http/router-deps';

export function createHealthRouter({ db }: RouterDeps): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    await db.raw('select 1');
    res.json({ ok: true });
  });
  return router;
}
