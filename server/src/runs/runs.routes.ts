import { Router } from 'express';
import { requestIdOf } from '../audit/audit.service.js';
import { requireRole } from '../auth/require-role.js';
import type { AppDependencies } from '../app.js';
import { validate } from '../shared/validate.js';
import { contentStoreOf } from '../store/store-of-settings.js';
import { actorOfRequest } from './actor.js';
import { rerunRun } from './rerun.service.js';
import { runCsv } from './run-csv.js';
import { listResults, securityMarketLine, securitySeries } from './run-results.service.js';
import { findRun } from './run-states.js';
import { getRunDetail, listRuns } from './runs-query.service.js';
import { listResultsQuery, listRunsQuery, rerunBody, runIdParams, seriesParams } from './runs.schemas.js';

/** Reading runs (list, detail, results, series, security market line, CSV) and rerunning them. */
export function runsRoutes({ settings, sequelize }: AppDependencies): Router {
  const router = Router();
  const store = contentStoreOf(settings);
  const list = validate({ query: listRunsQuery });
  const byId = validate({ params: runIdParams });
  const results = validate({ params: runIdParams, query: listResultsQuery });
  const series = validate({ params: seriesParams });
  const rerun = validate({ params: runIdParams, body: rerunBody });

  router.get('/runs', requireRole(), list, async (req, res) => {
    res.json(await listRuns(list.of(req).query));
  });
  router.get('/runs/:id', requireRole(), byId, async (req, res) => {
    res.json(await getRunDetail(store, byId.of(req).params.id));
  });
  router.get('/runs/:id/results', requireRole(), results, async (req, res) => {
    const { params, query } = results.of(req);
    res.json(await listResults(params.id, query));
  });
  router.get('/runs/:id/series/:security', requireRole(), series, async (req, res) => {
    const { id, security } = series.of(req).params;
    res.json(await securitySeries(id, security));
  });
  router.get('/runs/:id/sml', requireRole(), byId, async (req, res) => {
    res.json(await securityMarketLine(byId.of(req).params.id));
  });
  router.get('/runs/:id/csv', requireRole(), byId, async (req, res) => {
    const csv = await runCsv(await findRun(byId.of(req).params.id));
    res.attachment(csv.fileName).type('text/csv; charset=utf-8').setHeader('x-clino-fingerprint-sha256', csv.fingerprintSha256);
    res.send(Buffer.from(csv.csv, 'utf8'));
  });
  router.post('/runs/:id/rerun', requireRole(), rerun, async (req, res) => {
    const { params, body } = rerun.of(req);
    res.status(202).json(await rerunRun(sequelize, actorOfRequest(req), params.id, body.reason, requestIdOf(req)));
  });
  return router;
}
