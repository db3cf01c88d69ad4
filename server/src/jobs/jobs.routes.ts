import { Router } from 'express';
import { requestIdOf } from '../audit/audit.service.js';
import { requireRole } from '../auth/require-role.js';
import type { Sequelize } from 'sequelize';
import { actorOfRequest } from '../runs/actor.js';
import { validate } from '../shared/validate.js';
import { failJob, jobSpec } from './job-work.service.js';
import { claimBody, doneBody, failedBody, jobIdParams, listJobsQuery } from './jobs.schemas.js';
import { claimJob, finishJob, listJobs } from './jobs.service.js';

/** The job queue: workers claim a job with a lease, fetch its spec, and report it done or failed. */
export function jobsRoutes(sequelize: Sequelize): Router {
  const router = Router();
  const list = validate({ query: listJobsQuery });
  const claim = validate({ body: claimBody });
  const byId = validate({ params: jobIdParams });
  const done = validate({ params: jobIdParams, body: doneBody });
  const failed = validate({ params: jobIdParams, body: failedBody });

  router.get('/jobs', requireRole(), list, async (req, res) => {
    res.json(await listJobs(list.of(req).query));
  });
  router.post('/jobs/claim', requireRole(), claim, async (req, res) => {
    const job = await claimJob(sequelize, actorOfRequest(req), claim.of(req).body, requestIdOf(req));
    if (job) res.json(job);
    else res.status(204).end();
  });
  router.post('/jobs/:id/done', requireRole(), done, async (req, res) => {
    const { params, body } = done.of(req);
    res.json(await finishJob(sequelize, actorOfRequest(req), params.id, body.worker, 'done', body.outcome ?? null, requestIdOf(req)));
  });
  router.post('/jobs/:id/failed', requireRole(), failed, async (req, res) => {
    const { params, body } = failed.of(req);
    res.json(await failJob(sequelize, actorOfRequest(req), params.id, body, requestIdOf(req)));
  });
  router.get('/jobs/:id/spec', requireRole(), byId, async (req, res) => {
    res.json(await jobSpec(byId.of(req).params.id));
  });
  return router;
}
