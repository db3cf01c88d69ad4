import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { requestIdOf } from '../audit/audit.service.js';
import { requireRole } from '../auth/require-role.js';
import { actorOfRequest } from '../runs/actor.js';
import { validate } from '../shared/validate.js';
import { distributionListBody, listIdParams } from './distribution-lists.schemas.js';
import { createDistributionList, listDistributionLists, updateDistributionList } from './distribution-lists.service.js';

/** Who receives releases: read by those who release, kept by admins. */
export function distributionListsRoutes(sequelize: Sequelize): Router {
  const router = Router();
  const create = validate({ body: distributionListBody });
  const update = validate({ params: listIdParams, body: distributionListBody });

  router.get('/distribution-lists', requireRole(), async (_req, res) => {
    res.json({ items: await listDistributionLists() });
  });
  router.post('/distribution-lists', requireRole(), create, async (req, res) => {
    res.status(201).json(await createDistributionList(sequelize, actorOfRequest(req), create.of(req).body, requestIdOf(req)));
  });
  router.put('/distribution-lists/:id', requireRole(), update, async (req, res) => {
    const { params, body } = update.of(req);
    res.json(await updateDistributionList(sequelize, actorOfRequest(req), params.id, body, requestIdOf(req)));
  });
  return router;
}
