import { Router } from 'express';
import type { AppDependencies } from '../app.js';
import { auditContextOf } from '../audit/audit.service.js';
import { requireRole } from '../auth/require-role.js';
import { validate } from '../shared/validate.js';
import { createPersonSchema, idParamsSchema, updatePersonSchema } from './people.schemas.js';
import { createPerson, listPeople, updatePerson } from './people.service.js';

/** GET/POST /api/people, PATCH /api/people/:id: the admin's people management. */
export function peopleRoutes({ settings, sequelize }: AppDependencies): Router {
  const router = Router();
  const rounds = settings.auth.passwordHashRounds;
  const createRequest = validate({ body: createPersonSchema });
  const updateRequest = validate({ params: idParamsSchema, body: updatePersonSchema });

  router.get('/people', requireRole(), async (_req, res) => {
    res.json({ items: await listPeople() });
  });

  router.post('/people', requireRole(), createRequest, async (req, res) => {
    res.status(201).json(await createPerson(sequelize, auditContextOf(req), createRequest.of(req).body, rounds));
  });

  router.patch('/people/:id', requireRole(), updateRequest, async (req, res) => {
    const { params, body } = updateRequest.of(req);
    res.json(await updatePerson(sequelize, auditContextOf(req), params.id, body, rounds));
  });

  return router;
}
