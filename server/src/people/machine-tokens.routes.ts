import { Router } from 'express';
import type { AppDependencies } from '../app.js';
import { auditContextOf } from '../audit/audit.service.js';
import { requireRole } from '../auth/require-role.js';
import { validate } from '../shared/validate.js';
import { idParamsSchema } from './people.schemas.js';
import { createMachineTokenSchema } from './machine-tokens.schemas.js';
import { createMachineToken, listMachineTokens, revokeMachineToken } from './machine-tokens.service.js';

/** GET/POST /api/machine-tokens, DELETE /api/machine-tokens/:id (revoke): the admin's token management. */
export function machineTokenRoutes({ sequelize }: AppDependencies): Router {
  const router = Router();
  const createRequest = validate({ body: createMachineTokenSchema });
  const revokeRequest = validate({ params: idParamsSchema });

  router.get('/machine-tokens', requireRole(), async (_req, res) => {
    res.json({ items: await listMachineTokens() });
  });

  router.post('/machine-tokens', requireRole(), createRequest, async (req, res) => {
    res.status(201).json(await createMachineToken(sequelize, auditContextOf(req), createRequest.of(req).body));
  });

  router.delete('/machine-tokens/:id', requireRole(), revokeRequest, async (req, res) => {
    res.json(await revokeMachineToken(sequelize, auditContextOf(req), revokeRequest.of(req).params.id));
  });

  return router;
}
