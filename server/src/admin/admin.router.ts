import { Router } from 'express';
import { CreateOrganisationSchema, CreateUserSchema, PageQuerySchema, SetUserActiveSchema, UpdateUserSchema } from '@cc/shared';
import { idParam } from '../http/params';
import type { RouterDeps } from '../http/router-deps';
import { requireRole, userOf } from '../http/require-user';

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

  router.put('/organisations/:id', async (req, res) => {
    res.json(await services.admin.updateOrganisation(idParam(req), CreateOrganisationSchema.parse(req.body)));
  });

  router.get('/users', async (req, res) => {
    const { page, pageSize } = PageQuerySchema.parse(req.query);
    res.json(await services.admin.listUsers(page, pageSize));
  });

  router.post('/users', async (req, res) => {
    res.status(201).json(await services.admin.createUser(CreateUserSchema.parse(req.body)));
  });

  router.patch('/users/:id', async (req, res) => {
    res.json(await services.admin.updateUser(idParam(req), UpdateUserSchema.parse(req.body)));
  });

  router.put('/users/:id/active', async (req, res) => {
    res.json(await services.admin.setUserActive(userOf(req), idParam(req), SetUserActiveSchema.parse(req.body).isActive));
  });

  router.post('/users/:id/password-reset', async (req, res) => {
    res.json(await services.admin.resetPassword(idParam(req)));
  });

  return router;
}
