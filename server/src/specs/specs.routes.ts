import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { requestIdOf } from '../audit/audit.service.js';
import { requireRole } from '../auth/require-role.js';
import { actorOfRequest } from '../runs/actor.js';
import { validate } from '../shared/validate.js';
import { diffQuery, pushSpecBody, revisionParams, specNameParams } from './specs.schemas.js';
import { diffRevisions, getRevision, getSpec, listRevisions, listSpecs, pushSpec } from './specs.service.js';

/** Run specs on the server: list, read, revisions and their diffs, and pushes. */
export function specsRoutes(sequelize: Sequelize): Router {
  const router = Router();
  const byName = validate({ params: specNameParams });
  const byRevision = validate({ params: revisionParams });
  const diff = validate({ params: revisionParams, query: diffQuery });
  const push = validate({ body: pushSpecBody });

  router.get('/specs', requireRole(), async (_req, res) => {
    res.json({ items: await listSpecs() });
  });
  router.get('/specs/:name', requireRole(), byName, async (req, res) => {
    res.json(await getSpec(byName.of(req).params.name));
  });
  router.get('/specs/:name/revisions', requireRole(), byName, async (req, res) => {
    res.json({ items: await listRevisions(byName.of(req).params.name) });
  });
  router.get('/specs/:name/revisions/:number', requireRole(), byRevision, async (req, res) => {
    const { name, number } = byRevision.of(req).params;
    res.json(await getRevision(name, number));
  });
  router.get('/specs/:name/revisions/:number/diff', requireRole(), diff, async (req, res) => {
    const { params, query } = diff.of(req);
    res.json(await diffRevisions(params.name, params.number, query.against));
  });
  router.post('/specs', requireRole(), push, async (req, res) => {
    const { text, file } = push.of(req).body;
    const result = await pushSpec(sequelize, actorOfRequest(req), text, file ?? 'spec.yaml', requestIdOf(req));
    res.status(result.created ? 201 : 200).json(result);
  });
  return router;
}
