import { Router } from 'express';
import { requestIdOf } from '../audit/audit.service.js';
import { requireRole } from '../auth/require-role.js';
import type { AppDependencies } from '../app.js';
import { createRunRequestSchema, postFailureRequestSchema, postResultsRequestSchema } from '../contracts/ingest.schemas.js';
import { validate } from '../shared/validate.js';
import { contentStoreOf } from '../store/store-of-settings.js';
import { actorOfRequest } from './actor.js';
import { idempotencyKeyOf } from './idempotency.js';
import { createRun, markComputing, markFailed, type IngestContext } from './ingest.service.js';
import { postResults } from './results-ingest.service.js';
import { runIdParams } from './runs.schemas.js';

/**
 * The ingest protocol of machines (bearer token): create the run, upload missing inputs (see
 * inputs.routes.ts), mark it computing, then post its results (Idempotency-Key) or its failure.
 */
export function ingestRoutes({ settings, sequelize }: AppDependencies): Router {
  const router = Router();
  const store = contentStoreOf(settings);
  const create = validate({ body: createRunRequestSchema });
  const byId = validate({ params: runIdParams });
  const results = validate({ params: runIdParams, body: postResultsRequestSchema });
  const failure = validate({ params: runIdParams, body: postFailureRequestSchema });
  const context = (req: Parameters<typeof actorOfRequest>[0]): IngestContext => ({ sequelize, store, actor: actorOfRequest(req), requestId: requestIdOf(req) });

  router.post('/runs', requireRole(), create, async (req, res) => {
    const answer = await createRun(context(req), create.of(req).body, idempotencyKeyOf(req, false));
    res.status(answer.status).json(answer.body);
  });
  router.post('/runs/:id/computing', requireRole(), byId, async (req, res) => {
    res.json(await markComputing(context(req), byId.of(req).params.id));
  });
  router.post('/runs/:id/results', requireRole(), results, async (req, res) => {
    const { params, body } = results.of(req);
    const answer = await postResults(context(req), params.id, body, idempotencyKeyOf(req, true) as string);
    res.status(answer.status).json(answer.body);
  });
  router.post('/runs/:id/failure', requireRole(), failure, async (req, res) => {
    const { params, body } = failure.of(req);
    const answer = await markFailed(context(req), params.id, body, idempotencyKeyOf(req, false));
    res.status(answer.status).json(answer.body);
  });
  return router;
}
