import { Router } from 'express';
import { CreateOrganisationSchema, CreateUserSchema, PageQuerySchema } from '@cc/shared';
import type { RouterDeps } from '../http/router-deps';
import { requireRole } from '../http/require-user';

export function createAdminRouter({ services }: RouterDeps): Router {
  const router = Router();
  router.use(requireRole('admin'));

  router.get('/organisations', async (req, res) => {
    const { page, pageSize } = PageQuerySchema.parse(req.query);
    res.json(await services.admin.listOrganisations(page, pageSize));
  });

  router.post('/organisations', async (req, res) => {
    res.status(201).json(await services.admin.createOrganisation(CreateOrganisationSchema.parse(req.body)));
  });

  router.get('/users', async (req, res) => {
    const { page, pageSize } = PageQuerySchema.parse(req.query);
    res.json(await services.admin.listUsers(page, pageSize));
  });

  router.post('/users', async (req, res) => {
    res.status(201).json(await services.admin.createUser(CreateUserSchema.parse(req.body)));
  });

  return router;
}
