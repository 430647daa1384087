import { Router } from 'express';
import {
  AssignContractorSchema,
  CreateRepairRequestSchema,
  InvitePartySchema,
  RepairRequestListQuerySchema,
} from '@cc/shared';
import type { RouterDeps } from '../http/router-deps';
import { requireRole, requireUser, userOf } from '../http/require-user';
import { idParam } from '../http/params';
import { sendJsonText } from '../http/json-text';

export function createRequestsRouter({ services }: RouterDeps): Router {
  const { requests } = services;
  const router = Router();
  router.use(requireUser);

  router.get('/', async (req, res) => {
    sendJsonText(res, await requests.list(userOf(req), RepairRequestListQuerySchema.parse(req.query)));
  });

  router.post('/', requireRole('agent', 'admin'), async (req, res) => {
    res.status(201).json(await requests.create(userOf(req), CreateRepairRequestSchema.parse(req.body)));
  });

  router.get('/:id', async (req, res) => {
    res.json(await requests.get(userOf(req), idParam(req)));
  });

  router.post('/:id/parties', async (req, res) => {
    const id = idParam(req);
    res.status(201).json(await requests.inviteParty(userOf(req), id, InvitePartySchema.parse(req.body)));
  });

  router.put('/:id/contractor', async (req, res) => {
    const id = idParam(req);
    const { contractorOrganisationId } = AssignContractorSchema.parse(req.body);
    res.json(await requests.assignContractor(userOf(req), id, contractorOrganisationId));
  });

  return router;
}
