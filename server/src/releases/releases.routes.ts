import { Router } from 'express';
import { requestIdOf } from '../audit/audit.service.js';
import { requireRole } from '../auth/require-role.js';
import type { AppDependencies } from '../app.js';
import { actorOfRequest } from '../runs/actor.js';
import { runIdParams } from '../runs/runs.schemas.js';
import { validate } from '../shared/validate.js';
import { contentStoreOf } from '../store/store-of-settings.js';
import { deliverRelease, releaseCsv } from './release-delivery.js';
import { createReleaseSender } from './release-mailer.js';
import { listReleasesQuery, releaseBody, releaseIdParams } from './releases.schemas.js';
import { listReleases, releaseRun, type ReleaseContext } from './releases.service.js';

/** Releasing a reviewed run to its distribution list, and the record of releases. */
export function releasesRoutes({ settings, sequelize }: AppDependencies): Router {
  const router = Router();
  const store = contentStoreOf(settings);
  const send = createReleaseSender(settings.mail);
  const release = validate({ params: runIdParams, body: releaseBody });
  const list = validate({ query: listReleasesQuery });
  const byId = validate({ params: releaseIdParams });
  const context = (req: Parameters<typeof actorOfRequest>[0]): ReleaseContext => ({ sequelize, store, send, actor: actorOfRequest(req), requestId: requestIdOf(req) });

  router.post('/runs/:id/release', requireRole(), release, async (req, res) => {
    const { params, body } = release.of(req);
    res.status(201).json(await releaseRun(context(req), params.id, body));
  });
  router.get('/releases', requireRole(), list, async (req, res) => {
    res.json(await listReleases(list.of(req).query));
  });
  router.post('/releases/:id/resend', requireRole(), byId, async (req, res) => {
    res.json(await deliverRelease(context(req), byId.of(req).params.id));
  });
  router.get('/releases/:id/csv', requireRole(), byId, async (req, res) => {
    const csv = await releaseCsv({ store }, byId.of(req).params.id);
    res.attachment(csv.name).type('text/csv; charset=utf-8').setHeader('x-content-sha256', csv.sha256);
    res.send(csv.bytes);
  });
  return router;
}
